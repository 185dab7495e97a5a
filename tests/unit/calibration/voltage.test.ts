import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { dividerRatio, ratioFromVoltageScaleSetting, voltageScaleSettingFromRatio } from "@/lib/calibration/units";
import { unwrapWorksheet, VOLTAGE_TOLERANCE, voltageWorksheet } from "@/lib/calibration";
import { VOLTAGE_HIGH_ALLOWANCE } from "@/lib/calibration/rounding";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { DIVIDER, LIPO_BMFA } from "./sources";

const [VORNEL, SKELMAR, QUAYSEL] = DEMO_FIRMWARE_FAMILIES; // V/V in 0.02 (proportional), V/V in 0.025, mV/V in 0.05 (inverse)
// ÷11 (the divider formula, 10 k / 1 k) is 11 / 0.02 = 550 Vornel steps and (1000 / 11) / 0.05 = 1818.18 Quaysel steps
const VOLTAGE_RULE = "voltage scale moves with multimeter ÷ display (common practice, no source)";

/** What the OSD shows: the pin voltage (divider formula) times the ratio the setting stands for. */
function displayed(packVolts: number, trueRatio: number, setting: number, family: typeof VORNEL) {
  return (packVolts / trueRatio) * ratioFromVoltageScaleSetting(setting, family);
}

describe(`voltage worksheet — ${VOLTAGE_RULE}`, () => {
  it("proportional (V/V): next = current × measured ÷ reported", () => {
    const r = unwrapWorksheet(voltageWorksheet({ scaleUsed: 550, readings: [{ cells: 4, reportedVolts: 16.2, measuredVolts: 16.8 }] }, VORNEL));
    expect(r.impliedScale).toBeCloseTo((550 * 16.8) / 16.2, 12);
    expect(r.now.readingError).toBeCloseTo(16.2 / 16.8 - 1, 12);
    expect(r.now.errorVoltsPerCell).toBeCloseTo(-0.15, 12);
  });

  it("inverse (mV/V): the setting is 1000 ÷ ratio in steps, so next = current × reported ÷ measured", () => {
    const r = unwrapWorksheet(voltageWorksheet({ scaleUsed: 1818, readings: [{ cells: 4, reportedVolts: 16.2, measuredVolts: 16.8 }] }, QUAYSEL));
    expect(r.impliedScale).toBeCloseTo((1818 * 16.2) / 16.8, 12);
  });

  it.each([VORNEL, SKELMAR, QUAYSEL])(`$slug: a display set for ÷10 on a ÷11 board (${DIVIDER}) is brought back to ÷11`, (family) => {
    const trueRatio = dividerRatio(10_000, 1_000);
    const used = Math.round(voltageScaleSettingFromRatio(10, family));
    const readings = [16.8, 15.2, 14.8].map((v) => ({ cells: 4, measuredVolts: v, reportedVolts: displayed(v, trueRatio, used, family) }));
    const r = unwrapWorksheet(voltageWorksheet({ scaleUsed: used, readings }, family));
    expect(r.impliedScale).toBeCloseTo(voltageScaleSettingFromRatio(trueRatio, family), 9);
    expect(r.verdict).toBe("change");
    // the recommended whole step reads low, true, or at most VOLTAGE_HIGH_ALLOWANCE high (our own rule), within one step of exact
    expect(r.rounding.recommended.readingError!).toBeLessThanOrEqual(VOLTAGE_HIGH_ALLOWANCE);
    expect(Math.abs(r.rounding.recommended.setting - r.impliedScale)).toBeLessThan(1);
  });

  it("several pairs combine by their median, so one misread pair does not move it (least squares would)", () => {
    const good = [
      { cells: 4, reportedVolts: 16.0, measuredVolts: 16.8 },
      { cells: 4, reportedVolts: 15.0, measuredVolts: 15.75 },
    ];
    const misread = { cells: 4, reportedVolts: 15.0, measuredVolts: 16.5 }; // a slipped digit on the meter
    // 500 × 16.8 / 16.0 = 500 × 15.75 / 15.0 = 525; the misread pair alone would give 550
    const r = unwrapWorksheet(voltageWorksheet({ scaleUsed: 500, readings: [...good, misread] }, VORNEL));
    expect(r.impliedScale).toBeCloseTo(525, 9);
    const res = voltageWorksheet({ scaleUsed: 500, readings: [...good, misread] }, VORNEL);
    expect(res.warnings.map((w) => w.field)).toEqual(["readings"]);
  });

  it(`within ${VOLTAGE_TOLERANCE * 100} % the verdict is keep (common practice, no source)`, () => {
    const keep = unwrapWorksheet(voltageWorksheet({ scaleUsed: 550, readings: [{ cells: 6, reportedVolts: 25.0, measuredVolts: 25.2 }] }, VORNEL));
    expect(keep.now.withinTolerance).toBe(true);
    expect(keep.verdict).toBe("keep");
    expect(keep.message).toMatch(/keep 550/);
    // one answer: the headline, the recommendation and what Publish sends are the scale in force
    expect(keep.answer).toBe(550);
    const change = unwrapWorksheet(voltageWorksheet({ scaleUsed: 550, readings: [{ cells: 6, reportedVolts: 24.9, measuredVolts: 25.2 }] }, VORNEL));
    expect(change.verdict).toBe("change");
    expect(change.answer).toBe(change.rounding.recommended.setting);
    expect(change.message).toContain(`enter ${change.answer}`);
  });

  it("property: the exact setting from a simulated display is the true one, from up to ±30 % off", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(VORNEL, SKELMAR, QUAYSEL),
        fc.double({ min: 5, max: 20, noNaN: true }),
        fc.double({ min: 0.7, max: 1.3, noNaN: true }),
        fc.integer({ min: 1, max: 8 }),
        (family, trueRatio, off, cells) => {
          const trueSetting = voltageScaleSettingFromRatio(trueRatio, family);
          const used = Math.max(family.voltageScaleMin, Math.round(trueSetting * off));
          const measuredVolts = cells * 3.9;
          const r = voltageWorksheet(
            { scaleUsed: used, readings: [{ cells, measuredVolts, reportedVolts: displayed(measuredVolts, trueRatio, used, family) }] },
            family,
          );
          expect(r.ok).toBe(true); // ±30 % is well inside the reported-voltage slack
          expect(r.ok && r.value.impliedScale / trueSetting).toBeCloseTo(1, 9);
        },
      ),
    );
  });
});

describe(`voltage worksheet: implausible readings, field by field (2.5–4.35 V a cell: ${LIPO_BMFA}; HV full charge, common practice)`, () => {
  const errorsOf = (input: unknown) => {
    const r = voltageWorksheet(input as never, VORNEL);
    expect(r.ok).toBe(false);
    return r.ok ? [] : r.errors;
  };

  it("zero and negative voltages", () => {
    const errors = errorsOf({ scaleUsed: 550, readings: [{ cells: 4, reportedVolts: 0, measuredVolts: -16.8 }] });
    expect(errors.map((e) => e.field)).toEqual(["readings.0.reportedVolts", "readings.0.measuredVolts"]);
    expect(errors[0].message).toMatch(/more than 0 V/);
  });

  it("a multimeter voltage impossible for the cell count (a 4S pack is 10–17.4 V)", () => {
    const errors = errorsOf({
      scaleUsed: 550,
      readings: [
        { cells: 4, reportedVolts: 16.8, measuredVolts: 16.8 },
        { cells: 4, reportedVolts: 22, measuredVolts: 22.2 },
      ],
    });
    expect(errors).toEqual([{ field: "readings.1.measuredVolts", message: expect.stringMatching(/4S pack measures 10–17\.4 V/) }]);
    expect(errorsOf({ scaleUsed: 550, readings: [{ cells: 4, reportedVolts: 9.9, measuredVolts: 9.9 }] }).map((e) => e.field)).toEqual([
      "readings.0.measuredVolts",
    ]);
  });

  it("a reported voltage beyond even a badly set display's slack (lib/submissions/limits.ts)", () => {
    const errors = errorsOf({ scaleUsed: 550, readings: [{ cells: 4, reportedVolts: 60, measuredVolts: 16.8 }] });
    expect(errors.map((e) => e.field)).toEqual(["readings.0.reportedVolts"]);
    expect(errors[0].message).toMatch(/impossible for a 4S pack/);
  });

  it("settings: whole steps inside the family's range; cells: a whole count", () => {
    const errors = errorsOf({ scaleUsed: 550.5, readings: [{ cells: 3.5, reportedVolts: 12, measuredVolts: 12 }] });
    expect(errors.map((e) => e.field)).toEqual(["scaleUsed", "readings.0.cells"]);
    expect(errorsOf({ scaleUsed: 5, readings: [{ cells: 3, reportedVolts: 12, measuredVolts: 12 }] })[0].message).toMatch(/between 50 and 2500 in Vornel/);
  });

  it("missing and non-numeric figures, and no pairs at all", () => {
    expect(errorsOf({ scaleUsed: 550, readings: [] })).toEqual([{ field: "readings", message: expect.stringMatching(/at least one/) }]);
    const errors = errorsOf({ scaleUsed: "550", readings: [{ cells: 4, measuredVolts: "x" }] });
    expect(errors.map((e) => e.field)).toEqual(["scaleUsed", "readings.0.reportedVolts", "readings.0.measuredVolts"]);
    expect(errors[1].message).toBe("Enter the reported voltage");
  });

  it("a bad tolerance is named", () => {
    const r = voltageWorksheet({ scaleUsed: 550, readings: [{ cells: 4, reportedVolts: 16, measuredVolts: 16 }] }, VORNEL, 2);
    expect(!r.ok && r.errors[0].field).toBe("tolerance");
  });
});
