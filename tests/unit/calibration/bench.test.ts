import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import fc from "fast-check";
import { linearRegression, rSquared, sampleCorrelation } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { currentScaleSettingFromSensitivity, sensitivityFromCurrentScaleSetting, shuntSensitivityMvPerAmp } from "@/lib/calibration/units";
import { BENCH_MIN_R_SQUARED, benchWorksheet, unwrapWorksheet } from "@/lib/calibration";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { ANSCOMBE, OHM, ROUNDING_SIDE, SIMPLE_STATISTICS } from "./sources";

const [VORNEL, SKELMAR, QUAYSEL] = DEMO_FIRMWARE_FAMILIES; // mV/A in 0.02 + mV in 0.5, A/V in 0.005 + mA in 10, mV/A in 0.04 + mV in 0.25

/** A Vornel bench input read at scale 1250 (25 mV/A / 0.02), offset 0, with these points as [measured, reported] amps. */
const at1250 = (...points: [number, number][]) => ({
  scaleUsed: 1250,
  offsetUsed: 0,
  points: points.map(([measuredAmps, reportedAmps]) => ({ measuredAmps, reportedAmps })),
});

describe(`bench fit against ${ANSCOMBE}, data from the npm package vega-datasets`, () => {
  // vega-datasets exports only "." (ESM, fetching from a CDN), not even its package.json: resolve
  // the package's build entry and read the JSON beside it from disk
  const require = createRequire(__filename);
  const file = path.join(path.dirname(require.resolve("vega-datasets")), "../data/anscombe.json");
  const rows = JSON.parse(readFileSync(file, "utf8")) as Array<{ Series: string; X: number; Y: number }>;
  const points = (series: string) => rows.filter((r) => r.Series === series).map((r) => ({ measuredAmps: r.X, reportedAmps: r.Y }));

  // Computed from the package's data (its set I has Y = 4.81 at X = 7; published 4.82), and the
  // published 0.500 / 3.00 / 0.816, at the published figures' rounding: slope ±0.001, intercept ±0.005, r ±0.001.
  it.each([
    ["I", 0.5003, 2.9975, 0.8162],
    ["II", 0.5, 3.0009, 0.8162],
    ["III", 0.4997, 3.0025, 0.8163],
    ["IV", 0.4999, 3.0017, 0.8165],
  ])("set %s: gain %s, intercept %s, r %s", (series, slope, intercept, r) => {
    const result = benchWorksheet({ scaleUsed: 1250, offsetUsed: 0, points: points(series) }, VORNEL);
    const { fit, residuals } = unwrapWorksheet(result);
    expect(fit.n).toBe(11);
    for (const [got, want, tol] of [
      [fit.gain, slope, 0.001],
      [fit.interceptAmps, intercept, 0.005],
      [fit.r!, r, 0.001],
      [fit.gain, 0.5, 0.001],
      [fit.interceptAmps, 3.0, 0.005],
      [fit.r!, 0.816, 0.001],
    ] as const) {
      expect(Math.abs(got - want)).toBeLessThanOrEqual(tol);
    }
    // r² is the same figure both ways for a line with an intercept
    expect(fit.rSquared).toBeCloseTo(fit.r! ** 2, 12);
    // least-squares residuals sum to zero
    expect(residuals.reduce((s, p) => s + p.residualAmps, 0)).toBeCloseTo(0, 9);
    // r² ≈ 0.67 is far from a linear sensor's: the worksheet says so
    expect(result.warnings.map((w) => w.field)).toEqual(["points"]);
    expect(result.warnings[0].message).toContain(String(BENCH_MIN_R_SQUARED));
  });

  it(`agrees with ${SIMPLE_STATISTICS} on any points a bench could give`, () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(fc.double({ min: 0, max: 200, noNaN: true }), fc.double({ min: 0.5, max: 2, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true })),
          { minLength: 3, maxLength: 15 },
        ),
        (raw) => {
          const pairs = raw.map(([x, g, noise]) => [x, g * x + noise] as [number, number]);
          const xs = pairs.map((p) => p[0]);
          fc.pre(Math.max(...xs) - Math.min(...xs) > 20);
          const ref = linearRegression(pairs);
          fc.pre(ref.m >= 0.2 && ref.m <= 5 && pairs.every((p) => p[1] >= -1000));
          const got = unwrapWorksheet(
            benchWorksheet({ scaleUsed: 1250, offsetUsed: 0, points: pairs.map(([measuredAmps, reportedAmps]) => ({ measuredAmps, reportedAmps })) }, VORNEL),
          );
          expect(got.fit.gain).toBeCloseTo(ref.m, 9);
          expect(got.fit.interceptAmps).toBeCloseTo(ref.b, 9);
          expect(got.fit.rSquared).toBeCloseTo(
            rSquared(pairs, (x) => ref.m * x + ref.b),
            9,
          );
          expect(got.fit.r!).toBeCloseTo(
            sampleCorrelation(
              xs,
              pairs.map((p) => p[1]),
            ),
            9,
          );
        },
      ),
    );
  });
});

describe(`bench worksheet on a simulated sensor — ${OHM}; rounding: ${ROUNDING_SIDE}`, () => {
  const sensitivity = shuntSensitivityMvPerAmp(0.5, 50); // 25 mV/A
  const zeroErrorMv = 12;

  /** The display's current for given settings: I = (V − offset mV) ÷ s, or V ÷ s − offset mA (evidence.ts algebra). */
  function displayed(family: typeof VORNEL, scale: number, offset: number, amps: number) {
    const mv = sensitivity * amps + zeroErrorMv;
    const s = sensitivityFromCurrentScaleSetting(scale, family);
    const o = offset * family.currentOffsetStep;
    return family.currentOffsetUnit === "mV" ? (mv - o) / s : mv / s - o / 1000;
  }

  it.each([VORNEL, SKELMAR, QUAYSEL])(
    "$slug ($currentScaleUnit, offset in $currentOffsetUnit): the new scale over-reports, the new offset leaves the error it states",
    (family) => {
      const scaleUsed = Math.round(currentScaleSettingFromSensitivity(31, family)); // set as if 31 mV/A
      const offsetUsed = 3;
      const points = [3, 8, 15, 25, 40].map((measuredAmps) => ({ measuredAmps, reportedAmps: displayed(family, scaleUsed, offsetUsed, measuredAmps) }));
      const r = unwrapWorksheet(benchWorksheet({ scaleUsed, offsetUsed, points }, family));
      const trueScale = currentScaleSettingFromSensitivity(sensitivity, family);
      expect(r.scaleRounding.exact).toBeCloseTo(trueScale, 6);
      expect(r.fit.rSquared).toBeCloseTo(1, 12);
      for (const p of r.residuals) expect(Math.abs(p.residualAmps)).toBeLessThan(1e-9);
      // the safe rounding over-reports the current
      const chosen = r.scaleRounding.recommended.setting;
      expect(displayed(family, chosen, r.offset.exact, 30)).toBeGreaterThanOrEqual(30 - 1e-9);
      // at zero current with the exact scale and the whole-step offset, the display shows the stated error
      expect(displayed(family, r.scaleRounding.exact, r.offset.setting, 0)).toBeCloseTo(r.offset.displayedErrorAmpsAtZero, 9);
      expect(r.offset.setting).toBe(Math.round(r.offset.exact));
    },
  );

  it("two points fit exactly, and the worksheet says a third would show linearity", () => {
    const r = benchWorksheet(at1250([5, 5.2], [20, 20.5]), VORNEL);
    expect(r.ok).toBe(true);
    expect(r.warnings[0].message).toMatch(/add a third/);
  });

  it("carries the props-on cautions (model-flying club rules; smoke stopper common practice)", () => {
    const r = unwrapWorksheet(benchWorksheet(at1250([5, 5], [20, 20]), VORNEL));
    expect(r.cautions.map((c) => c.text).join(" ")).toMatch(/Remove the props.*eye protection.*Unplug the battery/s);
  });
});

describe("bench worksheet: field-level errors", () => {
  const errorsOf = (input: unknown) => {
    const r = benchWorksheet(input as never, VORNEL);
    expect(r.ok).toBe(false);
    return r.ok ? [] : r.errors;
  };
  const firstErrorAt1250 = (...points: [number, number][]) => errorsOf(at1250(...points))[0];

  it("at least 2 points, at distinct measured currents", () => {
    expect(errorsOf(at1250([5, 5]))).toEqual([{ field: "points", message: expect.stringMatching(/at least 2/) }]);
    expect(firstErrorAt1250([5, 5], [5, 6]).message).toMatch(/different clamp-meter currents/);
  });

  it("negative clamp-meter current, missing reported current, a fractional scale", () => {
    const errors = errorsOf({ scaleUsed: 1250.5, offsetUsed: 0, points: [{ measuredAmps: -1, reportedAmps: 5 }, { measuredAmps: 10 }] });
    expect(errors.map((e) => e.field)).toEqual(["scaleUsed", "points.0.measuredAmps", "points.1.reportedAmps"]);
  });

  it("a gain outside 0.2–5 cannot be the same current (our own rule, limits.ts)", () => {
    expect(firstErrorAt1250([1, 10], [2, 70]).message).toMatch(/outside 0\.2–5/);
    expect(firstErrorAt1250([1, 10], [2, 5]).field).toBe("points");
  });
});
