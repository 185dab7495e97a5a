// A confidence interval for the median that assumes nothing about the shape of the data.
import { binomialHalfCdf } from "./binomial";
import { StatsInputError } from "./validate";

export const DEFAULT_CI_LEVEL = 0.95;

export interface MedianCiRanks {
  /** 1-based rank l of the lower end: ciLow = x(l). */
  lower: number;
  /** 1-based rank u = n − l + 1 of the upper end: ciHigh = x(u). */
  upper: number;
  /** Achieved coverage 1 − 2·P(B < l), never below the level asked for. */
  coverage: number;
}

export type MedianCi =
  | { ciLow: number; ciHigh: number; ciCoverage: number; ranks: MedianCiRanks; reason: null }
  | { ciLow: null; ciHigh: null; ciCoverage: null; ranks: null; reason: string };

function checkLevel(level: number): number {
  if (typeof level !== "number" || !(level > 0 && level < 1)) {
    throw new StatsInputError("level", "must be a number strictly between 0 and 1, e.g. 0.95");
  }
  return level;
}

/**
 * Ranks of the distribution-free (sign-test) interval for the median.
 *
 * Rule: with B ~ Bin(n, 1/2) and α = 1 − level, l is the largest k ≥ 1 with P(B < k) ≤ α/2,
 * and u = n − l + 1. Then P(x(l) ≤ median ≤ x(u)) ≥ 1 − 2·P(B < l) = coverage ≥ level for any
 * continuous distribution (with ties the interval is, if anything, wider than it need be).
 * Textbook form: Conover, Practical Nonparametric Statistics, the quantile test / sign-test
 * interval; Hollander & Wolfe, Nonparametric Statistical Methods (both from memory).
 *
 * P(B < k) rises with k, so l is found by bisection on exact binomial tails (binomial.ts); no
 * normal approximation is used at any n. Returns null when even (x(1), x(n)) falls short of the
 * level, i.e. when 2·2^−n > α: for 95 % that is n < 6 (2/32 = 6.25 % at n = 5, 2/64 = 3.125 % at n = 6).
 */
export function medianCiRanks(n: number, level = DEFAULT_CI_LEVEL): MedianCiRanks | null {
  if (!Number.isInteger(n) || n < 0) throw new StatsInputError("n", "must be a whole number ≥ 0");
  const halfAlpha = (1 - checkLevel(level)) / 2;
  const reaches = (k: number) => binomialHalfCdf(n, k - 1) <= halfAlpha;
  if (n === 0 || !reaches(1)) return null;
  // P(B < k) ≤ α/2 < 1/2 forces k ≤ ⌈n/2⌉, so l lies in [1, ⌈n/2⌉].
  let good = 1;
  let bad = Math.ceil(n / 2) + 1;
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (reaches(mid)) good = mid;
    else bad = mid;
  }
  return { lower: good, upper: n - good + 1, coverage: 1 - 2 * binomialHalfCdf(n, good - 1) };
}

/** Fewest values for which some rank pair reaches `level` (6 at 95 %). */
export function minimumCountForCi(level = DEFAULT_CI_LEVEL): number {
  // (x(1), x(n)) covers with 1 − 2^(1−n); it reaches the level once 2^(1−n) ≤ α.
  return Math.max(1, Math.ceil(1 + Math.log2(1 / (1 - checkLevel(level)))));
}

/** The interval itself, read off an ascending sample. */
export function medianCi(sorted: ArrayLike<number>, level = DEFAULT_CI_LEVEL): MedianCi {
  const ranks = medianCiRanks(sorted.length, level);
  if (!ranks) {
    const need = minimumCountForCi(level);
    return {
      ciLow: null,
      ciHigh: null,
      ciCoverage: null,
      ranks: null,
      reason: `A ${formatPercent(level)} interval for the median needs at least ${need} values; there ${sorted.length === 1 ? "is" : "are"} ${sorted.length}.`,
    };
  }
  return {
    ciLow: sorted[ranks.lower - 1],
    ciHigh: sorted[ranks.upper - 1],
    ciCoverage: ranks.coverage,
    ranks,
    reason: null,
  };
}

function formatPercent(level: number): string {
  return `${Number((level * 100).toPrecision(6))} %`;
}
