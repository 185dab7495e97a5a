import { Op } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { BoardRevision, db, FirmwareFamily, Quad, Worksheet } from "@/models";
import { notYours, parseOrThrow } from "./owned";
import { quadInput } from "./schemas";

// A builder's quads. Every function takes the owner's id and never reaches another person's row.

export type QuadView = {
  id: number;
  name: string;
  boardRevisionId: number | null;
  firmwareFamilyId: number | null;
  firmwareVersion: string | null;
  esc: string | null;
  notes: string | null;
  /** Set when a delete kept the quad because one of its worksheets was published. */
  archivedAt: string | null;
  createdAt: string;
};

const view = (q: Quad): QuadView => ({
  id: q.id,
  name: q.name,
  boardRevisionId: q.boardRevisionId ?? null,
  firmwareFamilyId: q.firmwareFamilyId ?? null,
  firmwareVersion: q.firmwareVersion,
  esc: q.esc,
  notes: q.notes,
  archivedAt: q.archivedAt ? q.archivedAt.toISOString() : null,
  createdAt: q.createdAt.toISOString(),
});

/** The caller's quads; archived ones only when asked for. */
export async function listQuads(ownerId: string, { archived = false }: { archived?: boolean } = {}): Promise<QuadView[]> {
  db();
  return (
    await Quad.findAll({
      where: archived ? { ownerId } : { ownerId, archivedAt: null },
      order: [
        ["createdAt", "DESC"],
        ["id", "DESC"],
      ],
    })
  ).map(view);
}

async function ownQuad(ownerId: string, id: number): Promise<Quad> {
  db();
  const quad = await Quad.findOne({ where: { id, ownerId } });
  if (!quad) throw notYours("quad");
  return quad;
}

export const getQuad = async (ownerId: string, id: number): Promise<QuadView> => view(await ownQuad(ownerId, id));

/**
 * The quad's input, with its board revision and firmware family checked against the catalogue:
 * an id that names nothing is a 400 on that field (the foreign key would otherwise fail the insert).
 */
async function checkedInput(input: unknown) {
  const data = parseOrThrow(quadInput, input);
  db();
  const [revision, family] = await Promise.all([
    data.boardRevisionId == null ? true : BoardRevision.findByPk(data.boardRevisionId, { attributes: ["id"] }),
    data.firmwareFamilyId == null ? true : FirmwareFamily.findByPk(data.firmwareFamilyId, { attributes: ["id"] }),
  ]);
  const errors: Record<string, string[]> = {};
  if (!revision) errors.boardRevisionId = ["There is no such board revision: choose one from the list"];
  if (!family) errors.firmwareFamilyId = ["There is no such firmware family: choose one from the list"];
  if (Object.keys(errors).length) throw badRequest(errors);
  return data;
}

export async function createQuad(ownerId: string, input: unknown): Promise<QuadView> {
  const data = await checkedInput(input);
  return view(await Quad.create({ ...data, ownerId }));
}

export async function updateQuad(ownerId: string, id: number, input: unknown): Promise<QuadView> {
  const data = await checkedInput(input);
  const quad = await ownQuad(ownerId, id);
  return view(await quad.update(data));
}

/**
 * Deletes the quad with its worksheets, or, when one of them was published, only archives it:
 * hidden from the garage, its worksheets kept, the published submission untouched.
 */
export async function deleteQuad(ownerId: string, id: number): Promise<{ archived: boolean }> {
  const quad = await ownQuad(ownerId, id);
  const published = await Worksheet.count({ where: { quadId: quad.id, ownerId, submissionId: { [Op.ne]: null } } });
  if (published > 0) {
    if (!quad.archivedAt) await quad.update({ archivedAt: new Date() });
    return { archived: true };
  }
  await quad.destroy();
  return { archived: false };
}
