// Centre and spread of an ascending sample: the figures both the summary and the outlier flags use.
import { madOfSorted, meanAbsDeviationAroundMedian } from "./mad";
import { quantileType7 } from "./quantile";

/** Below this many values nothing is flagged and the summary says "too few to judge". */
export const MIN_VALUES_TO_JUDGE = 3;

export interface Spread {
  median: number;
  /** Type 7 quartiles (quantile.ts). */
  q1: number;
  q3: number;
  iqr: number;
  /** Unscaled median absolute deviation. */
  mad: number;
  /** Mean of |x − median|, kept for the MAD = 0 fallback of the modified z-score. */
  meanAbsDev: number;
}

/** Null for an empty sample, so no caller ever sees NaN. */
export function spreadOfSorted(sorted: ArrayLike<number>): Spread | null {
  if (sorted.length === 0) return null;
  const median = quantileType7(sorted, 0.5)!;
  const q1 = quantileType7(sorted, 0.25)!;
  const q3 = quantileType7(sorted, 0.75)!;
  return {
    median,
    q1,
    q3,
    iqr: q3 - q1,
    mad: madOfSorted(sorted, median),
    meanAbsDev: meanAbsDeviationAroundMedian(sorted, median),
  };
}
