import { rSquared } from "simple-statistics";
import { z } from "zod";
import { impliedFromBench } from "./evidence";
import { roundSetting, sensitivityFromCurrentScaleSetting } from "./units";
import { formatFigure } from "@/lib/catalogue/format";
import { MAX_BENCH_AMPS, MAX_BENCH_POINTS, MAX_READING_RATIO, MIN_BENCH_POINTS, MIN_READING_RATIO, MIN_REPORTED_AMPS } from "@/lib/submissions/limits";
import { BENCH_CAUTIONS, type Caution } from "./cautions";
import { numberField, settingField, settingRange, type WorksheetFamily } from "./fields";
import { failed, ok, parseInput, type FieldIssue, type WorksheetResult } from "./result";
import { CURRENT_ROUNDING_WHY, roundBothWays, type SettingRoundings } from "./rounding";
import { SOURCES } from "./sources";

// Bench worksheet (issue "Calibration worksheets", section 2): several clamp-meter readings at
// steady throttle beside the OSD's current, fitted by least squares, reported = gain × measured +
// intercept (evidence.ts impliedFromBench over least-squares.ts, i.e. simple-statistics
// linearRegression — one implementation). The algebra, in full in evidence.ts:
//   the gain is s_true ÷ s_used, so an 'inverse' mV/A scale becomes old × gain and a
//   'proportional' A/V scale old ÷ gain;
//   the intercept is the display's error at zero current, so an offset in mV becomes
//   old + intercept × s_used (mV/A), and an offset in mA becomes (1000 × intercept + old) ÷ gain;
// offsets are then counted in steps of the family's offset step.

/** Below this r² the points scatter more than a linear sensor read at steady throttle should (our own rule). */
export const BENCH_MIN_R_SQUARED = 0.99;

export type BenchWorksheetInput = {
  scaleUsed: number;
  offsetUsed: number;
  points: ReadonlyArray<{ measuredAmps: number; reportedAmps: number }>;
};

type BenchResidual = { index: number; measuredAmps: number; reportedAmps: number; fittedAmps: number; residualAmps: number };

export type BenchWorksheet = {
  scaleUsed: number;
  offsetUsed: number;
  fit: { gain: number; interceptAmps: number; r: number | null; rSquared: number; n: number; method: string };
  /** For a residual plot: reported − fitted at each point, in amps. */
  residuals: BenchResidual[];
  /** The exact current scale in steps, and both roundings (the recommended one over-reports). */
  scaleRounding: SettingRoundings & { why: string };
  /** The exact offset in steps, the nearest whole step, and the error that step leaves at zero current. */
  offset: { exact: number; setting: number; displayedErrorAmpsAtZero: number; withinRange: boolean };
  cautions: readonly Caution[];
};

/** One clamp-meter point on its own; the saved bench worksheet checks each point with it as it is typed. */
export const benchPointSchema = z.object({
  measuredAmps: numberField("The clamp-meter current")
    .min(0, "The clamp-meter current cannot be negative: clamp the battery lead with the arrow towards the board")
    .max(MAX_BENCH_AMPS, `The clamp-meter current must be at most ${MAX_BENCH_AMPS} A`),
  reportedAmps: numberField("The reported current")
    .min(MIN_REPORTED_AMPS, `The reported current must be at least ${MIN_REPORTED_AMPS} A`)
    .max(MAX_BENCH_AMPS, `The reported current must be at most ${MAX_BENCH_AMPS} A`),
});

export function benchWorksheet(input: BenchWorksheetInput, family: WorksheetFamily): WorksheetResult<BenchWorksheet> {
  const schema = z.object({
    scaleUsed: settingField("The current scale in force", family, "currentScale"),
    offsetUsed: settingField("The current offset in force", family, "currentOffset"),
    points: z
      .array(benchPointSchema)
      .min(MIN_BENCH_POINTS, `Add at least ${MIN_BENCH_POINTS} points: a line needs two`)
      .max(MAX_BENCH_POINTS, `At most ${MAX_BENCH_POINTS} points`),
  });
  const parsed = parseInput(schema, input);
  if ("errors" in parsed) return failed(parsed.errors);
  const bench = parsed.data;
  if (new Set(bench.points.map((p) => p.measuredAmps)).size < 2) {
    return failed([{ field: "points", message: "Take the points at two or more different clamp-meter currents: a line cannot be fitted through one" }]);
  }
  const implied = impliedFromBench(bench, family);
  if (!(implied.gain >= MIN_READING_RATIO && implied.gain <= MAX_READING_RATIO)) {
    return failed([
      {
        field: "points",
        message: `The display reads ${formatFigure(implied.gain, 3)} A per clamp-meter amp; outside ${MIN_READING_RATIO}–${MAX_READING_RATIO} the two cannot be the same current — check each pair, and that the clamp is on the battery lead`,
      },
    ]);
  }

  const line = (x: number) => implied.gain * x + implied.interceptAmps;
  const residuals = bench.points.map((p, index) => ({
    index,
    measuredAmps: p.measuredAmps,
    reportedAmps: p.reportedAmps,
    fittedAmps: line(p.measuredAmps),
    residualAmps: p.reportedAmps - line(p.measuredAmps),
  }));
  const r2 = rSquared(
    bench.points.map((p) => [p.measuredAmps, p.reportedAmps]),
    line,
  );

  const warnings: FieldIssue[] = [];
  if (bench.points.length === 2) {
    warnings.push({
      field: "points",
      message: "Two points fit any line exactly, so nothing shows whether the sensor is linear: add a third at another throttle",
    });
  } else if (r2 < BENCH_MIN_R_SQUARED) {
    warnings.push({
      field: "points",
      message: `r² is ${formatFigure(r2, 4)}, below ${BENCH_MIN_R_SQUARED}: hold each throttle steady until both readings settle, zero the clamp meter first, and see the residual plot for the odd point`,
    });
  }

  const scaleRounding = {
    ...roundBothWays(implied.impliedScale, family.currentScaleResponse, "high", settingRange(family, "currentScale")),
    why: CURRENT_ROUNDING_WHY,
  };
  if (!scaleRounding.recommended.withinRange) {
    warnings.push({
      field: "scaleUsed",
      message: `The implied current scale ${scaleRounding.recommended.setting} is outside ${family.name}'s range ${family.currentScaleMin}–${family.currentScaleMax}: check the points`,
    });
  }
  const offsetSetting = roundSetting(implied.impliedOffset);
  // The displayed current falls as the offset rises: by step ÷ sensitivity (mV offsets, through the
  // new sensitivity s_used × gain) or by step ÷ 1000 (mA offsets), per step.
  const stepsOff = offsetSetting - implied.impliedOffset;
  const newSensitivity = sensitivityFromCurrentScaleSetting(bench.scaleUsed, family) * implied.gain;
  const perStepAmps = family.currentOffsetUnit === "mV" ? family.currentOffsetStep / newSensitivity : family.currentOffsetStep / 1000;
  const offsetWithinRange = offsetSetting >= family.currentOffsetMin && offsetSetting <= family.currentOffsetMax;
  if (!offsetWithinRange) {
    warnings.push({
      field: "offsetUsed",
      message: `The implied offset ${offsetSetting} is outside ${family.name}'s range ${family.currentOffsetMin}–${family.currentOffsetMax}: check the points near zero current`,
    });
  }

  return ok(
    {
      scaleUsed: bench.scaleUsed,
      offsetUsed: bench.offsetUsed,
      fit: { gain: implied.gain, interceptAmps: implied.interceptAmps, r: implied.r, rSquared: r2, n: implied.n, method: SOURCES.leastSquares },
      residuals,
      scaleRounding,
      offset: { exact: implied.impliedOffset, setting: offsetSetting, displayedErrorAmpsAtZero: -stepsOff * perStepAmps + 0, withinRange: offsetWithinRange },
      cautions: BENCH_CAUTIONS,
    },
    warnings,
  );
}
