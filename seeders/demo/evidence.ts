import { impliedCurrentScaleFromCycle } from "@/lib/calibration/evidence";
import { roundSetting, sensitivityFromCurrentScaleSetting } from "@/lib/calibration/units";
import { claimedValues } from "@/lib/submissions/claimed";
import { evidenceVerdict } from "@/lib/submissions/evidence-rows";
import type { SubmissionPayload } from "@/lib/submissions/schema";
import type { BoardKind } from "@/lib/vocabulary";
import type { FirmwareFamily } from "@/models/FirmwareFamily";
import type { DemoBoardModel, DemoTruth } from "./catalogue";
import type { DemoFirmwareFamily } from "./firmware-families";
import { createRng, type Rng } from "./random";
import type { DemoSubmission } from "./submissions";

// The measurements behind each demo submission: the voltage check, fly-and-recharge cycles or
// bench points its method calls for (lib/submissions/schema.ts METHOD_EVIDENCE), invented so that
// they imply the values the submission claims. The evidence summary and mismatch flag then come
// from lib/submissions/evidence-rows.ts evidenceVerdict, the function the create path calls.
//
// The deliberately wrong submissions (Anomaly) keep the measurements of the honest value they
// replaced, so their evidence disagrees with what they claim; a few honest ones were rounded or
// copied carelessly (CARELESS_SHARE) and disagree by a few per cent. Both show the mismatch flag
// in moderation.

export type DemoEvidence = Pick<SubmissionPayload, "voltageCheck" | "cycles" | "bench">;
type VoltageCheckEvidence = NonNullable<DemoEvidence["voltageCheck"]>;
type CycleEvidence = DemoEvidence["cycles"][number];
type BenchEvidence = NonNullable<DemoEvidence["bench"]>;

type Response = FirmwareFamily["voltageScaleResponse"];
type Targets = { voltageScale: number | null; currentScale: number | null; currentOffset: number | null };

/** Share of honest, measured submissions whose claim was rounded or copied off by 2.5–5 % (invented). */
const CARELESS_SHARE = 0.02;
/** Chance that a fly-and-recharge or bench submission with a voltage scale also sent a voltage check. */
const OPTIONAL_VOLTAGE_CHECK = 0.4;
/** Tries at fresh noise before an honest submission's evidence is made noise-free (see withinTolerance). */
const MAX_TRIES = 8;

/** Packs a pilot might fly on a board of this cell count (rated mAh; common practice, no source). */
function packSizes(cells: number): readonly number[] {
  if (cells <= 1) return [300, 450, 550];
  if (cells === 2) return [450, 550, 650];
  if (cells <= 4) return [650, 850, 1100, 1300, 1500, 1800];
  if (cells <= 6) return [1100, 1300, 1500, 1800, 2200];
  if (cells <= 8) return [1800, 2200, 3000, 4000, 5000];
  return [5000, 8000, 10000, 12000, 16000];
}

/** Highest clamp-meter current a props-off bench check reaches on this kind of board (invented). */
const BENCH_MAX_AMPS: Record<BoardKind, number> = { flight_controller: 20, aio: 20, esc_4in1: 40, pdb: 50, power_module: 40 };

/**
 * Displayed quantity ÷ true quantity with setting `used` in force when `truth` is the right one,
 * the inverse of lib/calibration/evidence.ts scaleBy: a proportional setting that is too big
 * reads high, an inverse one reads low.
 */
const displayFactor = (response: Response, used: number, truth: number) => (response === "proportional" ? used / truth : truth / used);

const round = (value: number, places: number) => Math.round(value * 10 ** places) / 10 ** places;
const clamp = (value: number, min: number, max: number) => Math.min(max, Math.max(min, value));

/** A board's cell count for a pack: the common sizes inside its range, else any in it. */
function cellsFor(board: DemoBoardModel, rng: Rng): number {
  const common = [4, 6].filter((c) => c >= board.minCells && c <= board.maxCells);
  return common.length > 0 && rng.chance(0.7) ? rng.pick(common) : rng.int(board.minCells, board.maxCells);
}

/**
 * The setting in force before calibrating: the firmware's default, or an earlier guess near the
 * target; anything that would make the display read outside 0.4–2.5 × the truth is replaced by
 * a guess, so every figure stays inside the schema's ratio limits (lib/submissions/limits.ts).
 */
function startingSetting(rng: Rng, response: Response, fallbackDefault: number, target: number, [min, max]: readonly [number, number]): number {
  const guess = () => clamp(roundSetting(target * (1 + 0.08 * rng.normal())), Math.max(min, 1), max);
  const start = rng.chance(0.55) ? fallbackDefault : guess();
  const f = displayFactor(response, start, target);
  return f >= 0.4 && f <= 2.5 ? start : guess();
}

function voltageCheck(rng: Rng, fam: DemoFirmwareFamily, board: DemoBoardModel, target: number, noise: number): VoltageCheckEvidence {
  const range = [fam.voltageScaleMin, fam.voltageScaleMax] as const;
  const scaleUsed = rng.chance(0.3) ? roundSetting(target) : startingSetting(rng, fam.voltageScaleResponse, fam.defaults.voltageScale, target, range);
  const cells = cellsFor(board, rng);
  const measuredAt = rng.pick(["main_lead", "balance_outer_pins"] as const);
  const readings = Array.from({ length: rng.int(1, 3) }, () => {
    // a pack between storage and full charge; multimeter and OSD both read to 0.01 V
    const measuredVolts = round(cells * (3.6 + 0.6 * rng.uniform()), 2);
    const truth = target * (1 + noise * 0.002 * rng.normal());
    const reportedVolts = round(measuredVolts * displayFactor(fam.voltageScaleResponse, scaleUsed, truth), 2);
    return { cells, reportedVolts, measuredVolts, measuredAt };
  });
  return { scaleUsed, readings };
}

/**
 * 3–5 fly-and-recharge cycles. Each cycle's scale is the one the previous cycle led to by the rule
 * new = old × reported ÷ charged (mV/A; the inverse for A/V), and the last is flown at `final`,
 * the value sent in, to confirm it. Packs (one or two of the pilot's, same cell count) are put back
 * 55–85 % of their rating.
 */
function cycles(rng: Rng, fam: DemoFirmwareFamily, board: DemoBoardModel, target: number, final: number, noise: number): CycleEvidence[] {
  const response = fam.currentScaleResponse;
  const count = rng.int(3, 5);
  const cells = cellsFor(board, rng);
  const packs = [rng.pick(packSizes(cells)), rng.pick(packSizes(cells))];
  let scaleUsed = startingSetting(rng, response, fam.defaults.currentScale, target, [fam.currentScaleMin, fam.currentScaleMax]);
  const out: CycleEvidence[] = [];
  for (let i = 0; i < count; i++) {
    const ratedMah = rng.pick(packs);
    const last = i === count - 1;
    const leadsToFinal = i === count - 2;
    // cycle-to-cycle scatter of about 1 % (charger efficiency, pack temperature: common practice, no source)
    const truth = leadsToFinal ? final : target * (1 + noise * 0.008 * rng.normal());
    let chargedMah = Math.round(ratedMah * (0.55 + 0.3 * rng.uniform()));
    let reportedMah = Math.round(chargedMah * displayFactor(response, scaleUsed, truth));
    if (leadsToFinal) [chargedMah, reportedMah] = closestFigures(response, scaleUsed, final, ratedMah, chargedMah);
    out.push({ scaleUsed, reportedMah, chargedMah, ratedMah, cells });
    if (!last)
      scaleUsed = leadsToFinal ? final : clamp(roundSetting(next(response, scaleUsed, reportedMah, chargedMah)), fam.currentScaleMin, fam.currentScaleMax);
  }
  return out;
}

/**
 * Whole-mAh figures for one cycle, charged 55–90 % of the rating and as near `charged` as can be,
 * whose rule leads as close to `final` as whole mAh allow (exactly, unless a small pack's mAh are
 * too coarse for a four-digit scale; then within one mAh's worth, as a pilot would round).
 */
function closestFigures(response: Response, scale: number, final: number, rated: number, charged: number): [number, number] {
  let best: [number, number] = [charged, Math.round(charged * displayFactor(response, scale, final))];
  let bestError = Infinity;
  const [lo, hi] = [Math.ceil(rated * 0.55), Math.floor(rated * 0.9)];
  for (let d = 0; d <= hi - lo; d++) {
    for (const c of [charged + d, charged - d]) {
      if (c < lo || c > hi) continue;
      const r0 = Math.round(c * displayFactor(response, scale, final));
      for (const r of [r0, r0 - 1, r0 + 1]) {
        const error = Math.abs(next(response, scale, r, c) - final);
        if (error < bestError) [best, bestError] = [[c, r], error];
      }
    }
    if (bestError < 0.5) break;
  }
  return best;
}

/** The setting a cycle leads to: new = old × reported ÷ charged for mV/A, the inverse for A/V. */
const next = (response: Response, scaleUsed: number, reportedMah: number, chargedMah: number) =>
  impliedCurrentScaleFromCycle({ scaleUsed, reportedMah, chargedMah }, response);

/**
 * 3–6 clamp-meter points, props off, from a couple of amps up to what the board's bench check
 * reaches; the display reads gain × measured + intercept, with the gain and intercept the
 * algebra of lib/calibration/evidence.ts impliedFromBench gives for the target scale and offset.
 */
function bench(rng: Rng, fam: DemoFirmwareFamily, kind: BoardKind, target: { scale: number; offset: number }, noise: number): BenchEvidence {
  const response = fam.currentScaleResponse;
  const scaleUsed = startingSetting(rng, response, fam.defaults.currentScale, target.scale, [fam.currentScaleMin, fam.currentScaleMax]);
  const offsetUsed = rng.chance(0.7)
    ? fam.defaults.currentOffset
    : clamp(roundSetting(target.offset + 5 * rng.normal()), fam.currentOffsetMin, fam.currentOffsetMax);
  const gain = displayFactor(response, scaleUsed, target.scale);
  const intercept =
    fam.currentOffsetUnit === "mV"
      ? ((target.offset - offsetUsed) * fam.currentOffsetStep) / sensitivityFromCurrentScaleSetting(scaleUsed, fam)
      : (target.offset * fam.currentOffsetStep * gain - offsetUsed * fam.currentOffsetStep) / 1000;
  const count = rng.int(3, 6);
  const top = BENCH_MAX_AMPS[kind] * (0.6 + 0.4 * rng.uniform());
  const points = Array.from({ length: count }, (_, i) => {
    const measuredAmps = round(1.5 + ((top - 1.5) * i) / (count - 1) + 0.3 * rng.uniform(), 2);
    const reportedAmps = round(gain * measuredAmps * (1 + noise * 0.001 * rng.normal()) + intercept + noise * 0.002 * rng.normal(), 2);
    return { reportedAmps, measuredAmps };
  });
  return { scaleUsed, offsetUsed, points };
}

/** The value the measurements really pointed at: the claim, unless a planted mistake replaced it. */
function honestTargets(s: DemoSubmission, truth: DemoTruth): Targets {
  const exact = truth.settings[s.familySlug];
  // a planted mistake sits more than 15 % off (seeders/demo/submissions.ts plantOutliers); honest scatter does not
  const planted = (claimed: number | null, right: number) => s.anomaly != null && claimed != null && Math.abs(claimed - right) / Math.abs(right) > 0.1;
  return {
    voltageScale: planted(s.voltageScale, exact.voltageScale) ? roundSetting(exact.voltageScale) : s.voltageScale,
    currentScale: planted(s.currentScale, exact.currentScale) ? roundSetting(exact.currentScale) : s.currentScale,
    currentOffset: s.currentOffset,
  };
}

type Context = { family: DemoFirmwareFamily; board: DemoBoardModel; truth: DemoTruth };

function draw(rng: Rng, s: DemoSubmission, ctx: Context, t: Targets, noise: number, withVoltage: boolean): DemoEvidence {
  const { family: fam, board, truth } = ctx;
  const voltage = withVoltage && t.voltageScale != null ? voltageCheck(rng, fam, board, t.voltageScale, noise) : null;
  if (s.method === "fly_recharge" && t.currentScale != null) {
    return { voltageCheck: voltage, cycles: cycles(rng, fam, board, t.currentScale, roundSetting(t.currentScale), noise), bench: null };
  }
  if (s.method === "bench_clamp" && t.currentScale != null) {
    // with no offset sent, the bench still shows the sensor's own zero error
    const offset = t.currentOffset ?? roundSetting(truth.settings[fam.slug].currentOffset);
    return { voltageCheck: voltage, cycles: [], bench: bench(rng, fam, board.kind, { scale: t.currentScale, offset }, noise) };
  }
  return { voltageCheck: voltage, cycles: [], bench: null };
}

/** What evidenceVerdict reads: the claimed values and the evidence (ids and labels are not read). */
export function demoPayload(s: DemoSubmission, evidence: DemoEvidence): SubmissionPayload {
  return {
    boardRevisionId: 1,
    firmwareFamilyId: 1,
    ...claimedValues(s),
    photoIds: [],
    ...evidence,
  };
}

export type EvidenceInput = {
  submissions: DemoSubmission[];
  families: readonly DemoFirmwareFamily[];
  boardModels: readonly DemoBoardModel[];
  truths: readonly DemoTruth[];
  seed: number;
};

/**
 * Fills in each submission's evidence, evidence summary and mismatch flag (in place, one seeded
 * rng of its own so the rest of the scenario is not reshuffled). Unverified submissions get none.
 */
export function attachDemoEvidence({ submissions, families, boardModels, truths, seed }: EvidenceInput): void {
  const rng = createRng(seed);
  const familyBySlug = new Map(families.map((f) => [f.slug, f]));
  const boardBySlug = new Map(boardModels.map((b) => [b.slug, b]));
  const truthByKey = new Map(truths.map((t) => [t.revisionKey, t]));

  for (const s of submissions) {
    s.evidence = { voltageCheck: null, cycles: [], bench: null };
    s.evidenceSummary = null;
    s.evidenceMismatch = false;
    if (s.method === "unverified") continue;
    const family = familyBySlug.get(s.familySlug)!;
    const ctx: Context = { family, board: boardBySlug.get(s.revisionKey.split("@")[0])!, truth: truthByKey.get(s.revisionKey)! };
    const targets = honestTargets(s, ctx.truth);
    const careless = s.anomaly == null && rng.chance(CARELESS_SHARE);
    if (careless) {
      const field = s.currentScale != null && s.method !== "multimeter" ? "currentScale" : "voltageScale";
      targets[field] = targets[field]! * (1 + (rng.chance(0.5) ? 1 : -1) * (0.025 + 0.025 * rng.uniform()));
    }
    // the planted value must be measured to be caught: a planted voltage scale brings its voltage check
    const plantedVoltage = s.anomaly != null && targets.voltageScale !== s.voltageScale;
    const withVoltage = s.method === "multimeter" || plantedVoltage || rng.chance(OPTIONAL_VOLTAGE_CHECK);
    const wanted = s.anomaly != null || careless;

    let evidence = draw(rng, s, ctx, targets, 1, withVoltage);
    let verdict = evidenceVerdict(demoPayload(s, evidence), family as unknown as FirmwareFamily);
    // an honest submission's noise can still land just past the tolerance: draw again, and in the
    // end take noise-free figures, so that only the intended ones are flagged
    for (let attempt = 1; !wanted && verdict.mismatch && attempt <= MAX_TRIES; attempt++) {
      evidence = draw(rng, s, ctx, targets, attempt === MAX_TRIES ? 0 : 1, withVoltage);
      verdict = evidenceVerdict(demoPayload(s, evidence), family as unknown as FirmwareFamily);
    }
    s.evidence = evidence;
    s.evidenceSummary = verdict.summary;
    s.evidenceMismatch = verdict.mismatch;
  }
}
