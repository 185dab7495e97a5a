import { ApiError, badRequest } from "@/lib/http/errors";
import { rechargeWorksheet } from "@/lib/calibration";
import { notYours, parseOrThrow } from "@/lib/garage/owned";
import { startInput, stepInput, type RechargeStepRow, type WorksheetView } from "./recharge-input";
import { checkSetting, entriesOf, newEntryErrors, ownSheet, publishedSetting, quadContext, takeBackLast } from "./shared";
import { db, FirmwareFamily, Pack, Quad, Worksheet, WorksheetStep } from "@/models";

// Server side of the fly-and-recharge worksheet: start it on a quad, add one iteration per request
// (checked with every earlier one by lib/calibration/recharge.ts and stored whole in a
// transaction, or refused with field-level errors and nothing stored), read it back computed, and
// publish it as an ordinary pending submission (lib/worksheets/publish.ts, one transaction for every kind).

export async function startRechargeWorksheet(ownerId: string, input: unknown): Promise<WorksheetView> {
  const data = parseOrThrow(startInput, input);
  const { quad, family, revision } = await quadContext(ownerId, data.quadId);
  const published = await publishedSetting(revision.boardModel.slug, revision.label, family.slug, "currentScale");
  // the builder's own scale is kept; the form only offers the published one as a starting point
  const startingScale = data.startingScale ?? published;
  if (startingScale == null) {
    throw badRequest({ startingScale: ["Nothing is published for this board and family yet: enter the current scale the quad flies with now"] });
  }
  checkSetting(startingScale, "The starting current scale", family, "currentScale", "startingScale");
  if (data.packId != null && (await Pack.count({ where: { id: data.packId, ownerId } })) === 0) {
    throw badRequest({ packId: ["Choose one of your own packs, or type the figures"] });
  }
  const sheet = await Worksheet.create({
    ownerId,
    quadId: quad.id,
    kind: "fly_recharge",
    firmwareFamilyId: family.id,
    packId: data.packId,
    ratedMah: data.ratedMah,
    cells: data.cells,
    startingScale,
    startingSource: published != null && startingScale === published ? "published" : "own",
  });
  return getRechargeWorksheet(ownerId, sheet.id);
}

async function ownRechargeSheet(ownerId: string, id: number, transaction?: import("sequelize").Transaction) {
  const sheet = await ownSheet(ownerId, id, transaction);
  if (sheet.kind !== "fly_recharge") throw notYours("fly-and-recharge worksheet");
  return sheet;
}

const stepRow = (s: WorksheetStep): RechargeStepRow => ({
  position: s.position,
  scaleUsed: s.scaleUsed,
  reportedMah: s.reportedMah,
  chargedMah: s.chargedMah,
  fullyRecharged: s.fullyRecharged,
});

/** The worksheet's iterations in order: the live ones it counts, and the ones taken back. */
const stepsOf = (worksheetId: number, transaction?: import("sequelize").Transaction) => entriesOf<WorksheetStep>(WorksheetStep, worksheetId, transaction);

const compute = (
  sheet: Worksheet,
  steps: Array<{ scaleUsed: number; reportedMah: number; chargedMah: number; fullyRecharged: boolean }>,
  family: FirmwareFamily,
) =>
  rechargeWorksheet(
    {
      ratedMah: sheet.ratedMah!,
      cycles: steps.map((s) => ({ scaleUsed: s.scaleUsed, reportedMah: s.reportedMah, chargedMah: s.chargedMah, fullyRecharged: s.fullyRecharged })),
    },
    family,
  );

export async function getRechargeWorksheet(ownerId: string, id: number, transaction?: import("sequelize").Transaction): Promise<WorksheetView> {
  const sheet = await ownRechargeSheet(ownerId, id, transaction);
  const [{ live: steps, removed }, family, quad] = await Promise.all([
    stepsOf(sheet.id, transaction),
    FirmwareFamily.findByPk(sheet.firmwareFamilyId, { transaction }),
    Quad.findByPk(sheet.quadId, { transaction }),
  ]);
  const result = steps.length ? compute(sheet, steps, family!) : null;
  return {
    kind: "fly_recharge",
    id: sheet.id,
    quadId: sheet.quadId,
    quadName: quad!.name,
    familyName: family!.name,
    ratedMah: sheet.ratedMah!,
    cells: sheet.cells!,
    startingScale: sheet.startingScale,
    startingSource: sheet.startingSource,
    steps: steps.map(stepRow),
    removed: removed.map((s) => ({ ...stepRow(s), removedAt: s.removedAt!.toISOString() })),
    result: result?.ok ? result.value : null,
    warnings: result ? (result.ok ? result.warnings : result.errors) : [],
    submissionId: sheet.submissionId,
  };
}

/** Adds one iteration: judged with every earlier one, stored whole or not at all. */
export async function addRechargeStep(ownerId: string, id: number, input: unknown): Promise<WorksheetView> {
  const step = parseOrThrow(stepInput, input);
  const sequelize = db();
  await sequelize.transaction(async (transaction) => {
    const sheet = await ownRechargeSheet(ownerId, id, transaction);
    if (sheet.submissionId != null) throw new ApiError(409, "This worksheet is published; start a new one to fly more cycles.");
    const { live: steps } = await stepsOf(sheet.id, transaction);
    const family = (await FirmwareFamily.findByPk(sheet.firmwareFamilyId, { transaction }))!;
    const result = compute(sheet, [...steps, step], family);
    if (!result.ok) {
      // the new step's own problems under its field names; earlier steps were valid when stored
      throw badRequest(newEntryErrors(result.errors, `cycles.${steps.length}.`));
    }
    await WorksheetStep.create({ worksheetId: sheet.id, position: steps.length, ...step }, { transaction });
    await sheet.update({ updatedAt: new Date() }, { transaction });
  });
  return getRechargeWorksheet(ownerId, id);
}

/** Takes back the last iteration (mistyped at the field): kept with removed_at set, no longer counted. */
export async function removeRechargeStep(ownerId: string, id: number, position: number): Promise<{ worksheet: WorksheetView; removed: RechargeStepRow }> {
  const row = await takeBackLast<WorksheetStep>((t) => ownRechargeSheet(ownerId, id, t), WorksheetStep, position, "iteration");
  return { worksheet: await getRechargeWorksheet(ownerId, id), removed: stepRow(row) };
}

/** The submission body (for a firmware version) a finished fly-and-recharge worksheet becomes (lib/worksheets/publish.ts sends it). */
export function rechargeSubmissionBody(view: WorksheetView, quad: Quad, firmwareFamilyId: number) {
  const r = view.result;
  if (!r) throw badRequest({ steps: ["Fly and recharge at least one cycle before publishing"] });
  return (opts: { firmwareVersion: string; notes?: string | null }) => ({
    boardRevisionId: quad.boardRevisionId,
    firmwareFamilyId,
    firmwareVersion: opts.firmwareVersion,
    sensingSource: "board_adc",
    method: "fly_recharge",
    voltageScale: null,
    currentScale: r.recommendedSetting,
    currentOffset: null,
    notes: opts.notes ?? `From a fly-and-recharge worksheet in the garage: ${view.steps.length} cycles.`,
    // a cycle the builder marked as not fully recharged is not evidence
    cycles: view.steps
      .filter((s) => s.fullyRecharged)
      .map((s) => ({ scaleUsed: s.scaleUsed, reportedMah: s.reportedMah, chargedMah: s.chargedMah, ratedMah: view.ratedMah, cells: view.cells })),
  });
}
