import { db, Quad } from "@/models";
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
  createdAt: q.createdAt.toISOString(),
});

export async function listQuads(ownerId: string): Promise<QuadView[]> {
  db();
  return (
    await Quad.findAll({
      where: { ownerId },
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

export async function createQuad(ownerId: string, input: unknown): Promise<QuadView> {
  const data = parseOrThrow(quadInput, input);
  db();
  return view(await Quad.create({ ...data, ownerId }));
}

export async function updateQuad(ownerId: string, id: number, input: unknown): Promise<QuadView> {
  const data = parseOrThrow(quadInput, input);
  const quad = await ownQuad(ownerId, id);
  return view(await quad.update(data));
}

export async function deleteQuad(ownerId: string, id: number): Promise<void> {
  await (await ownQuad(ownerId, id)).destroy();
}
