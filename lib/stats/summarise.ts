// The published summary of one group of values (one setting, one board revision, one firmware family).
import { SCALED_MAD_CONSTANT } from "./mad";
import { DEFAULT_CI_LEVEL, medianCi, type MedianCiRanks } from "./median-ci";
import { MIN_VALUES_TO_JUDGE, spreadOfSorted } from "./spread";
import { sortedCopy } from "./validate";

/** "too_few": fewer than 3 values, so nothing is flagged or judged. "ok": 3 or more. */
type SummaryState = "too_few" | "ok";

export interface Summary {
  n: number;
  median: number | null;
  q1: number | null;
  q3: number | null;
  iqr: number | null;
  /** Unscaled MAD: median of |x − median|. */
  mad: number | null;
  /** MAD × 1.4826 (R's `mad()` default), an estimate of σ for normal data. */
  scaledMad: number | null;
  /** Order-statistic interval for the median (median-ci.ts); null below 6 values at 95 %. */
  ciLow: number | null;
  ciHigh: number | null;
  ciCoverage: number | null;
  /** The interval's level as asked for (the coverage achieved is ciCoverage, at least this). */
  ciLevel: number;
  ciRanks: MedianCiRanks | null;
  /** Why there is no interval, in plain words; null when there is one. */
  ciUnavailableReason: string | null;
  state: SummaryState;
}

/**
 * Summary of one group. n = 0 gives n: 0, every figure null and state "too_few" — never NaN.
 * With 1–2 values the centre and spread are still reported (they are well defined) but the state is
 * "too_few". Throws StatsInputError naming the entry when a value is not a finite number.
 */
export function summarise(values: number[], options: { level?: number } = {}): Summary {
  const level = options.level ?? DEFAULT_CI_LEVEL;
  const sorted = sortedCopy(values);
  const ci = medianCi(sorted, level);
  const spread = spreadOfSorted(sorted);
  return {
    n: sorted.length,
    median: spread?.median ?? null,
    q1: spread?.q1 ?? null,
    q3: spread?.q3 ?? null,
    iqr: spread?.iqr ?? null,
    mad: spread?.mad ?? null,
    scaledMad: spread ? spread.mad * SCALED_MAD_CONSTANT : null,
    ciLow: ci.ciLow,
    ciHigh: ci.ciHigh,
    ciCoverage: ci.ciCoverage,
    ciLevel: level,
    ciRanks: ci.ranks,
    ciUnavailableReason: ci.reason,
    state: sorted.length < MIN_VALUES_TO_JUDGE ? "too_few" : "ok",
  };
}
