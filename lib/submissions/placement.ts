import { MEAN_AD_FACTOR, MIN_VALUES_TO_JUDGE, MODIFIED_Z_CUTOFF, MODIFIED_Z_FACTOR, meanAbsDeviationAroundMedian } from "@/lib/stats";

// Where a contributor's value would sit among a board's approved values, before they send it:
// its modified z-score against the published median and MAD (NIST/SEMATECH e-Handbook §1.3.5.17,
// after Iglewicz & Hoaglin, 1993), with lib/stats' constants and its rule for MAD = 0 (the mean
// absolute deviation × 1.253314 instead). The approved set is what it is scored against; the new
// value is not part of it, since it is not approved.

export type Placement = {
  /** Null below MIN_VALUES_TO_JUDGE values, or with no spread at all. */
  modifiedZ: number | null;
  /** |z| > 3.5: a moderator will look twice; or, with no spread, any value off the median. */
  outlier: boolean;
  rule: "mad" | "mean_abs_dev" | "no_spread" | "too_few";
};

export function placeValue(value: number, published: { n: number; median: number; mad: number }, approvedValues: readonly number[] = []): Placement {
  if (published.n < MIN_VALUES_TO_JUDGE) return { modifiedZ: null, outlier: false, rule: "too_few" };
  const offset = value - published.median;
  if (published.mad > 0) {
    const z = (MODIFIED_Z_FACTOR * offset) / published.mad;
    return { modifiedZ: z, outlier: Math.abs(z) > MODIFIED_Z_CUTOFF, rule: "mad" };
  }
  const meanAbsDev = meanAbsDeviationAroundMedian(approvedValues, published.median);
  if (meanAbsDev > 0) {
    const z = offset / (MEAN_AD_FACTOR * meanAbsDev);
    return { modifiedZ: z, outlier: Math.abs(z) > MODIFIED_Z_CUTOFF, rule: "mean_abs_dev" };
  }
  return { modifiedZ: offset === 0 ? 0 : null, outlier: offset !== 0, rule: "no_spread" };
}
