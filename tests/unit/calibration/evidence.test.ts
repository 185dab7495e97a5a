import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import fc from "fast-check";
import { linearRegression, sampleCorrelation } from "simple-statistics";
import { describe, expect, it } from "vitest";
import {
  EVIDENCE_TOLERANCE,
  OFFSET_TOLERANCE_FLOOR_AMPS,
  OFFSET_TOLERANCE_FLOOR_STEPS,
  offsetFloorSteps,
  impliedCurrentScaleFromCycle,
  impliedFromBench,
  impliedVoltageScale,
  summariseEvidence,
  type EvidenceUnits,
} from "@/lib/calibration/evidence";
import { LineFitError, fitLine } from "@/lib/calibration/least-squares";
import {
  currentScaleSettingFromSensitivity,
  dividerRatio,
  ratioFromVoltageScaleSetting,
  sensitivityFromCurrentScaleSetting,
  shuntSensitivityMvPerAmp,
  voltageScaleSettingFromRatio,
} from "@/lib/calibration/units";
import { offsetSetting } from "@/seeders/demo/catalogue";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";

// Outside references are named beside each checked value.
const RECHARGE_SOURCE = "fly-and-recharge rule (common practice, no source)";
const DIVIDER_SOURCE = "voltage divider Vout = Vin·R2/(R1+R2), Horowitz & Hill 3rd ed. §1.2.3 (from memory)";
const OHM_SOURCE = "Ohm's law: sensitivity = R_shunt × gain";
const ANSCOMBE_SOURCE = "Anscombe, 'Graphs in Statistical Analysis', The American Statistician 27(1), 1973";

// The three demo families cover every unit pair: V/V + mV/A + mV, V/V + A/V + mA, mV/V + mV/A + mV.
// Their steps (seeders/demo/firmware-families.ts): V/V 0.02, mV/A 0.02, mV 0.5; V/V 0.025, A/V 0.005, mA 10;
// mV/V 0.05, mV/A 0.04, mV 0.25. So ÷11 is 550 steps of the first, 25 mV/A 1250 steps and 40 mV/A 2000.
const [VV_MVA_MV, VV_AV_MA, MVV_MVA_MV] = DEMO_FIRMWARE_FAMILIES;
const units = (f: (typeof DEMO_FIRMWARE_FAMILIES)[number]): EvidenceUnits & typeof f => f;

describe(`voltage check — ${DIVIDER_SOURCE}`, () => {
  // 10 k / 1 k divides by 11: 16.8 V reaches the pin as 1.527273 V (divider formula, by hand)
  const ratioTrue = dividerRatio(10_000, 1_000);
  const packVolts = 16.8;

  it("the pin voltage of the worked example is the table's", () => {
    expect(packVolts / ratioTrue).toBeCloseTo(1.527273, 6);
  });

  it.each([VV_MVA_MV, MVV_MVA_MV])("$slug ($voltageScaleUnit, $voltageScaleResponse): a wrong scale's reading implies the true setting", (family) => {
    const trueSetting = voltageScaleSettingFromRatio(ratioTrue, family);
    const used = Math.round(trueSetting * 0.9);
    // the firmware multiplies the pin voltage by the ratio its setting stands for
    const reported = (packVolts / ratioTrue) * ratioFromVoltageScaleSetting(used, family);
    expect(impliedVoltageScale(used, reported, packVolts, family.voltageScaleResponse)).toBeCloseTo(trueSetting, 9);
  });

  it("proportional: new = old × measured ÷ reported; inverse divides instead (common practice, no source)", () => {
    expect(impliedVoltageScale(500, 15.2727, 16.8, "proportional")).toBeCloseTo((500 * 16.8) / 15.2727, 12);
    expect(impliedVoltageScale(2000, 15.2727, 16.8, "inverse")).toBeCloseTo((2000 * 15.2727) / 16.8, 12);
  });
});

describe(`fly-and-recharge cycles — ${RECHARGE_SOURCE}`, () => {
  it("inverse unit: next scale = old × reported mAh ÷ charged mAh", () => {
    expect(impliedCurrentScaleFromCycle({ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300 }, "inverse")).toBeCloseTo((2000 * 1200) / 1300, 12);
  });

  it("proportional unit: the rule inverts (old × charged ÷ reported)", () => {
    expect(impliedCurrentScaleFromCycle({ scaleUsed: 4800, reportedMah: 1200, chargedMah: 1300 }, "proportional")).toBeCloseTo((4800 * 1300) / 1200, 12);
  });

  // A 0.5 mΩ shunt behind a ×50 amplifier is 25 mV/A (Ohm's law).
  const sensitivity = shuntSensitivityMvPerAmp(0.5, 50);
  it.each([VV_MVA_MV, VV_AV_MA])(`$slug ($currentScaleUnit): a simulated cycle on a 25 mV/A sensor (${OHM_SOURCE}) implies its setting`, (family) => {
    expect(sensitivity).toBe(25);
    const trueSetting = currentScaleSettingFromSensitivity(sensitivity, family);
    const used = Math.round(currentScaleSettingFromSensitivity(40, family)); // set as if it were 40 mV/A
    const chargedMah = 1300;
    // displayed current = true current × true sensitivity ÷ assumed sensitivity, integrated over the flight
    const reportedMah = (chargedMah * sensitivity) / sensitivityFromCurrentScaleSetting(used, family);
    expect(impliedCurrentScaleFromCycle({ scaleUsed: used, reportedMah, chargedMah }, family.currentScaleResponse)).toBeCloseTo(trueSetting, 9);
  });
});

describe(`bench points — least squares; ${OHM_SOURCE}`, () => {
  const sensitivity = shuntSensitivityMvPerAmp(0.5, 50); // 25 mV/A
  const zeroErrorMv = 12;
  const currents = [2, 5, 10, 20, 40];

  /** What the firmware displays with the given settings, by the reading model in evidence.ts. */
  function displayed(family: typeof VV_MVA_MV, scaleUsed: number, offsetUsed: number, amps: number): number {
    const volts = sensitivity * amps + zeroErrorMv; // mV out of the sensor, Ohm's law
    const assumed = sensitivityFromCurrentScaleSetting(scaleUsed, family);
    const offset = offsetUsed * family.currentOffsetStep;
    return family.currentOffsetUnit === "mV" ? (volts - offset) / assumed : volts / assumed - offset / 1000;
  }

  it.each([VV_MVA_MV, VV_AV_MA, MVV_MVA_MV])("$slug ($currentScaleUnit, offset in $currentOffsetUnit): recovers the true scale and offset", (family) => {
    const scaleUsed = Math.round(currentScaleSettingFromSensitivity(40, family));
    const offsetUsed = Math.round((family.currentOffsetUnit === "mA" ? 100 : 5) / family.currentOffsetStep); // 100 mA or 5 mV, in the family's steps
    const points = currents.map((measuredAmps) => ({ measuredAmps, reportedAmps: displayed(family, scaleUsed, offsetUsed, measuredAmps) }));
    const implied = impliedFromBench({ scaleUsed, offsetUsed, points }, family);
    expect(implied.impliedScale).toBeCloseTo(currentScaleSettingFromSensitivity(sensitivity, family), 6);
    // the offset the demo scenario would store for this sensor (seeders/demo/catalogue.ts reads offsets the same way)
    const truth = { ratio: 11, sensitivityMvPerAmp: sensitivity, zeroErrorMv, ratioPublished: true, sensitivityPublished: true };
    expect(implied.impliedOffset).toBeCloseTo(offsetSetting(truth, family), 6);
    expect(implied.r).toBeCloseTo(1, 12);
  });

  it("the gain and intercept are simple-statistics linearRegression of reported on measured", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: 0, max: 200, noNaN: true }), fc.double({ min: -5, max: 300, noNaN: true })), { minLength: 2, maxLength: 12 }),
        (pairs) => {
          fc.pre(Math.max(...pairs.map((p) => p[0])) - Math.min(...pairs.map((p) => p[0])) > 1e-3);
          const points = pairs.map(([measuredAmps, reportedAmps]) => ({ measuredAmps, reportedAmps }));
          fc.pre(linearRegression(pairs).m > 1e-3);
          const got = impliedFromBench({ scaleUsed: 2000, offsetUsed: 0, points }, VV_MVA_MV);
          const ref = linearRegression(pairs);
          expect(got.gain).toBeCloseTo(ref.m, 9);
          expect(got.interceptAmps).toBeCloseTo(ref.b, 9);
        },
      ),
    );
  });
});

describe(`least squares — ${ANSCOMBE_SOURCE}, data from the npm package vega-datasets`, () => {
  // vega-datasets is ESM with only "." exported; read the file beside its build
  const require = createRequire(__filename);
  const file = path.join(path.dirname(require.resolve("vega-datasets")), "../data/anscombe.json");
  const rows = JSON.parse(readFileSync(file, "utf8")) as { Series: string; X: number; Y: number }[];
  const series = (name: string) => rows.filter((r) => r.Series === name).map((r) => [r.X, r.Y] as const);

  it("the package ships 44 rows in four sets of 11", () => {
    expect(rows).toHaveLength(44);
    for (const s of ["I", "II", "III", "IV"]) expect(series(s)).toHaveLength(11);
  });

  // computed from the package's data, which has Y = 4.81 at X = 7 in set I (published: 4.82)
  it.each([
    ["I", 0.5003, 2.9975, 0.8162],
    ["II", 0.5, 3.0009, 0.8162],
    ["III", 0.4997, 3.0025, 0.8163],
    ["IV", 0.4999, 3.0017, 0.8165],
  ])("set %s: slope %s, intercept %s, r %s — and the published 0.500 / 3.00 / 0.816", (name, slope, intercept, r) => {
    const fit = fitLine(series(name));
    expect(Math.abs(fit.slope - slope)).toBeLessThan(0.0001);
    expect(Math.abs(fit.intercept - intercept)).toBeLessThan(0.0001);
    expect(Math.abs(fit.r! - r)).toBeLessThan(0.0001);
    // the published figures, at their published rounding
    expect(Math.abs(fit.slope - 0.5)).toBeLessThanOrEqual(0.001);
    expect(Math.abs(fit.intercept - 3)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(fit.r! - 0.816)).toBeLessThanOrEqual(0.001);
    expect(fit.r).toBeCloseTo(
      sampleCorrelation(
        series(name).map((p) => p[0]),
        series(name).map((p) => p[1]),
      ),
      12,
    );
  });

  it("refuses what no line can be fitted through, saying why", () => {
    expect(() => fitLine([[1, 2]])).toThrowError(LineFitError);
    expect(() =>
      fitLine([
        [5, 1],
        [5, 2],
      ]),
    ).toThrowError(/different currents/);
    expect(
      fitLine([
        [1, 3],
        [2, 3],
      ]),
    ).toMatchObject({ slope: 0, intercept: 3, r: null });
  });

  it("an exact line is recovered whatever its slope and intercept", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 10, noNaN: true }), fc.double({ min: -100, max: 100, noNaN: true }), (m, b) => {
        const fit = fitLine([0, 1, 2.5, 7].map((x) => [x, m * x + b] as const));
        expect(fit.slope).toBeCloseTo(m, 9);
        expect(fit.intercept).toBeCloseTo(b, 9);
      }),
    );
  });
});

describe(`mismatch flag — a ${EVIDENCE_TOLERANCE * 100} % tolerance (our own rule, common practice)`, () => {
  const family = units(VV_MVA_MV);
  const base = { voltageScale: null, currentScale: null, currentOffset: null, voltageCheck: null, cycles: [], bench: null };

  it("a claimed voltage scale within 2 % of the implied one passes, beyond it is flagged", () => {
    const voltageCheck = { scaleUsed: 500, readings: [{ cells: 4, reportedVolts: 16, measuredVolts: 16.8, measuredAt: "main_lead" }] };
    // implied: 500 × 16.8 / 16 = 525; 535 is 1.9 % over it, 536 is 2.1 %
    const ok = summariseEvidence({ ...base, voltageScale: 535, voltageCheck }, family);
    expect(ok.voltage!.implied).toBeCloseTo(525, 12);
    expect(ok.mismatch).toBe(false);
    const off = summariseEvidence({ ...base, voltageScale: 536, voltageCheck }, family);
    expect(off.mismatch).toBe(true);
    expect(off.checks[0]).toMatchObject({ quantity: "voltage_scale", source: "voltage_check", claimed: 536 });
    expect(off.checks[0].relativeDifference).toBeCloseTo(11 / 525, 12);
  });

  it("several cycles combine by their median, so one misread cycle does not move it", () => {
    const cycles = [
      { scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 4 }, // implies 1846.2
      { scaleUsed: 1850, reportedMah: 1290, chargedMah: 1300, ratedMah: 1500, cells: 4 }, // implies 1835.8
      { scaleUsed: 1840, reportedMah: 600, chargedMah: 1300, ratedMah: 1500, cells: 4 }, // misread: implies 849.2
    ];
    const s = summariseEvidence({ ...base, currentScale: 1835, cycles }, family);
    expect(s.cycles!.perCycle).toHaveLength(3);
    expect(s.cycles!.implied).toBeCloseTo((1850 * 1290) / 1300, 9);
    expect(s.mismatch).toBe(false);
  });

  it(`an offset may differ by ${OFFSET_TOLERANCE_FLOOR_STEPS} steps near zero before it is flagged`, () => {
    const points = [0, 10, 20].map((measuredAmps) => ({ measuredAmps, reportedAmps: measuredAmps + 0.1 })); // intercept 0.1 A
    const bench = { scaleUsed: 1250, offsetUsed: 0, points };
    // mV family: new offset = 0 + 0.1 A × 25 mV/A = 2.5 mV = 5 steps of 0.5 mV; 14 is 9 steps away and passes,
    // 16 is 11 away and does not (15 would sit on the floor itself, where the fit's last bit decides)
    const near = summariseEvidence({ ...base, currentScale: 1250, currentOffset: 14, bench }, family);
    expect(near.bench!.impliedOffset).toBeCloseTo(5, 9);
    expect(near.checks.map((c) => c.mismatch)).toEqual([false, false]);
    const far = summariseEvidence({ ...base, currentScale: 1250, currentOffset: 16, bench }, family);
    expect(far.checks.find((c) => c.quantity === "current_offset")!.mismatch).toBe(true);
  });

  it(`an offset counted in mA may differ by what moves the display ${OFFSET_TOLERANCE_FLOOR_AMPS} A (an OSD shows current to 0.1 A: common practice, no source)`, () => {
    const ma = units(VV_AV_MA); // A/V scale in steps of 0.005 (8000 = 40 A/V = 25 mV/A), offset in mA steps of 10
    expect(ma.currentOffsetUnit).toBe("mA");
    expect(offsetFloorSteps(8000, ma)).toBeCloseTo((OFFSET_TOLERANCE_FLOOR_AMPS * 1000) / ma.currentOffsetStep, 9);
    // display reads 0.05 A high at every load, the scale right: the fit puts the offset 50 mA off,
    // inside what a 0.1 A display can tell, so a claim of the offset in force is not flagged
    const points = [0, 10, 20].map((measuredAmps) => ({ measuredAmps, reportedAmps: measuredAmps + 0.05 }));
    const bench = { scaleUsed: 8000, offsetUsed: 0, points };
    const s = summariseEvidence({ ...base, currentScale: 8000, currentOffset: 0, bench }, ma);
    expect(Math.abs(s.bench!.impliedOffset)).toBeCloseTo(50 / ma.currentOffsetStep, 6);
    expect(s.offsetToleranceFloorSteps).toBeCloseTo(100 / ma.currentOffsetStep, 9);
    expect(s.checks.find((c) => c.quantity === "current_offset")!.mismatch).toBe(false);
    // 0.3 A off is more than the display's resolution: flagged
    const far = summariseEvidence(
      { ...base, currentScale: 8000, currentOffset: 0, bench: { ...bench, points: [0, 10, 20].map((m) => ({ measuredAmps: m, reportedAmps: m + 0.3 })) } },
      ma,
    );
    expect(far.checks.find((c) => c.quantity === "current_offset")!.mismatch).toBe(true);
  });

  it("the 0.1 A floor never makes an offset in mV stricter than the 10-step floor", () => {
    const mv = units(VV_MVA_MV);
    // 25 mV/A (1250 steps): 0.1 A is 2.5 mV = 5 steps of 0.5 mV, under 10 steps, so 10 steps stand
    expect(offsetFloorSteps(1250, mv)).toBe(Math.max(OFFSET_TOLERANCE_FLOOR_STEPS, (OFFSET_TOLERANCE_FLOOR_AMPS * 25) / mv.currentOffsetStep));
  });

  it("evidence with nothing claimed beside it is summarised but not checked", () => {
    const s = summariseEvidence({ ...base, voltageScale: 550, voltageCheck: null }, family);
    expect(s).toMatchObject({ voltage: null, cycles: null, bench: null, checks: [], mismatch: false });
  });
});
