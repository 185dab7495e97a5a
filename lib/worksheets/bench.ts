import type { Transaction } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { benchWorksheet, type FieldIssue } from "@/lib/calibration";
import { notYours, parseOrThrow } from "@/lib/garage/owned";
import { db, FirmwareFamily, Quad, Worksheet, WorksheetBenchPoint } from "@/models";
import { benchPointInput, benchStartInput, type BenchPointRow, type BenchSheetView } from "./bench-input";
import { assertOpen, checkSetting, entriesOf, ownSheet, publishedSetting, quadContext, takeBackLast } from "./shared";

// Server side of the bench worksheet: start it on a quad with the current scale and offset in
// force, add one clamp-meter point per request (fitted with every earlier point by
// lib/calibration/bench.ts and stored whole in a transaction, or refused with
// field-level errors and nothing stored), take back the last point, read it back computed.
// Publishing is lib/worksheets/publish.ts.

const rowOf = (p: WorksheetBenchPoint): BenchPointRow => ({ position: p.position, measuredAmps: p.measuredAmps, reportedAmps: p.reportedAmps });

/** Until two different clamp-meter currents are in, there is no line to fit yet: not an error, a next step. */
const fittable = (points: ReadonlyArray<{ measuredAmps: number }>) => new Set(points.map((p) => p.measuredAmps)).size >= 2;
const NEEDS_ANOTHER: FieldIssue = { field: "points", message: "Add a point at another steady throttle: a line needs two different clamp-meter currents" };
/**
 * Whether the display and the clamp meter can be the same current is judged on all points once
 * there are this many: any order of the same points then gets the same verdict, and a point is
 * never refused for what the points before it happened to fit.
 */
const POINTS_TO_JUDGE = 3;
const NEEDS_THIRD: FieldIssue = { field: "points", message: "Add a third point at another steady throttle: the fit is judged once there are three" };

const compute = (sheet: Worksheet, points: ReadonlyArray<{ measuredAmps: number; reportedAmps: number }>, family: FirmwareFamily) =>
  benchWorksheet(
    {
      scaleUsed: sheet.startingScale,
      offsetUsed: sheet.startingOffset!,
      points: points.map((p) => ({ measuredAmps: p.measuredAmps, reportedAmps: p.reportedAmps })),
    },
    family,
  );

async function ownBenchSheet(ownerId: string, id: number, transaction?: Transaction) {
  const sheet = await ownSheet(ownerId, id, transaction);
  if (sheet.kind !== "bench") throw notYours("bench worksheet");
  return sheet;
}

export async function startBenchWorksheet(ownerId: string, input: unknown): Promise<BenchSheetView> {
  const data = parseOrThrow(benchStartInput, input);
  const { quad, family, revision } = await quadContext(ownerId, data.quadId);
  const [publishedScale, publishedOffset] = await Promise.all([
    publishedSetting(revision.boardModel.slug, revision.label, family.slug, "currentScale"),
    publishedSetting(revision.boardModel.slug, revision.label, family.slug, "currentOffset"),
  ]);
  // the form offers the published values; the builder changes them when the quad runs others
  const scale = data.scaleUsed ?? publishedScale;
  const offset = data.offsetUsed ?? publishedOffset;
  const missing: Record<string, string[]> = {};
  if (scale == null) missing.scaleUsed = ["Nothing is published for this board and family yet: enter the current scale the quad runs with now"];
  if (offset == null) missing.offsetUsed = ["Enter the current offset the quad runs with now (often 0)"];
  if (scale == null || offset == null) throw badRequest(missing);
  checkSetting(scale, "The current scale in force", family, "currentScale", "scaleUsed");
  checkSetting(offset, "The current offset in force", family, "currentOffset", "offsetUsed");
  const sheet = await Worksheet.create({
    ownerId,
    quadId: quad.id,
    kind: "bench",
    firmwareFamilyId: family.id,
    ratedMah: null,
    cells: null,
    startingScale: scale,
    startingOffset: offset,
    startingSource: publishedScale != null && scale === publishedScale && offset === publishedOffset ? "published" : "own",
  });
  return getBenchWorksheet(ownerId, sheet.id);
}

export async function getBenchWorksheet(ownerId: string, id: number, transaction?: Transaction): Promise<BenchSheetView> {
  const sheet = await ownBenchSheet(ownerId, id, transaction);
  const [{ live, removed }, family, quad] = await Promise.all([
    entriesOf<WorksheetBenchPoint>(WorksheetBenchPoint, sheet.id, transaction),
    FirmwareFamily.findByPk(sheet.firmwareFamilyId, { transaction }),
    Quad.findByPk(sheet.quadId, { transaction }),
  ]);
  const result = fittable(live) ? compute(sheet, live, family!) : null;
  const notes = !result ? (live.length ? [NEEDS_ANOTHER] : []) : result.ok ? result.warnings : live.length < POINTS_TO_JUDGE ? [NEEDS_THIRD] : result.errors;
  return {
    kind: "bench",
    id: sheet.id,
    quadId: sheet.quadId,
    quadName: quad!.name,
    familyName: family!.name,
    scaleUsed: sheet.startingScale,
    offsetUsed: sheet.startingOffset!,
    startingSource: sheet.startingSource,
    points: live.map(rowOf),
    removed: removed.map((p) => ({ ...rowOf(p), removedAt: p.removedAt!.toISOString() })),
    result: result?.ok ? result.value : null,
    warnings: notes,
    submissionId: sheet.submissionId,
    createdAt: sheet.createdAt.toISOString(),
  };
}

/** Adds one point: fitted with every earlier one, stored whole or not at all. */
export async function addBenchPoint(ownerId: string, id: number, input: unknown): Promise<BenchSheetView> {
  const point = parseOrThrow(benchPointInput, input);
  await db().transaction(async (transaction) => {
    const sheet = await ownBenchSheet(ownerId, id, transaction);
    assertOpen(sheet, "points");
    const { live } = await entriesOf<WorksheetBenchPoint>(WorksheetBenchPoint, sheet.id, transaction);
    // the point passed its own limits (benchPointInput above); the fit of all points is judged on the worksheet (POINTS_TO_JUDGE)
    await WorksheetBenchPoint.create({ worksheetId: sheet.id, position: live.length, ...point }, { transaction });
    await sheet.update({ updatedAt: new Date() }, { transaction });
  });
  return getBenchWorksheet(ownerId, id);
}

/** Takes back the last point (kept, struck out); `position` must name it. */
export async function removeBenchPoint(ownerId: string, id: number, position: number): Promise<{ worksheet: BenchSheetView; removed: BenchPointRow }> {
  const row = await takeBackLast<WorksheetBenchPoint>((t) => ownBenchSheet(ownerId, id, t), WorksheetBenchPoint, position, "point");
  return { worksheet: await getBenchWorksheet(ownerId, id), removed: rowOf(row) };
}

/** The submission body (for a firmware version) a finished bench worksheet becomes: method "bench_clamp", the points as its evidence. */
export function benchSubmissionBody(view: BenchSheetView, quad: Quad, firmwareFamilyId: number) {
  const r = view.result;
  if (!r) {
    const why = view.warnings.filter((w) => w.field === "points" || w.field.startsWith("points.")).map((w) => w.message);
    throw badRequest({
      points: view.points.length >= POINTS_TO_JUDGE && why.length ? why : ["Add points at two or more different throttles before publishing"],
    });
  }
  return (opts: { firmwareVersion: string; notes?: string | null }) => ({
    boardRevisionId: quad.boardRevisionId,
    firmwareFamilyId,
    firmwareVersion: opts.firmwareVersion,
    sensingSource: "board_adc",
    method: "bench_clamp",
    voltageScale: null,
    currentScale: r.scaleRounding.recommended.setting,
    currentOffset: r.offset.setting,
    notes: opts.notes ?? `From a bench worksheet in the garage: ${view.points.length} clamp-meter points, r² ${r.fit.rSquared.toFixed(4)}.`,
    bench: {
      scaleUsed: view.scaleUsed,
      offsetUsed: view.offsetUsed,
      points: view.points.map((p) => ({ measuredAmps: p.measuredAmps, reportedAmps: p.reportedAmps })),
    },
  });
}
