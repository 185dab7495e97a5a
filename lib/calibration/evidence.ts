import { medianOfSorted, sortedCopy } from "@/lib/stats";
import type { FirmwareFamily } from "@/models/FirmwareFamily";
import { fitLine } from "./least-squares";
import { sensitivityFromCurrentScaleSetting } from "./units";

// What a contribution's evidence implies the settings should be, so the claimed values can be
// checked against the measurements behind them. Pure functions: the submission handler stores the
// summary, the form shows the same figures while it is filled in.
//
// Every rule goes through the firmware family's unit definition
// (migrations/20261202000600-create-firmware-families.ts):
//   response 'proportional': the displayed reading grows with the setting (V/V, A/V);
//   response 'inverse':      the displayed reading shrinks as the setting grows (mV/V, mV/A).
// Settings are counts of the family's step; implied values here are exact, unrounded counts.

/** The family columns this file reads, so tests can pass plain objects. */
export type EvidenceUnits = Pick<
  FirmwareFamily,
  "voltageScaleResponse" | "currentScaleResponse" | "currentScaleUnit" | "currentScaleStep" | "currentOffsetUnit" | "currentOffsetStep"
>;
type Response = FirmwareFamily["voltageScaleResponse"];

/**
 * How far a claimed scale may sit from the value its evidence implies before the submission is
 * flagged for a moderator: 2 % of the implied value. Our own rule, in line with common practice
 * (a fly-and-recharge calibration is usually called done within a few per cent:
 * common practice, no source). It only flags; it never refuses.
 */
export const EVIDENCE_TOLERANCE = 0.02;
/**
 * An offset sits near zero, where 2 % of it means nothing, so it may also differ by up to 10 steps
 * (our own rule; the same floor lib/published/refresh.ts judges offset spreads against)...
 */
export const OFFSET_TOLERANCE_FLOOR_STEPS = 10;
/**
 * ...or by as much offset as moves the displayed current by 0.1 A, whichever is more: an OSD
 * usually shows current to 0.1 A (common practice, no source), so bench points read off it cannot
 * place the zero-current error closer than that. Without it a family counting its offset in
 * single mA would flag an honest bench fit for a 0.02 A wobble in the intercept.
 */
export const OFFSET_TOLERANCE_FLOOR_AMPS = 0.1;

/** The offset floor in steps for bench evidence taken at this scale: the larger of the two rules above. */
export function offsetFloorSteps(scaleUsed: number, units: EvidenceUnits): number {
  const perAmp = units.currentOffsetUnit === "mV" ? sensitivityFromCurrentScaleSetting(scaleUsed, units) : 1000; // offset unit per displayed amp
  return Math.max(OFFSET_TOLERANCE_FLOOR_STEPS, (OFFSET_TOLERANCE_FLOOR_AMPS * perAmp) / units.currentOffsetStep);
}

type VoltageReadingEvidence = { cells: number; reportedVolts: number; measuredVolts: number; measuredAt: string };
type VoltageCheckEvidence = { scaleUsed: number; readings: readonly VoltageReadingEvidence[] };
export type CycleEvidence = { scaleUsed: number; reportedMah: number; chargedMah: number; ratedMah: number; cells: number };
type BenchPointEvidence = { reportedAmps: number; measuredAmps: number };
export type BenchEvidence = { scaleUsed: number; offsetUsed: number; points: readonly BenchPointEvidence[] };

function scaleBy(response: Response, setting: number, readingRatio: number): number {
  // readingRatio = true quantity ÷ displayed quantity. A proportional setting must grow by that
  // ratio for the display to reach the truth; an inverse one must shrink by it.
  return response === "proportional" ? setting * readingRatio : setting / readingRatio;
}

/**
 * Voltage check with a multimeter (common practice, no source). The display shows
 * V_d = V_true × (ratio_set ÷ ratio_true), so
 *   proportional unit: new = old × measured ÷ reported;
 *   inverse unit:      new = old × reported ÷ measured.
 */
export function impliedVoltageScale(scaleUsed: number, reportedVolts: number, measuredVolts: number, response: Response): number {
  return scaleBy(response, scaleUsed, measuredVolts / reportedVolts);
}

/**
 * One fly-and-recharge cycle (common practice, no source): the charger's mAh is
 * the truth, the display's mAh the reading, so
 *   inverse unit (mV/A):      implied = scale × reported ÷ charged;
 *   proportional unit (A/V):  implied = scale × charged ÷ reported.
 * It assumes the offset is right: a cycle cannot tell a gain error from an offset error.
 */
export function impliedCurrentScaleFromCycle(cycle: Pick<CycleEvidence, "scaleUsed" | "reportedMah" | "chargedMah">, response: Response): number {
  return scaleBy(response, cycle.scaleUsed, cycle.chargedMah / cycle.reportedMah);
}

export type BenchImplication = {
  /** Fitted reported amps per measured amp: 1 when the scale is right. */
  gain: number;
  /** Fitted reported amps at zero measured current: 0 when the offset is right. */
  interceptAmps: number;
  r: number | null;
  n: number;
  impliedScale: number;
  impliedOffset: number;
};

/**
 * Bench points: reported current against the clamp meter's, fitted by least squares
 * (reported = gain × measured + intercept; lib/calibration/least-squares.ts).
 *
 * The algebra. The sensor puts out V = s·I + z millivolts (s: true sensitivity in mV/A, z: its
 * output at zero current). With the scale set to s_u and the offset to o_u the firmware displays
 *   offset in mV:  I_d = (V − o_u) / s_u             = (s/s_u)·I + (z − o_u)/s_u
 *   offset in mA:  I_d = V / s_u − o_u/1000          = (s/s_u)·I + z/s_u − o_u/1000
 * (the offset is subtracted, in the family's unit; seeders/demo/catalogue.ts offsetSetting reads the
 * offset the same way). Matching I_d = gain·I + intercept term by term:
 *   gain = s/s_u, so the scale moves like a reading ratio of 1/gain: an inverse (mV/A) setting
 *     becomes old × gain, a proportional (A/V) one old ÷ gain;
 *   offset in mV:  z = o_u + intercept·s_u              → new offset = o_u + intercept·s_u (mV);
 *   offset in mA:  z/s = (intercept + o_u/1000) / gain  → new offset = (1000·intercept + o_u) / gain (mA).
 * s_u in mV/A comes from the scale setting through the family's unit (units.ts). Offsets are
 * converted from and to steps of currentOffsetStep.
 */
export function impliedFromBench(bench: BenchEvidence, units: EvidenceUnits): BenchImplication {
  const fit = fitLine(bench.points.map((p) => [p.measuredAmps, p.reportedAmps] as const));
  const gain = fit.slope;
  const intercept = fit.intercept;
  const impliedScale = scaleBy(units.currentScaleResponse, bench.scaleUsed, 1 / gain);
  const offsetUsed = bench.offsetUsed * units.currentOffsetStep; // in mV or mA
  let offset: number;
  if (units.currentOffsetUnit === "mV") {
    const sensitivityUsed = sensitivityFromCurrentScaleSetting(bench.scaleUsed, units); // mV/A
    offset = offsetUsed + intercept * sensitivityUsed;
  } else {
    offset = (1000 * intercept + offsetUsed) / gain;
  }
  return { gain, interceptAmps: intercept, r: fit.r, n: fit.n, impliedScale, impliedOffset: offset / units.currentOffsetStep };
}

const median = (values: number[]) => medianOfSorted(sortedCopy(values))!;

type EvidenceQuantity = "voltage_scale" | "current_scale" | "current_offset";
type EvidenceSource = "voltage_check" | "recharge_cycles" | "bench_points";

export type EvidenceCheck = {
  quantity: EvidenceQuantity;
  source: EvidenceSource;
  claimed: number;
  implied: number;
  /** claimed − implied, in steps. */
  difference: number;
  /** (claimed − implied) ÷ |implied|; null when the implied value is 0. */
  relativeDifference: number | null;
  /** The largest |difference| in steps that is not flagged. */
  allowed: number;
  mismatch: boolean;
};

export type EvidenceSummary = {
  tolerance: number;
  /** The offset check's floor in steps (offsetFloorSteps), or the bare 10 steps without bench evidence. */
  offsetToleranceFloorSteps: number;
  voltage: { implied: number; perReading: number[] } | null;
  cycles: { implied: number; perCycle: number[] } | null;
  bench: BenchImplication | null;
  checks: EvidenceCheck[];
  mismatch: boolean;
};

export type EvidenceInput = {
  voltageScale: number | null;
  currentScale: number | null;
  currentOffset: number | null;
  voltageCheck: VoltageCheckEvidence | null;
  cycles: readonly CycleEvidence[];
  bench: BenchEvidence | null;
};

function check(quantity: EvidenceQuantity, source: EvidenceSource, claimed: number, implied: number, floorSteps = 0): EvidenceCheck {
  const difference = claimed - implied;
  const allowed = Math.max(EVIDENCE_TOLERANCE * Math.abs(implied), floorSteps);
  return {
    quantity,
    source,
    claimed,
    implied,
    difference,
    relativeDifference: implied === 0 ? null : difference / Math.abs(implied),
    allowed,
    mismatch: Math.abs(difference) > allowed,
  };
}

/**
 * What each piece of evidence implies, and whether the claimed values agree within tolerance.
 * Several readings or cycles are combined by their median: each is an independent estimate of the
 * same true setting, whichever scale was in force when it was taken, and the median is not pulled
 * by one misread. Evidence with no claimed value to compare (an offset left blank) is summarised
 * but not checked. Expects validated input (positive figures; lib/submissions/schema.ts).
 */
export function summariseEvidence(input: EvidenceInput, units: EvidenceUnits): EvidenceSummary {
  const checks: EvidenceCheck[] = [];
  let voltage: EvidenceSummary["voltage"] = null;
  if (input.voltageCheck && input.voltageCheck.readings.length > 0) {
    const { scaleUsed, readings } = input.voltageCheck;
    const perReading = readings.map((r) => impliedVoltageScale(scaleUsed, r.reportedVolts, r.measuredVolts, units.voltageScaleResponse));
    voltage = { implied: median(perReading), perReading };
    if (input.voltageScale != null) checks.push(check("voltage_scale", "voltage_check", input.voltageScale, voltage.implied));
  }
  let cycles: EvidenceSummary["cycles"] = null;
  if (input.cycles.length > 0) {
    const perCycle = input.cycles.map((c) => impliedCurrentScaleFromCycle(c, units.currentScaleResponse));
    cycles = { implied: median(perCycle), perCycle };
    if (input.currentScale != null) checks.push(check("current_scale", "recharge_cycles", input.currentScale, cycles.implied));
  }
  let bench: BenchImplication | null = null;
  let offsetFloor = OFFSET_TOLERANCE_FLOOR_STEPS;
  if (input.bench && input.bench.points.length >= 2) {
    bench = impliedFromBench(input.bench, units);
    offsetFloor = offsetFloorSteps(input.bench.scaleUsed, units);
    if (input.currentScale != null) checks.push(check("current_scale", "bench_points", input.currentScale, bench.impliedScale));
    if (input.currentOffset != null) checks.push(check("current_offset", "bench_points", input.currentOffset, bench.impliedOffset, offsetFloor));
  }
  return {
    tolerance: EVIDENCE_TOLERANCE,
    offsetToleranceFloorSteps: offsetFloor,
    voltage,
    cycles,
    bench,
    checks,
    mismatch: checks.some((c) => c.mismatch),
  };
}
