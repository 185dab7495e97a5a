import { fn, col } from "sequelize";
import { revisionDividerRatio, revisionSensitivityMvPerAmp } from "@/lib/calibration/units";
import { BoardAlias, BoardModel, BoardRevision, Manufacturer, Submission, db } from "@/models";
import { boardFacts, revisionDetail, type BoardFacts, type BoardRevisionDetail } from "./board-facts";

export type BoardDetail = { id: number } & BoardFacts & {
    description: string | null;
    manufacturer: { name: string; slug: string; website: string | null };
    aliases: string[];
    revisions: BoardRevisionDetail[];
  };

const SLUG_RE = /^[a-z0-9]+(-[a-z0-9]+)*$/;

/** One board by slug with everything its page shows, or null when there is no such board. */
export async function getBoardBySlug(slug: string): Promise<BoardDetail | null> {
  // a slug that could never be stored needs no database round trip
  if (slug.length > 120 || !SLUG_RE.test(slug)) return null;
  db();
  const board = await BoardModel.findOne({
    where: { slug },
    include: [
      { model: Manufacturer, as: "manufacturer" },
      { model: BoardAlias, as: "aliases" },
      { model: BoardRevision, as: "revisions" },
    ],
    order: [
      [{ model: BoardRevision, as: "revisions" }, "position", "ASC"],
      [{ model: BoardRevision, as: "revisions" }, "id", "ASC"],
      [{ model: BoardAlias, as: "aliases" }, "alias", "ASC"],
    ],
  });
  if (!board) return null;

  const revisions = board.revisions ?? [];
  const counts = revisions.length
    ? ((await Submission.findAll({
        attributes: ["boardRevisionId", [fn("count", col("id")), "approvedCount"]],
        where: { boardRevisionId: revisions.map((r) => r.id), status: "approved" },
        group: ["boardRevisionId"],
        raw: true,
      })) as unknown as { boardRevisionId: number; approvedCount: number | string }[])
    : [];
  const approvedByRevision = new Map(counts.map((c) => [c.boardRevisionId, Number(c.approvedCount)]));

  return {
    id: board.id,
    ...boardFacts(board),
    description: board.description,
    manufacturer: {
      name: board.manufacturer!.name,
      slug: board.manufacturer!.slug,
      website: board.manufacturer!.website,
    },
    aliases: (board.aliases ?? []).map((a) => a.alias),
    revisions: revisions.map((r) =>
      revisionDetail(r, {
        dividerRatio: revisionDividerRatio(r),
        sensitivityMvPerAmp: revisionSensitivityMvPerAmp(r),
        approvedCount: approvedByRevision.get(r.id) ?? 0,
      }),
    ),
  };
}
