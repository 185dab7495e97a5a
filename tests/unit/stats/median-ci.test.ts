import fc from "fast-check";
import { errorFunction } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { binomialHalfCdf, medianCi, medianCiRanks, minimumCountForCi, StatsInputError, summarise } from "@/lib/stats";

/** Σ_{j=0..k} C(n, j) and 2^n as exact integers: the reference the float code is held to. */
function exactTail(n: number, k: number): { num: bigint; den: bigint } {
  let c = 1n;
  let num = 0n;
  for (let j = 0; j <= Math.min(k, n); j++) {
    num += c;
    c = (c * BigInt(n - j)) / BigInt(j + 1);
  }
  return { num, den: 1n << BigInt(n) };
}
const exactCdf = (n: number, k: number) => {
  const { num, den } = exactTail(n, k);
  return Number(num) / Number(den); // both below 2^1024 for n ≤ 1000; each conversion rounds correctly
};

describe("binomial CDF for B ~ Bin(n, 1/2), against exact BigInt sums of C(n, j) / 2^n", () => {
  it("matches for every n ≤ 120 and every k, to 1e-12 relative", () => {
    for (let n = 0; n <= 120; n++) {
      for (let k = -1; k <= n + 1; k++) {
        const want = k < 0 ? 0 : exactCdf(n, k);
        const got = binomialHalfCdf(n, k);
        expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-12 * Math.max(want, 1e-300));
      }
    }
  });

  it("matches at n = 1000 across the lower tail, the middle and the upper tail", () => {
    for (const k of [0, 1, 100, 400, 469, 480, 499, 500, 501, 530, 900, 999]) {
      const want = exactCdf(1000, k);
      expect(Math.abs(binomialHalfCdf(1000, k) - want)).toBeLessThanOrEqual(1e-11 * want);
    }
  });

  it("stays finite and ordered at n = 1,000,000", () => {
    const lo = binomialHalfCdf(1_000_000, 499_019);
    const mid = binomialHalfCdf(1_000_000, 500_000);
    expect(lo).toBeGreaterThan(0);
    expect(lo).toBeLessThan(0.025);
    // P(B ≤ n/2) = 1/2 + P(B = n/2)/2, and P(B = n/2) ≈ √(2/(πn)) = 7.979e-4 (Stirling).
    expect(mid).toBeCloseTo(0.5 + Math.sqrt(2 / (Math.PI * 1e6)) / 2, 8);
    expect(binomialHalfCdf(1_000_000, 0)).toBe(0); // 2^−1000000 underflows to 0, not NaN
  });

  it("rejects a fractional or negative n with the field named", () => {
    expect(() => binomialHalfCdf(2.5, 1)).toThrow(StatsInputError);
    expect(() => binomialHalfCdf(-1, 0)).toThrow(/^n:/);
    expect(() => binomialHalfCdf(4, 0.5)).toThrow(/^k:/);
  });
});

// The sign-test (order-statistic) interval for the median: Conover, Practical Nonparametric
// Statistics, 3rd ed., quantile test and its confidence interval; Hollander & Wolfe, Nonparametric
// Statistical Methods (both from memory). Rule: l = largest k with P(B < k) ≤ 0.025, u = n − l + 1,
// coverage = 1 − 2·P(B < l).
describe("95 % order-statistic CI for the median, worked by hand", () => {
  it("n = 10: l = 2, u = 9, coverage 0.978515625", () => {
    // P(B ≤ 1) = (C(10,0) + C(10,1)) / 2^10 = (1 + 10) / 1024 = 0.0107421875 ≤ 0.025, so k = 2 qualifies;
    // P(B ≤ 2) = (1 + 10 + 45) / 1024 = 56/1024 = 0.0546875 > 0.025, so k = 3 does not. Hence l = 2,
    // u = 10 − 2 + 1 = 9, coverage = 1 − 2·11/1024 = 1002/1024 = 0.978515625.
    const r = medianCiRanks(10)!;
    expect([r.lower, r.upper]).toEqual([2, 9]);
    expect(r.coverage).toBeCloseTo(0.978515625, 12);
    const ci = medianCi([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect([ci.ciLow, ci.ciHigh]).toEqual([2, 9]);
  });

  it("n = 6: l = 1, u = 6, coverage 1 − 2/64 = 0.96875", () => {
    // P(B ≤ 0) = 1/64 = 0.015625 ≤ 0.025; P(B ≤ 1) = 7/64 = 0.109 > 0.025. So (x(1), x(6)).
    const r = medianCiRanks(6)!;
    expect([r.lower, r.upper]).toEqual([1, 6]);
    expect(r.coverage).toBeCloseTo(0.96875, 12);
  });

  it("n = 5 and below: no pair reaches 95 % (best is 1 − 2/32 = 0.9375), so the CI is null with a reason", () => {
    for (let n = 0; n <= 5; n++) expect(medianCiRanks(n)).toBeNull();
    expect(minimumCountForCi(0.95)).toBe(6);
    const s = summarise([1, 2, 3, 4, 5]);
    expect([s.ciLow, s.ciHigh, s.ciCoverage, s.ciRanks]).toEqual([null, null, null, null]);
    expect(s.ciUnavailableReason).toBe("A 95 % interval for the median needs at least 6 values; there are 5.");
  });

  it("n = 100: (x(40), x(61)), the familiar table entry (from memory), confirmed against the exact sum", () => {
    const r = medianCiRanks(100)!;
    expect([r.lower, r.upper]).toEqual([40, 61]);
    const { num, den } = exactTail(100, 39);
    expect(r.coverage).toBeCloseTo(1 - (2 * Number(num)) / Number(den), 12);
    expect(r.coverage).toBeCloseTo(0.9648, 4);
  });
});

describe("larger n against the normal approximation (de Moivre–Laplace with continuity correction)", () => {
  // B ≈ N(n/2, n/4). P(B ≤ l − 1) ≈ Φ((l − 1/2 − n/2) / (√n/2)) = 0.025 gives l ≈ n/2 + 1/2 − 1.959964·√n/2.
  const Phi = (z: number) => 0.5 * (1 + errorFunction(z / Math.SQRT2)); // simple-statistics erf
  it.each([10_000, 123_457, 1_000_000])("n = %i: ranks within 1 of the approximation, coverage within 0.001", (n) => {
    const started = Date.now();
    const r = medianCiRanks(n)!;
    expect(Date.now() - started).toBeLessThan(2000);
    const approxL = n / 2 + 0.5 - (1.959964 * Math.sqrt(n)) / 2;
    expect(Math.abs(r.lower - approxL)).toBeLessThanOrEqual(1);
    expect(r.upper).toBe(n - r.lower + 1);
    const approxCoverage = 1 - 2 * Phi((r.lower - 0.5 - n / 2) / (Math.sqrt(n) / 2));
    expect(Math.abs(r.coverage - approxCoverage)).toBeLessThan(1e-3);
    expect(r.coverage).toBeGreaterThanOrEqual(0.95);
  });
});

describe("the rank rule holds for any n (fast-check)", () => {
  it("coverage ≥ 95 %, and one rank further in would fall below it", () => {
    fc.assert(
      fc.property(fc.integer({ min: 6, max: 20_000 }), (n) => {
        const r = medianCiRanks(n)!;
        expect(binomialHalfCdf(n, r.lower - 1)).toBeLessThanOrEqual(0.025);
        expect(binomialHalfCdf(n, r.lower)).toBeGreaterThan(0.025); // l is the largest such k
        expect(r.coverage).toBeGreaterThanOrEqual(0.95);
        expect(r.lower).toBeLessThanOrEqual(r.upper);
      }),
    );
  });

  it("the interval brackets the median, including with ties", () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 5 }), { minLength: 6, maxLength: 80 }), (xs) => {
        const s = summarise(xs);
        expect(s.ciLow!).toBeLessThanOrEqual(s.median!);
        expect(s.ciHigh!).toBeGreaterThanOrEqual(s.median!);
      }),
    );
  });

  it("rejects a level outside (0, 1) with the field named", () => {
    expect(() => medianCiRanks(10, 1)).toThrow(/^level:/);
    expect(() => summarise([1, 2, 3], { level: 95 })).toThrow(/^level:/);
  });

  it("other levels follow the same rule: 90 % needs 5 values, 99 % needs 8", () => {
    // (x(1), x(n)) covers 1 − 2^(1−n). 90 %: 2^−4 = 0.0625 ≤ 0.10 but 2^−3 = 0.125 is not, so n = 5.
    // 99 %: 2^−7 = 0.0078 ≤ 0.01 but 2^−6 = 0.0156 is not, so n = 8.
    expect(minimumCountForCi(0.9)).toBe(5);
    expect(minimumCountForCi(0.99)).toBe(8);
    expect(medianCiRanks(8, 0.99)).toMatchObject({ lower: 1, upper: 8 });
    expect(medianCiRanks(7, 0.99)).toBeNull();
  });
});
