// Spread about the median that one wild value cannot drag around.
import { medianOfSorted } from "./quantile";

/**
 * Consistency constant for the scaled MAD, as in R's `mad()` (constant = 1.4826). It is
 * 1 / Φ⁻¹(0.75) = 1.4826022185056018… rounded to R's published figure, so that our scaled MAD
 * reproduces R (mad(1:9) = 2.9652). For normal data the scaled MAD estimates the standard deviation.
 */
export const SCALED_MAD_CONSTANT = 1.4826;

/**
 * Median absolute deviation, unscaled: median of |x − median| (type 7 median both times).
 * Same definition as simple-statistics `medianAbsoluteDeviation` and R's mad(x, constant = 1).
 */
export function madOfSorted(sorted: ArrayLike<number>, median: number): number {
  const deviations = new Float64Array(sorted.length);
  for (let i = 0; i < sorted.length; i++) deviations[i] = Math.abs(sorted[i] - median);
  return medianOfSorted(deviations.sort()) ?? 0;
}

/** Mean of |x − median|: the fallback spread of the modified z-score when the MAD is zero. */
export function meanAbsDeviationAroundMedian(values: ArrayLike<number>, median: number): number {
  if (values.length === 0) return 0;
  let total = 0;
  for (let i = 0; i < values.length; i++) total += Math.abs(values[i] - median);
  return total / values.length;
}
