import fc from "fast-check";
import { medianAbsoluteDeviation, quantile } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { madOfSorted, medianOfSorted, quantileType7, sortedCopy, summarise } from "@/lib/stats";

// Finite values of calibration-like size, plus small integers so that ties are common.
const realValues = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }), { minLength: 1, maxLength: 200 });
const tiedValues = fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 1, maxLength: 60 });
const anyValues = fc.oneof(realValues, tiedValues);
const probability = fc.double({ min: 0, max: 1, noNaN: true });

// `+ 0` folds −0 into 0: the two libraries may order −0 and 0 differently, which is not a difference in value.
const same = (ours: number | null, theirs: number) => expect((ours ?? Number.NaN) + 0).toBe(theirs + 0);

describe("type 7 quantiles against simple-statistics 7.12.1 `quantile` (type 7 since 7.8.9)", () => {
  it("agrees to the last bit at any p (fast-check)", () => {
    fc.assert(
      fc.property(anyValues, probability, (values, p) => {
        same(quantileType7(sortedCopy(values), p), quantile(values, p));
      }),
    );
  });

  it("median, Q1 and Q3 of summarise() agree with quantile(x, 0.5 / 0.25 / 0.75) (fast-check)", () => {
    fc.assert(
      fc.property(anyValues, (values) => {
        const s = summarise(values);
        same(s.median, quantile(values, 0.5));
        same(s.q1, quantile(values, 0.25));
        same(s.q3, quantile(values, 0.75));
      }),
    );
  });
});

describe("MAD against simple-statistics `medianAbsoluteDeviation` (unscaled)", () => {
  it("agrees to the last bit (fast-check)", () => {
    fc.assert(
      fc.property(anyValues, (values) => {
        const sorted = sortedCopy(values);
        same(madOfSorted(sorted, medianOfSorted(sorted)!), medianAbsoluteDeviation(values));
        same(summarise(values).mad, medianAbsoluteDeviation(values));
      }),
    );
  });
});

// Source: Hyndman & Fan, "Sample quantiles in statistical packages", The American Statistician
// 50(4), 1996, definition 7 (linear on p·(N−1)), worked by hand and cross-checked against
// PostgreSQL 15 percentile_cont, which is type 7. MAD as in R's mad(constant = 1).
describe("type 7 check-value table (Hyndman & Fan 1996; PostgreSQL percentile_cont)", () => {
  const table: [number[], number, number, number, number][] = [
    [[1, 2, 3, 4], 1.75, 2.5, 3.25, 1],
    [[1, 2, 3, 4, 5], 2, 3, 4, 1],
    [[3, 6, 7, 8, 8, 9, 10, 13, 15, 16, 20], 7.5, 9, 14, 3],
    [[7, 15, 36, 39, 40, 41], 20.25, 37.5, 39.75, 3],
    [[2, 2, 2, 3, 3, 10], 2, 2.5, 3, 0.5],
  ];
  it.each(table)("%j → Q1 %d, median %d, Q3 %d, MAD %d", (data, q1, median, q3, mad) => {
    const s = summarise(data);
    expect([s.q1, s.median, s.q3, s.mad]).toEqual([q1, median, q3, mad]);
    expect(s.iqr).toBe(q3 - q1);
  });

  it("[10.9, 11, 11, 11.1, 11.2, 25] → 11 / 11.05 / 11.175, where float Q3 is exactly 11.174999999999999", () => {
    const s = summarise([10.9, 11, 11, 11.1, 11.2, 25]);
    expect(s.q1).toBe(11);
    expect(s.median).toBe(11.05);
    // The table's float note: PostgreSQL's percentile_cont gives this same double.
    expect(s.q3).toBe(11.174999999999999);
    expect(s.mad).toBeCloseTo(0.1, 12); // 0.1 only up to float error (|x − 11.05| in float8 is not exactly 0.1)
  });

  it("is unaffected by input order", () => {
    expect(summarise([4, 1, 3, 2])).toEqual(summarise([1, 2, 3, 4]));
  });
});

// Source: R documentation of mad() (package stats), its Examples section; constant 1.4826.
describe("scaled MAD against R's mad()", () => {
  it("mad(1:9) = 2.9652", () => {
    expect(summarise([1, 2, 3, 4, 5, 6, 7, 8, 9]).scaledMad).toBeCloseTo(2.9652, 12);
  });

  it("mad(c(1:8, 100), constant = 1) = 2 (the unscaled MAD ignores the 100)", () => {
    const s = summarise([1, 2, 3, 4, 5, 6, 7, 8, 100]);
    expect(s.mad).toBe(2);
    expect(s.scaledMad).toBeCloseTo(2 * 1.4826, 12);
  });
});
