import { packLandingGuide, type PackLandingGuide } from "@/lib/calibration";
import type { FieldIssue } from "@/lib/calibration";
import { Op } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { db, Pack, PackCharge, Worksheet } from "@/models";
import { notYours, parseOrThrow } from "./owned";
import { chargeInputFor, packInput } from "./schemas";

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
  /** Set when a delete kept the pack because a published worksheet used it. */
  archivedAt: string | null;
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
    archivedAt: pack.archivedAt ? pack.archivedAt.toISOString() : null,
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

/** The caller's packs; archived ones only when asked for. */
export async function listPacks(ownerId: string, { archived = false }: { archived?: boolean } = {}): Promise<PackView[]> {
  db();
  const packs = await Pack.findAll({
    where: archived ? { ownerId } : { ownerId, archivedAt: null },
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
  const charges = await chargesOf(pack.id);
  // a purchase date after a logged charge would make that charge impossible: say so, change nothing
  const first = charges[0]?.chargedOn;
  if (data.purchasedOn && first && first < data.purchasedOn) {
    throw badRequest({ purchasedOn: [`The purchase date cannot be after the first logged charge (${first}); delete or fix that charge first`] });
  }
  await pack.update(data);
  return view(pack, charges);
}

export type RemovedRow = { archived: boolean };

/**
 * Deletes the pack and its charge log, or, when a published worksheet was started from it, only
 * archives it: hidden from the garage, kept with its log, the submission untouched.
 */
export async function deletePack(ownerId: string, id: number): Promise<RemovedRow> {
  const pack = await ownPack(ownerId, id);
  const published = await Worksheet.count({ where: { packId: pack.id, ownerId, submissionId: { [Op.ne]: null } } });
  if (published > 0) {
    if (!pack.archivedAt) await pack.update({ archivedAt: new Date() });
    return { archived: true };
  }
  await pack.destroy();
  return { archived: false };
}

export async function addCharge(ownerId: string, packId: number, input: unknown): Promise<PackView> {
  const pack = await ownPack(ownerId, packId);
  const { confirmOverCapacity: _confirmed, ...data } = parseOrThrow(chargeInputFor(pack), input);
  await PackCharge.create({ ...data, packId: pack.id });
  return view(pack, await chargesOf(pack.id));
}

/** Corrects one logged charge, under the same rules as a new one. */
export async function updateCharge(ownerId: string, packId: number, chargeId: number, input: unknown): Promise<PackView> {
  const pack = await ownPack(ownerId, packId);
  const { confirmOverCapacity: _confirmed, ...data } = parseOrThrow(chargeInputFor(pack), input);
  const charge = await PackCharge.findOne({ where: { id: chargeId, packId: pack.id } });
  if (!charge) throw notYours("charge");
  await charge.update(data);
  return view(pack, await chargesOf(pack.id));
}

export async function deleteCharge(ownerId: string, packId: number, chargeId: number): Promise<PackView> {
  const pack = await ownPack(ownerId, packId);
  const removed = await PackCharge.destroy({ where: { id: chargeId, packId: pack.id } });
  if (removed === 0) throw notYours("charge");
  return view(pack, await chargesOf(pack.id));
}
