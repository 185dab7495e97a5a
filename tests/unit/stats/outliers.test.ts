import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { describeFlags, flagPoints, MODIFIED_Z_CUTOFF, spreadMultiple, tukeyFences } from "@/lib/stats";

const CHECK_SET = [10.9, 11, 11, 11.1, 11.2, 25]; // worked by hand: median 11.05, MAD 0.1, M(25) ≈ 94.09

// Modified z-score: NIST/SEMATECH e-Handbook of Statistical Methods §1.3.5.17, after Iglewicz &
// Hoaglin (1993): M = 0.6745 (x − median) / MAD, potential outlier when |M| > 3.5. The handbook has
// no worked numbers; the figures below are worked by hand from its formula.
describe("modified z-score (NIST e-Handbook §1.3.5.17)", () => {
  it("M(25) ≈ 94.09 and only 25 is an outlier in [10.9, 11, 11, 11.1, 11.2, 25]", () => {
    const report = describeFlags(CHECK_SET);
    expect(report.zScaleRule).toBe("mad");
    const m25 = report.points[5].modifiedZ!;
    // 0.6745 × (25 − 11.05) / 0.1 = 94.09275; float error moves the last digits, so use a tolerance.
    expect(Math.abs(m25 - 94.09275)).toBeLessThan(1e-9);
    expect(m25).toBeCloseTo(94.09, 1);
    expect(report.points.map((p) => p.outlier)).toEqual([false, false, false, false, false, true]);
  });

  it("in words: M(25) ≈ 94.09 is 'about 94×' the usual spread, M = −1.01175 'about 1.0×' (worked from the same figures)", () => {
    const [low, , , , , far] = flagPoints(CHECK_SET);
    expect(spreadMultiple(far.modifiedZ!)).toBe("94");
    expect(spreadMultiple(low.modifiedZ!)).toBe("1.0");
    expect(spreadMultiple(MODIFIED_Z_CUTOFF)).toBe("3.5");
  });

  it("is symmetric up to float error (float8 makes M slightly asymmetric, so compare with a tolerance)", () => {
    const [low, , , , high] = flagPoints(CHECK_SET);
    // 10.9 and 11.2 sit 0.15 either side of 11.05: M = ∓0.6745 × 0.15 / 0.1 = ∓1.01175.
    expect(low.modifiedZ).toBeCloseTo(-1.01175, 9);
    expect(high.modifiedZ).toBeCloseTo(1.01175, 9);
  });

  it("the 3.5 cutoff is strict: |M| = 3.5 exactly is not an outlier, the next double up is", () => {
    // [−1, 0, 0, 1, x] with x ≥ 1 has median 0 and MAD 1, so M(x) = 0.6745·x.
    const bits = new DataView(new ArrayBuffer(8));
    const step = (x: number, by: number) => {
      bits.setFloat64(0, x);
      bits.setBigUint64(0, bits.getBigUint64(0) + BigInt(by));
      return bits.getFloat64(0);
    };
    let x = 3.5 / 0.6745;
    for (let i = 0; i < 8 && 0.6745 * x !== MODIFIED_Z_CUTOFF; i++) x = step(x, 0.6745 * x < 3.5 ? 1 : -1);
    const atCutoff = flagPoints([-1, 0, 0, 1, x])[4];
    expect(atCutoff.modifiedZ).toBe(3.5);
    expect(atCutoff.outlier).toBe(false);
    let above = step(x, 1);
    while (0.6745 * above === 3.5) above = step(above, 1);
    const beyond = flagPoints([-1, 0, 0, 1, above])[4];
    expect(beyond.modifiedZ!).toBeGreaterThan(3.5);
    expect(beyond.outlier).toBe(true);
  });
});

// MAD = 0 rule (lib/stats/outliers.ts): M = (x − median) / (1.253314 · meanAD), common robust-stats
// practice after Iglewicz & Hoaglin (from memory). The case [11, 11, 11, 11, 12] has MAD 0, where M divides by zero.
describe("MAD = 0 (more than half the values tie)", () => {
  it("[11, 11, 11, 11, 12] falls back to the mean absolute deviation: M(12) = 1 / (1.253314 × 0.2) ≈ 3.9894", () => {
    const report = describeFlags([11, 11, 11, 11, 12]);
    expect(report.zScaleRule).toBe("mean_abs_dev");
    // meanAD = (0 + 0 + 0 + 0 + 1) / 5 = 0.2
    expect(report.points[4].modifiedZ).toBeCloseTo(1 / (1.253314 * 0.2), 12);
    expect(report.points[4].modifiedZ).toBeCloseTo(3.98942, 5);
    expect(report.points.map((p) => p.modifiedZ)).toEqual([0, 0, 0, 0, expect.any(Number)]);
    expect(report.points.map((p) => p.outlier)).toEqual([false, false, false, false, true]);
  });

  it("all equal: every M is 0 and nothing is flagged", () => {
    const report = describeFlags([5, 5, 5, 5]);
    expect(report.zScaleRule).toBe("no_spread");
    expect(report.points).toEqual(Array(4).fill({ value: 5, modifiedZ: 0, outlier: false, tukey: "none" }));
  });

  it("no spread measurable yet a value differs (a subnormal gap underflows): flagged, with modifiedZ null, never Infinity", () => {
    // MAD = 0, and meanAD = 5e-324 / 5 underflows to 0.
    const report = describeFlags([0, 0, 0, 0, 5e-324]);
    expect(report.zScaleRule).toBe("no_spread");
    expect(report.points[4]).toMatchObject({ modifiedZ: null, outlier: true });
    expect(report.points[0]).toMatchObject({ modifiedZ: 0, outlier: false });
  });
});

// Tukey, Exploratory Data Analysis (1977); NIST e-Handbook §7.1.6: inner fences Q1 − 1.5·IQR and
// Q3 + 1.5·IQR (beyond = mild), outer fences with 3·IQR (beyond = extreme).
// The NIST §7.1.6 example (N = 90: Q1 429.75, Q3 742.25, fences −39.0 / 1211.0) takes quartiles at
// p(N+1), which is Hyndman–Fan type 6, so it does not reproduce with our type 7 quartiles and is
// deliberately not used here. The type 7 fences below are worked by hand (Hyndman & Fan 1996, definition 7).
describe("Tukey's fences (Tukey 1977; NIST §7.1.6) with type 7 quartiles", () => {
  it("[10.9, 11, 11, 11.1, 11.2, 25]: inner fences 10.7375 / 11.4375 and 25 is extreme", () => {
    const { fences, points } = describeFlags(CHECK_SET);
    expect(fences!.innerLow).toBeCloseTo(10.7375, 12);
    expect(fences!.innerHigh).toBeCloseTo(11.4375, 12);
    // Outer: 11 − 3 × 0.175 = 10.475 and 11.175 + 0.525 = 11.7.
    expect(fences!.outerLow).toBeCloseTo(10.475, 12);
    expect(fences!.outerHigh).toBeCloseTo(11.7, 12);
    expect(points.map((p) => p.tukey)).toEqual(["none", "none", "none", "none", "none", "extreme"]);
  });

  it("mild between the fences, none on a fence (worked by hand: [1..10, x] has Q1 3.5, Q3 8.5, IQR 5)", () => {
    // Type 7 on 11 values: Q1 at h = 2.5 → 3 + 0.5·(4 − 3) = 3.5; Q3 at h = 7.5 → 8.5. Above: inner 8.5 + 7.5 = 16, outer 8.5 + 15 = 23.5.
    const tail = (x: number) => flagPoints([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, x])[10].tukey;
    expect(tail(16)).toBe("none");
    expect(tail(20)).toBe("mild");
    expect(tail(23.5)).toBe("mild"); // on the outer fence: not beyond it
    expect(tail(24)).toBe("extreme");
    expect(tukeyFences(3.5, 8.5)).toEqual({ innerLow: -4, innerHigh: 16, outerLow: -11.5, outerHigh: 23.5 });
  });

  it("IQR = 0: the fences sit on the quartiles, so [11, 11, 11, 11, 12] marks 12 extreme (Tukey's rule as written)", () => {
    expect(flagPoints([11, 11, 11, 11, 12]).map((p) => p.tukey)).toEqual(["none", "none", "none", "none", "extreme"]);
  });
});

describe("defined behaviour at the edges", () => {
  it("n = 0 gives no points", () => {
    expect(describeFlags([])).toEqual({ zScaleRule: "too_few", fences: null, points: [] });
  });

  it("n < 3 flags nothing, however far apart the values are", () => {
    expect(flagPoints([1, 1000])).toEqual([
      { value: 1, modifiedZ: null, outlier: false, tukey: "none" },
      { value: 1000, modifiedZ: null, outlier: false, tukey: "none" },
    ]);
    expect(describeFlags([7]).zScaleRule).toBe("too_few");
  });

  it("keeps the caller's order and flags every copy of a tied value alike", () => {
    const points = flagPoints([25, 11, 10.9, 11.2, 11, 11.1]);
    expect(points.map((p) => p.value)).toEqual([25, 11, 10.9, 11.2, 11, 11.1]);
    expect(points[0].outlier).toBe(true);
    expect(points[1]).toEqual(points[4]);
  });

  it("never returns NaN or Infinity, and outlier agrees with |M| > 3.5 (fast-check)", () => {
    const values = fc.oneof(
      fc.array(fc.double({ min: -1e9, max: 1e9, noNaN: true, noDefaultInfinity: true }), { maxLength: 80 }),
      fc.array(fc.integer({ min: -3, max: 3 }), { maxLength: 40 }),
    );
    fc.assert(
      fc.property(values, (xs) => {
        for (const p of flagPoints(xs)) {
          if (p.modifiedZ !== null) {
            expect(Number.isFinite(p.modifiedZ)).toBe(true);
            expect(p.outlier).toBe(Math.abs(p.modifiedZ) > 3.5);
          }
        }
      }),
    );
  });
});
