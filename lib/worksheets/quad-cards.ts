import { hardwareWorksheet } from "@/lib/calibration";
import { hardwareWorksheetInput } from "@/lib/calibration/hardware-figures";
import type { QuadView } from "@/lib/garage/quads";
import { BoardModel, BoardRevision, db, FirmwareFamily, Worksheet } from "@/models";
import { Op } from "sequelize";
import { quadHardware } from "./hardware";
import { quadWorksheetContext } from "./page-context";

// What a quad's card in the garage shows: its board and family by name, and the board's starting
// values for them: the published recommended setting, or where nothing is published yet the one
// the parts list implies (lib/calibration/hardware.ts), said as such. Also which quads and packs a
// published worksheet used, so their delete can say beforehand that it archives instead.

export type StartingValue = { setting: number; basis: "published" | "parts" } | null;

export type QuadCard = QuadView & {
  boardName: string | null;
  boardSlug: string | null;
  revisionLabel: string | null;
  familyName: string | null;
  starting: { voltageScale: StartingValue; currentScale: StartingValue };
};

async function cardOf(ownerId: string, quad: QuadView): Promise<QuadCard> {
  db();
  const [{ family, published }, revision, familyRow] = await Promise.all([
    quadWorksheetContext(ownerId, quad.id),
    quad.boardRevisionId
      ? (BoardRevision.findByPk(quad.boardRevisionId, { include: [{ model: BoardModel, as: "boardModel" }] }) as Promise<
          (BoardRevision & { boardModel: BoardModel }) | null
        >)
      : null,
    quad.firmwareFamilyId ? FirmwareFamily.findByPk(quad.firmwareFamilyId, { attributes: ["id", "name"] }) : null,
  ]);
  let parts: { voltage: number | null; current: number | null } = { voltage: null, current: null };
  if (family && revision && (published.voltageScale == null || published.currentScale == null)) {
    const result = hardwareWorksheet(hardwareWorksheetInput((await quadHardware(quad)).figures), family);
    if (result.ok) parts = { voltage: result.value.voltage?.nearestSetting ?? null, current: result.value.current?.nearestSetting ?? null };
  }
  const pick = (pub: number | null, fromParts: number | null): StartingValue =>
    pub != null ? { setting: pub, basis: "published" } : fromParts != null ? { setting: fromParts, basis: "parts" } : null;
  return {
    ...quad,
    boardName: revision?.boardModel.name ?? null,
    boardSlug: revision?.boardModel.slug ?? null,
    revisionLabel: revision?.label ?? null,
    familyName: familyRow?.name ?? null,
    starting: { voltageScale: pick(published.voltageScale, parts.voltage), currentScale: pick(published.currentScale, parts.current) },
  };
}

export const quadCards = (ownerId: string, quads: QuadView[]): Promise<QuadCard[]> => Promise.all(quads.map((q) => cardOf(ownerId, q)));

/** Ids of the caller's quads and packs that a published worksheet used: deleting those archives them. */
export async function publishedUse(ownerId: string): Promise<{ quadIds: Set<number>; packIds: Set<number> }> {
  db();
  const rows = await Worksheet.findAll({ where: { ownerId, submissionId: { [Op.ne]: null } }, attributes: ["quadId", "packId"] });
  return {
    quadIds: new Set(rows.map((r) => r.quadId)),
    packIds: new Set(rows.flatMap((r) => (r.packId == null ? [] : [r.packId]))),
  };
}
