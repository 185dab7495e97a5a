import { hardwareFiguresFromRevision, type HardwareFigures } from "@/lib/calibration/hardware-figures";
import type { QuadView } from "@/lib/garage/quads";
import { BoardModel, BoardRevision, db } from "@/models";

// The hardware worksheet's starting figures for a quad: its board revision's parts as the record
// has them (null = unknown), and the board's largest pack for the divider's headroom.

export type QuadHardware = {
  board: { name: string; revisionLabel: string } | null;
  figures: HardwareFigures;
};

export async function quadHardware(quad: Pick<QuadView, "boardRevisionId">): Promise<QuadHardware> {
  db();
  // By primary key, with the board model by its primary key: both indexed.
  const revision = quad.boardRevisionId
    ? ((await BoardRevision.findByPk(quad.boardRevisionId, { include: [{ model: BoardModel, as: "boardModel" }] })) as
        (BoardRevision & { boardModel: BoardModel }) | null)
    : null;
  return {
    board: revision ? { name: revision.boardModel.name, revisionLabel: revision.label } : null,
    figures: hardwareFiguresFromRevision(revision, revision?.boardModel.maxCells ?? null),
  };
}
