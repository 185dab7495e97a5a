// Turning a median into something a pilot can actually enter: firmware settings are whole numbers
// of a family-specific step (firmware_families.*_step), so the recommendation is a step count.
import { checkFiniteNumber, StatsInputError } from "./validate";

/**
 * How to land on a whole step:
 *  - "nearest": the closest step; an exact half goes away from zero (so +x and −x stay mirror images).
 *  - "up" / "down": towards +∞ / −∞, for callers that must err on one side (e.g. a worksheet that
 *    rounds a current scale towards over-reporting mAh, common practice, no source).
 */
export type StepRounding = "nearest" | "up" | "down";

export interface RecommendedValue {
  /** The whole number to enter in the firmware: value = setting × step. */
  setting: number;
  /** The physical value that setting stands for, in the family's unit. */
  value: number;
  /** The step used, echoed so a display can say "in steps of …". */
  step: number;
}

/** Significant digits kept before rounding; see recommendValue. */
const DECIMAL_DIGITS = 12;

function roundTo(x: number, rounding: StepRounding): number {
  if (rounding === "up") return Math.ceil(x);
  if (rounding === "down") return Math.floor(x);
  return Math.sign(x) * Math.floor(Math.abs(x) + 0.5);
}

/**
 * Rounds `median` to a whole multiple of the family's `step` and returns both the setting
 * (the integer to enter) and the value it represents. A null median (no data) gives null.
 *
 * The ratio median / step is first cut to 12 significant digits: binary floating point turns a
 * decimal midpoint such as 11.35 / 0.1 into 113.49999999999999, and a person expects 114. Real
 * differences at the 12th digit are far below any setting step.
 */
export function recommendValue(median: number | null, step: number, rounding: StepRounding = "nearest"): RecommendedValue | null {
  checkFiniteNumber(step, "step");
  if (!(step > 0)) throw new StatsInputError("step", "must be greater than 0");
  if (!["nearest", "up", "down"].includes(rounding)) {
    throw new StatsInputError("rounding", 'must be "nearest", "up" or "down"');
  }
  if (median === null) return null;
  checkFiniteNumber(median, "median");
  const ratio = Number((median / step).toPrecision(DECIMAL_DIGITS));
  const setting = roundTo(ratio, rounding) + 0; // + 0 turns −0 into 0
  if (!Number.isSafeInteger(setting)) {
    throw new StatsInputError("step", "is too small for this median: the setting would exceed 2^53");
  }
  const value = Number((setting * step).toPrecision(DECIMAL_DIGITS)) + 0;
  return { setting, value, step };
}
