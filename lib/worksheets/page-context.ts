import type { WorksheetFamily } from "@/lib/calibration";
import { getQuad, type QuadView } from "@/lib/garage/quads";
import { BoardModel, BoardRevision, db, familyUnitFieldsOf, FirmwareFamily } from "@/models";
import { publishedSetting } from "./shared";

// What a worksheet page needs about a quad: its family's setting rules as a plain object (for the
// browser), and the board's published recommended values as starting points.

export type QuadWorksheetContext = {
  quad: QuadView;
  family: WorksheetFamily | null;
  published: { voltageScale: number | null; currentScale: number | null; currentOffset: number | null };
};

export async function quadWorksheetContext(ownerId: string, quadId: number): Promise<QuadWorksheetContext> {
  const quad = await getQuad(ownerId, quadId);
  db();
  const row = quad.firmwareFamilyId ? await FirmwareFamily.findByPk(quad.firmwareFamilyId) : null;
  const revision = quad.boardRevisionId
    ? ((await BoardRevision.findByPk(quad.boardRevisionId, { include: [{ model: BoardModel, as: "boardModel" }] })) as BoardRevision & {
        boardModel: BoardModel;
      })
    : null;
  const lookup = (key: "voltageScale" | "currentScale" | "currentOffset") =>
    row && revision ? publishedSetting(revision.boardModel.slug, revision.label, row.slug, key) : Promise.resolve(null);
  const [voltageScale, currentScale, currentOffset] = await Promise.all([lookup("voltageScale"), lookup("currentScale"), lookup("currentOffset")]);
  const family: WorksheetFamily | null = row ? { name: row.name, ...familyUnitFieldsOf(row) } : null;
  return { quad, family, published: { voltageScale, currentScale, currentOffset } };
}
