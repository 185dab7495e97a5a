// Two independent outlier flags per value: the modified z-score (primary) and Tukey's fences.
import type { ZScaleRule } from "@/lib/vocabulary";
import { MIN_VALUES_TO_JUDGE, spreadOfSorted, type Spread } from "./spread";
import { sortedCopy } from "./validate";

/** NIST/SEMATECH e-Handbook §1.3.5.17 (after Iglewicz & Hoaglin, 1993): M = 0.6745 (x − median) / MAD. */
export const MODIFIED_Z_FACTOR = 0.6745;
/** Same source: a value is a potential outlier when |M| > 3.5, strictly. */
export const MODIFIED_Z_CUTOFF = 3.5;
/**
 * Fallback when MAD = 0: M = (x − median) / (1.253314 · meanAD), meanAD = mean |x − median|.
 * 1.253314 ≈ √(π/2) makes the mean absolute deviation estimate σ for normal data, as 1/0.6745 does
 * for the MAD. Common robust-statistics practice (e.g. IBM's documentation of modified z-scores),
 * from memory.
 */
export const MEAN_AD_FACTOR = 1.253314;
/** Tukey, Exploratory Data Analysis (1977); NIST e-Handbook §7.1.6: inner fences at 1.5·IQR… */
export const TUKEY_INNER = 1.5;
/** …and outer fences at 3·IQR beyond the quartiles. */
const TUKEY_OUTER = 3;

type TukeyFlag = "none" | "mild" | "extreme";

export interface FlaggedPoint {
  value: number;
  /** Null when there are too few values, or when no spread exists to divide by (see zScaleRule). */
  modifiedZ: number | null;
  /** |modifiedZ| > 3.5, or (all-ties rule) the value differs from a median that every spread measure sits on. */
  outlier: boolean;
  tukey: TukeyFlag;
}

export interface TukeyFences {
  innerLow: number;
  innerHigh: number;
  outerLow: number;
  outerHigh: number;
}

/**
 * The flags of a set of values. zScaleRule names which spread the modified z-score divided by:
 *  - "mad":           MAD > 0, the NIST formula as written.
 *  - "mean_abs_dev":  MAD = 0 (more than half the values tie at the median) but meanAD > 0:
 *                     M = (x − median) / (1.253314 · meanAD).
 *  - "no_spread":     MAD = meanAD = 0. Every value at the median gets M = 0; any value that still
 *                     differs (possible only through underflow of subnormal differences) is flagged
 *                     as an outlier with modifiedZ null. Nothing is ever divided by zero.
 *  - "too_few":       n < 3, nothing is scored or flagged.
 */
export interface FlagReport {
  zScaleRule: ZScaleRule;
  /** Null when n < 3. With IQR = 0 the fences sit on the quartiles and any value off them is "extreme": that is Tukey's rule as written. */
  fences: TukeyFences | null;
  /** In the caller's order. */
  points: FlaggedPoint[];
}

export function tukeyFences(q1: number, q3: number): TukeyFences {
  const iqr = q3 - q1;
  return {
    innerLow: q1 - TUKEY_INNER * iqr,
    innerHigh: q3 + TUKEY_INNER * iqr,
    outerLow: q1 - TUKEY_OUTER * iqr,
    outerHigh: q3 + TUKEY_OUTER * iqr,
  };
}

/** "Beyond" a fence means strictly outside it; a value on a fence is not flagged. */
function tukeyFlag(value: number, fences: TukeyFences): TukeyFlag {
  if (value < fences.outerLow || value > fences.outerHigh) return "extreme";
  if (value < fences.innerLow || value > fences.innerHigh) return "mild";
  return "none";
}

/** A group's centre and spreads, as the modified z-score needs them (board_stats keeps the same columns). */
export type ZScaleSpread = Pick<Spread, "median" | "mad" | "meanAbsDev">;

/**
 * Which spread a group of n values divides its modified z-scores by. The one TypeScript copy of
 * the rule; the aggregate SQL's is lib/published/modified-z-sql.ts, held to this one by
 * tests/integration/published-stats.test.ts.
 */
export function zScaleRuleOf(n: number, spread: Pick<Spread, "mad" | "meanAbsDev">): ZScaleRule {
  if (n < MIN_VALUES_TO_JUDGE) return "too_few";
  if (spread.mad > 0) return "mad";
  if (spread.meanAbsDev > 0) return "mean_abs_dev";
  return "no_spread";
}

/**
 * The modified z-score of one value against a group, and whether it is an outlier: the one
 * TypeScript copy of the formula (the SQL one: lib/published/modified-z-sql.ts).
 */
export function modifiedZScore(value: number, rule: ZScaleRule, spread: ZScaleSpread): { modifiedZ: number | null; outlier: boolean } {
  if (rule === "too_few") return { modifiedZ: null, outlier: false };
  const offset = value - spread.median;
  let z: number;
  if (rule === "mad") z = (MODIFIED_Z_FACTOR * offset) / spread.mad;
  else if (rule === "mean_abs_dev") z = offset / (MEAN_AD_FACTOR * spread.meanAbsDev);
  else z = offset === 0 ? 0 : Number.NaN;
  // Belt and braces: a tiny divisor could still overflow; report "no score" rather than Infinity.
  const modifiedZ = Number.isFinite(z) ? z + 0 : null; // + 0 turns −0 into 0
  return { modifiedZ, outlier: modifiedZ === null ? value !== spread.median : Math.abs(modifiedZ) > MODIFIED_Z_CUTOFF };
}

/** Per-value flags, with the rule that produced them. Throws StatsInputError on a bad value. */
export function describeFlags(values: number[]): FlagReport {
  const sorted = sortedCopy(values);
  const spread = spreadOfSorted(sorted);
  if (!spread || sorted.length < MIN_VALUES_TO_JUDGE) {
    return {
      zScaleRule: "too_few",
      fences: null,
      points: values.map((value) => ({ value, modifiedZ: null, outlier: false, tukey: "none" })),
    };
  }
  const rule = zScaleRuleOf(sorted.length, spread);
  const fences = tukeyFences(spread.q1, spread.q3);
  const points = values.map((value): FlaggedPoint => ({ value, ...modifiedZScore(value, rule, spread), tukey: tukeyFlag(value, fences) }));
  return { zScaleRule: rule, fences, points };
}

/** `{ value, modifiedZ, outlier, tukey }` for each value, in the caller's order. */
export function flagPoints(values: number[]): FlaggedPoint[] {
  return describeFlags(values).points;
}

/**
 * A modified z-score in plain words for the screen: "about 4.2× the usual spread" away from the
 * middle value. The modified z-score already measures distance in units of a robust standard
 * deviation (MAD ÷ 0.6745, same NIST source as above), so |M| is that multiple; below 10 it is
 * given to one decimal, above to a whole number, since nobody acts on "38.45".
 */
export function spreadMultiple(modifiedZ: number): string {
  const m = Math.abs(modifiedZ);
  return m < 10 ? (Math.round(m * 10) / 10).toFixed(1) : String(Math.round(m));
}
