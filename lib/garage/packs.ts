import { packLandingGuide, type PackLandingGuide } from "@/lib/calibration";
import type { FieldIssue } from "@/lib/calibration";
import { db, Pack, PackCharge } from "@/models";
import { notYours, parseOrThrow } from "./owned";
import { chargeInput, packInput } from "./schemas";

// A builder's packs and their charge logs. The cycle count, the usable-capacity estimate and the
// landing figures (used-capacity alert, land soon / land now) come from lib/calibration/pack.ts; nothing is re-derived here.

type ChargeView = { id: number; chargedOn: string; chargedMah: number; restingVoltsPerCell: number | null; afterFullFlight: boolean };
export type PackView = {
  id: number;
  label: string;
  chemistry: Pack["chemistry"];
  cells: number;
  ratedMah: number;
  purchasedOn: string | null;
  charges: ChargeView[];
  /** packLandingGuide's result: null only if the stored pack itself no longer passes its rules. */
  landing: PackLandingGuide | null;
  notes: FieldIssue[];
};

const chargeView = (c: PackCharge): ChargeView => ({
  id: c.id,
  chargedOn: c.chargedOn,
  chargedMah: c.chargedMah,
  restingVoltsPerCell: c.restingVoltsPerCell,
  afterFullFlight: c.afterFullFlight,
});

function view(pack: Pack, charges: PackCharge[]): PackView {
  const result = packLandingGuide({
    chemistry: pack.chemistry,
    cells: pack.cells,
    ratedMah: pack.ratedMah,
    chargeLog: charges.map((c) => ({ chargedMah: c.chargedMah, afterFullFlight: c.afterFullFlight })),
  });
  return {
    id: pack.id,
    label: pack.label,
    chemistry: pack.chemistry,
    cells: pack.cells,
    ratedMah: pack.ratedMah,
    purchasedOn: pack.purchasedOn,
    charges: charges.map(chargeView),
    landing: result.ok ? result.value : null,
    notes: result.ok ? result.warnings : result.errors,
  };
}

const chargesOf = (packId: number) =>
  PackCharge.findAll({
    where: { packId },
    order: [
      ["chargedOn", "ASC"],
      ["id", "ASC"],
    ],
  });

async function ownPack(ownerId: string, id: number): Promise<Pack> {
  db();
  const pack = await Pack.findOne({ where: { id, ownerId } });
  if (!pack) throw notYours("pack");
  return pack;
}

export async function listPacks(ownerId: string): Promise<PackView[]> {
  db();
  const packs = await Pack.findAll({
    where: { ownerId },
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
  });
  return Promise.all(packs.map(async (p) => view(p, await chargesOf(p.id))));
}

export async function getPack(ownerId: string, id: number): Promise<PackView> {
  const pack = await ownPack(ownerId, id);
  return view(pack, await chargesOf(pack.id));
}

export async function createPack(ownerId: string, input: unknown): Promise<PackView> {
  const data = parseOrThrow(packInput, input);
  db();
  return view(await Pack.create({ ...data, ownerId }), []);
}

export async function updatePack(ownerId: string, id: number, input: unknown): Promise<PackView> {
  const data = parseOrThrow(packInput, input);
  const pack = await ownPack(ownerId, id);
  await pack.update(data);
  return view(pack, await chargesOf(pack.id));
}

export async function deletePack(ownerId: string, id: number): Promise<void> {
  await (await ownPack(ownerId, id)).destroy();
}

export async function addCharge(ownerId: string, packId: number, input: unknown): Promise<PackView> {
  const data = parseOrThrow(chargeInput, input);
  const pack = await ownPack(ownerId, packId);
  await PackCharge.create({ ...data, packId: pack.id });
  return view(pack, await chargesOf(pack.id));
}

export async function deleteCharge(ownerId: string, packId: number, chargeId: number): Promise<PackView> {
  const pack = await ownPack(ownerId, packId);
  const removed = await PackCharge.destroy({ where: { id: chargeId, packId: pack.id } });
  if (removed === 0) throw notYours("charge");
  return view(pack, await chargesOf(pack.id));
}
