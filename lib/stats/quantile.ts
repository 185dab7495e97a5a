// Quantiles by one named definition, so every published figure means the same thing everywhere.

/**
 * Hyndman & Fan (1996) type 7 quantile of an ascending sample: the position h = p·(n − 1)
 * (0-based), and linear interpolation x[⌊h⌋] + (h − ⌊h⌋)·(x[⌊h⌋+1] − x[⌊h⌋]).
 *
 * This is R's default `quantile()`, PostgreSQL's `percentile_cont` and simple-statistics
 * `quantile` from 7.8.9 on. The arithmetic is written in the same order as PostgreSQL's
 * float8 interpolation (lo + (hi − lo)·fraction), so a figure computed in SQL and here agree
 * to the last bit. We keep our own copy rather than call simple-statistics so that the
 * definition cannot move with a package upgrade (its versions up to 7.8.8 behaved like type 2);
 * the tests hold the two together.
 *
 * Returns null for an empty sample.
 */
export function quantileType7(sorted: ArrayLike<number>, p: number): number | null {
  const n = sorted.length;
  if (!(p >= 0 && p <= 1)) throw new RangeError(`p must be between 0 and 1, got ${p}`);
  if (n === 0) return null;
  const h = p * (n - 1);
  const lo = Math.floor(h);
  const fraction = h - lo;
  if (fraction === 0) return sorted[lo];
  return sorted[lo] + (sorted[lo + 1] - sorted[lo]) * fraction;
}

/** Median as the type 7 quantile at p = 0.5 (the mean of the two middle values for even n). */
export function medianOfSorted(sorted: ArrayLike<number>): number | null {
  return quantileType7(sorted, 0.5);
}
