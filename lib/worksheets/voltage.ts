import type { Transaction } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { voltageWorksheet } from "@/lib/calibration";
import { notYours, parseOrThrow } from "@/lib/garage/owned";
import { db, FirmwareFamily, Quad, Worksheet, WorksheetVoltageReading } from "@/models";
import { voltageReadingInput, voltageStartInput, type VoltageReadingRow, type VoltageSheetView } from "./voltage-input";
import { assertOpen, checkSetting, entriesOf, newEntryErrors, ownSheet, publishedSetting, quadContext, takeBackLast } from "./shared";

// Server side of the voltage worksheet: start it on a quad with the voltage scale in force, add
// one display/multimeter pair per request (judged with every earlier pair by
// lib/calibration/voltage.ts and stored whole in a transaction, or refused with
// field-level errors and nothing stored), take back the last pair, read it back computed.
// Publishing is lib/worksheets/publish.ts.

const rowOf = (r: WorksheetVoltageReading): VoltageReadingRow => ({
  position: r.position,
  cells: r.cells,
  reportedVolts: r.reportedVolts,
  measuredVolts: r.measuredVolts,
  measuredAt: r.measuredAt,
});

const compute = (scaleUsed: number, readings: ReadonlyArray<{ cells: number; reportedVolts: number; measuredVolts: number }>, family: FirmwareFamily) =>
  voltageWorksheet({ scaleUsed, readings: readings.map((r) => ({ cells: r.cells, reportedVolts: r.reportedVolts, measuredVolts: r.measuredVolts })) }, family);

async function ownVoltageSheet(ownerId: string, id: number, transaction?: Transaction) {
  const sheet = await ownSheet(ownerId, id, transaction);
  if (sheet.kind !== "voltage") throw notYours("voltage worksheet");
  return sheet;
}

export async function startVoltageWorksheet(ownerId: string, input: unknown): Promise<VoltageSheetView> {
  const data = parseOrThrow(voltageStartInput, input);
  const { quad, family, revision } = await quadContext(ownerId, data.quadId, "voltage-scale");
  const published = await publishedSetting(revision.boardModel.slug, revision.label, family.slug, "voltageScale");
  // the form offers the published value; the builder changes it when the quad runs another
  const scale = data.scaleUsed ?? published;
  if (scale == null) throw badRequest({ scaleUsed: ["Nothing is published for this board and family yet: enter the voltage scale the quad runs with now"] });
  checkSetting(scale, "The voltage scale in force", family, "voltageScale", "scaleUsed");
  const sheet = await Worksheet.create({
    ownerId,
    quadId: quad.id,
    kind: "voltage",
    firmwareFamilyId: family.id,
    ratedMah: null,
    cells: null,
    startingScale: scale,
    startingOffset: null,
    startingSource: published != null && scale === published ? "published" : "own",
  });
  return getVoltageWorksheet(ownerId, sheet.id);
}

export async function getVoltageWorksheet(ownerId: string, id: number, transaction?: Transaction): Promise<VoltageSheetView> {
  const sheet = await ownVoltageSheet(ownerId, id, transaction);
  const [{ live, removed }, family, quad] = await Promise.all([
    entriesOf<WorksheetVoltageReading>(WorksheetVoltageReading, sheet.id, transaction),
    FirmwareFamily.findByPk(sheet.firmwareFamilyId, { transaction }),
    Quad.findByPk(sheet.quadId, { transaction }),
  ]);
  const result = live.length ? compute(sheet.startingScale, live, family!) : null;
  return {
    kind: "voltage",
    id: sheet.id,
    quadId: sheet.quadId,
    quadName: quad!.name,
    familyName: family!.name,
    scaleUsed: sheet.startingScale,
    startingSource: sheet.startingSource,
    readings: live.map(rowOf),
    removed: removed.map((r) => ({ ...rowOf(r), removedAt: r.removedAt!.toISOString() })),
    result: result?.ok ? result.value : null,
    warnings: result ? (result.ok ? result.warnings : result.errors) : [],
    submissionId: sheet.submissionId,
    createdAt: sheet.createdAt.toISOString(),
  };
}

/** Adds one pair: judged with every earlier one, stored whole or not at all. */
export async function addVoltageReading(ownerId: string, id: number, input: unknown): Promise<VoltageSheetView> {
  const reading = parseOrThrow(voltageReadingInput, input);
  await db().transaction(async (transaction) => {
    const sheet = await ownVoltageSheet(ownerId, id, transaction); // locked: two phones cannot take one position
    assertOpen(sheet, "readings");
    const { live } = await entriesOf<WorksheetVoltageReading>(WorksheetVoltageReading, sheet.id, transaction);
    const family = (await FirmwareFamily.findByPk(sheet.firmwareFamilyId, { transaction }))!;
    const result = compute(sheet.startingScale, [...live, reading], family);
    if (!result.ok) throw badRequest(newEntryErrors(result.errors, `readings.${live.length}.`));
    await WorksheetVoltageReading.create({ worksheetId: sheet.id, position: live.length, ...reading }, { transaction });
    await sheet.update({ updatedAt: new Date() }, { transaction });
  });
  return getVoltageWorksheet(ownerId, id);
}

/** Takes back the last pair (kept, struck out); `position` must name it. */
export async function removeVoltageReading(
  ownerId: string,
  id: number,
  position: number,
): Promise<{ worksheet: VoltageSheetView; removed: VoltageReadingRow }> {
  const row = await takeBackLast<WorksheetVoltageReading>((t) => ownVoltageSheet(ownerId, id, t), WorksheetVoltageReading, position, "reading");
  return { worksheet: await getVoltageWorksheet(ownerId, id), removed: rowOf(row) };
}

/** The submission body (for a firmware version) a finished voltage worksheet becomes: method "multimeter", the pairs as its voltage check. */
export function voltageSubmissionBody(view: VoltageSheetView, quad: Quad, firmwareFamilyId: number) {
  const r = view.result;
  if (!r) throw badRequest({ readings: ["Add at least one pair of readings before publishing"] });
  return (opts: { firmwareVersion: string; notes?: string | null }) => ({
    boardRevisionId: quad.boardRevisionId,
    firmwareFamilyId,
    firmwareVersion: opts.firmwareVersion,
    sensingSource: "board_adc",
    method: "multimeter",
    // within tolerance the scale in force is the measured, verified value; otherwise the safe rounding
    voltageScale: r.answer,
    currentScale: null,
    currentOffset: null,
    notes: opts.notes ?? `From a voltage worksheet in the garage: ${view.readings.length} display/multimeter pairs.`,
    voltageCheck: {
      scaleUsed: view.scaleUsed,
      readings: view.readings.map((x) => ({ cells: x.cells, reportedVolts: x.reportedVolts, measuredVolts: x.measuredVolts, measuredAt: x.measuredAt })),
    },
  });
}
