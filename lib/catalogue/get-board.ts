import { fn, col } from "sequelize";
import { revisionDividerRatio, revisionSensitivityMvPerAmp } from "@/lib/calibration/units";
import { BoardAlias, BoardModel, BoardRevision, Manufacturer, Submission, db } from "@/models";
import type { CurrentSensorKind } from "@/lib/vocabulary";
import { boardFacts, type BoardFacts } from "./board-facts";

export type BoardRevisionDetail = {
  id: number;
  label: string;
  position: number;
  releasedOn: string | null;
  dividerTopOhms: number | null;
  dividerBottomOhms: number | null;
  /** Pack volts per ADC-pin volt, from the two resistors; null when either is unknown. */
  dividerRatio: number | null;
  currentSensor: CurrentSensorKind | null;
  shuntMilliohms: number | null;
  amplifierGain: number | null;
  hallMvPerAmp: number | null;
  /** Sensor output in mV per amp (shunt × gain, or the Hall figure); null when unknown. */
  sensitivityMvPerAmp: number | null;
  adcBits: number | null;
  adcReferenceVolts: number | null;
  notes: string | null;
  approvedCount: number;
};

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
    revisions: revisions.map((r) => ({
      id: r.id,
      label: r.label,
      position: r.position,
      releasedOn: r.releasedOn,
      dividerTopOhms: r.dividerTopOhms,
      dividerBottomOhms: r.dividerBottomOhms,
      dividerRatio: revisionDividerRatio(r),
      currentSensor: r.currentSensor,
      shuntMilliohms: r.shuntMilliohms,
      amplifierGain: r.amplifierGain,
      hallMvPerAmp: r.hallMvPerAmp,
      sensitivityMvPerAmp: revisionSensitivityMvPerAmp(r),
      adcBits: r.adcBits,
      adcReferenceVolts: r.adcReferenceVolts,
      notes: r.notes,
      approvedCount: approvedByRevision.get(r.id) ?? 0,
    })),
  };
}
