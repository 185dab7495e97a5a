import { meanAbsDeviationAroundMedian, modifiedZScore, zScaleRuleOf } from "@/lib/stats";
import type { ZScaleRule } from "@/lib/vocabulary";

// Where a contributor's value would sit among a board's approved values, before they send it:
// its modified z-score against the published median and MAD (NIST/SEMATECH e-Handbook §1.3.5.17,
// after Iglewicz & Hoaglin, 1993), by lib/stats' one rule, including its fallback for MAD = 0 (the
// mean absolute deviation × 1.253314 instead). The approved set is what it is scored against; the
// new value is not part of it, since it is not approved.

export type Placement = {
  /** Null below MIN_VALUES_TO_JUDGE values, or with no spread at all. */
  modifiedZ: number | null;
  /** |z| > 3.5: a moderator will look twice; or, with no spread, any value off the median. */
  outlier: boolean;
  rule: ZScaleRule;
};

export function placeValue(value: number, published: { n: number; median: number; mad: number }, approvedValues: readonly number[] = []): Placement {
  // the mean absolute deviation matters only when the MAD is zero: skip the pass over the values otherwise
  const meanAbsDev = published.mad > 0 ? 0 : meanAbsDeviationAroundMedian(approvedValues, published.median);
  const spread = { median: published.median, mad: published.mad, meanAbsDev };
  const rule = zScaleRuleOf(published.n, spread);
  return { ...modifiedZScore(value, rule, spread), rule };
}
