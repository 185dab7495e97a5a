import { describe, expect, it } from "vitest";
import { placeValue } from "@/lib/submissions/placement";

// Modified z-score, NIST/SEMATECH e-Handbook §1.3.5.17 (Iglewicz & Hoaglin, 1993):
// M = 0.6745 (x − median) / MAD, |M| > 3.5 a potential outlier. Check values worked by hand from
// that formula with type 7 medians.
describe("placeValue — NIST/SEMATECH e-Handbook §1.3.5.17", () => {
  it("[10.9, 11, 11, 11.1, 11.2, 25]: median 11.05, MAD 0.1, M(25) ≈ 94.09 (worked by hand)", () => {
    const p = placeValue(25, { n: 6, median: 11.05, mad: 0.1 });
    expect(p.rule).toBe("mad");
    expect(p.modifiedZ!).toBeCloseTo(94.09, 1);
    expect(p.outlier).toBe(true);
  });

  it("the cut-off is strictly greater than 3.5", () => {
    // x − median = 3.5 · MAD / 0.6745 gives |M| = 3.5 exactly (up to float error either way)
    expect(placeValue(10 + 3.4 / 0.6745, { n: 10, median: 10, mad: 1 }).outlier).toBe(false);
    expect(placeValue(10 + 3.6 / 0.6745, { n: 10, median: 10, mad: 1 }).outlier).toBe(true);
  });

  it("below 3 approved values nothing is judged", () => {
    expect(placeValue(500, { n: 2, median: 100, mad: 1 })).toEqual({ modifiedZ: null, outlier: false, rule: "too_few" });
  });

  it("MAD = 0 falls back to 1.253314 × the mean absolute deviation (lib/stats' rule, from memory)", () => {
    // [11, 11, 11, 11, 12]: median 11, MAD 0, mean |x − 11| = 0.2 (MAD 0: the stated fallback rule applies)
    const p = placeValue(12, { n: 5, median: 11, mad: 0 }, [11, 11, 11, 11, 12]);
    expect(p.rule).toBe("mean_abs_dev");
    expect(p.modifiedZ!).toBeCloseTo(1 / (1.253314 * 0.2), 9);
  });

  it("no spread at all: the median scores 0, anything else is off with no score", () => {
    expect(placeValue(11, { n: 4, median: 11, mad: 0 }, [11, 11, 11, 11])).toEqual({ modifiedZ: 0, outlier: false, rule: "no_spread" });
    expect(placeValue(12, { n: 4, median: 11, mad: 0 }, [11, 11, 11, 11])).toEqual({ modifiedZ: null, outlier: true, rule: "no_spread" });
  });
});
