import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  UnitConversionError,
  currentScaleSettingFromSensitivity,
  dividerRatio,
  ratioFromVoltageScaleSetting,
  revisionDividerRatio,
  revisionSensitivityMvPerAmp,
  roundSetting,
  sensitivityFromCurrentScaleSetting,
  shuntSensitivityMvPerAmp,
  voltageScaleSettingFromRatio,
  type CurrentUnits,
  type VoltageUnits,
} from "@/lib/calibration/units";

// Worked examples are computed by hand from the formulas named in each describe.
const DIVIDER_SOURCE = "voltage divider formula Vout = Vin·R2/(R1+R2), Horowitz & Hill 3rd ed. §1.2.3 (from memory)";
const SHUNT_SOURCE = "Ohm's law, sensitivity = R_shunt × gain";

describe(`divider ratio — ${DIVIDER_SOURCE}`, () => {
  // Vin, R1 (top), R2 (bottom), Vout by the divider formula
  const table: Array<[number, number, number, number]> = [
    [16.8, 10_000, 1_000, 1.527273],
    [25.2, 100_000, 10_000, 2.290909],
    [33.6, 47_000, 4_700, 3.054545],
  ];

  it.each(table)("Vin %s V through %s / %s Ω gives the tabled Vout %s V", (vin, top, bottom, vout) => {
    expect(vin / dividerRatio(top, bottom)).toBeCloseTo(vout, 6);
  });

  it("a 10 k / 1 k pair divides by 11, not 10 ('1:10' is ambiguous: common practice, no source)", () => {
    expect(dividerRatio(10_000, 1_000)).toBe(11);
  });

  it("a revision without both resistors has no ratio (unknown stays unknown)", () => {
    expect(revisionDividerRatio({ dividerTopOhms: null, dividerBottomOhms: null })).toBeNull();
    expect(revisionDividerRatio({ dividerTopOhms: 10_000, dividerBottomOhms: null })).toBeNull();
    expect(revisionDividerRatio({ dividerTopOhms: 47_000, dividerBottomOhms: 4_700 })).toBeCloseTo(11, 12);
  });

  it("rejects non-positive resistors with the field named", () => {
    expect(() => dividerRatio(0, 1000)).toThrowError(/dividerTopOhms/);
    expect(() => dividerRatio(10_000, -1)).toThrowError(/dividerBottomOhms/);
    expect(() => dividerRatio(Number.NaN, 1000)).toThrowError(UnitConversionError);
  });
});

describe(`shunt and amplifier sensitivity — ${SHUNT_SOURCE}`, () => {
  // shunt mΩ, gain V/V, sensitivity mV/A, test current A, output V (Ohm's law, by hand)
  const table: Array<[number, number, number, number, number]> = [
    [0.5, 50, 25, 40, 1.0],
    [0.25, 20, 5, 100, 0.5],
  ];

  it.each(table)("%s mΩ × %s V/V = %s mV/A, so %s A reads %s V", (shunt, gain, sens, amps, volts) => {
    const s = shuntSensitivityMvPerAmp(shunt, gain);
    expect(s).toBeCloseTo(sens, 12);
    expect((s * amps) / 1000).toBeCloseTo(volts, 12);
  });

  it("a Hall sensor's mV/A is taken as is; a partly known shunt gives null", () => {
    expect(revisionSensitivityMvPerAmp({ currentSensor: "hall", shuntMilliohms: null, amplifierGain: null, hallMvPerAmp: 40 })).toBe(40);
    expect(revisionSensitivityMvPerAmp({ currentSensor: "shunt", shuntMilliohms: 0.5, amplifierGain: null, hallMvPerAmp: null })).toBeNull();
    expect(revisionSensitivityMvPerAmp({ currentSensor: null, shuntMilliohms: null, amplifierGain: null, hallMvPerAmp: null })).toBeNull();
    expect(revisionSensitivityMvPerAmp({ currentSensor: "shunt", shuntMilliohms: 0.5, amplifierGain: 50, hallMvPerAmp: null })).toBe(25);
  });

  it("rejects a zero gain with the field named", () => {
    expect(() => shuntSensitivityMvPerAmp(0.5, 0)).toThrowError(/amplifierGain/);
  });
});

describe("voltage scale setting in each unit (unit meanings: migrations/20261202000600)", () => {
  const vvTenth: VoltageUnits = { voltageScaleUnit: "V/V", voltageScaleStep: 0.1 };
  const vvHundredth: VoltageUnits = { voltageScaleUnit: "V/V", voltageScaleStep: 0.01 };
  const mvvTenth: VoltageUnits = { voltageScaleUnit: "mV/V", voltageScaleStep: 0.1 };

  it(`10 k / 1 k (÷11, ${DIVIDER_SOURCE}) is 110 steps of 0.1 V/V and 1100 steps of 0.01 V/V`, () => {
    const ratio = dividerRatio(10_000, 1_000);
    expect(voltageScaleSettingFromRatio(ratio, vvTenth)).toBeCloseTo(110, 9);
    expect(voltageScaleSettingFromRatio(ratio, vvHundredth)).toBeCloseTo(1100, 9);
  });

  it("÷11 in mV/V is 1000/11 = 90.909 mV per pack volt, i.e. 909.09 steps of 0.1 (the tabled 1.527273 V at 16.8 V)", () => {
    const setting = voltageScaleSettingFromRatio(11, mvvTenth);
    expect(setting).toBeCloseTo(909.0909, 3);
    // the ADC-pin voltage at 16.8 V follows from the mV/V figure: same Vout as the divider table
    expect((setting * 0.1 * 16.8) / 1000).toBeCloseTo(1.527273, 6);
  });

  it("the inverse gives the ratio back", () => {
    expect(ratioFromVoltageScaleSetting(110, vvTenth)).toBeCloseTo(11, 12);
    expect(ratioFromVoltageScaleSetting(1100, vvHundredth)).toBeCloseTo(11, 12);
    expect(ratioFromVoltageScaleSetting(909.0909090909, mvvTenth)).toBeCloseTo(11, 9);
  });

  it("names the bad field", () => {
    expect(() => voltageScaleSettingFromRatio(0, vvTenth)).toThrowError(/dividerRatio/);
    expect(() => ratioFromVoltageScaleSetting(-5, vvTenth)).toThrowError(/voltageScale:/);
    expect(() => voltageScaleSettingFromRatio(11, { voltageScaleUnit: "V/V", voltageScaleStep: 0 })).toThrowError(/voltageScaleStep/);
    expect(() => voltageScaleSettingFromRatio(11, { voltageScaleUnit: "volts" as never, voltageScaleStep: 1 })).toThrowError(/voltageScaleUnit/);
  });
});

describe(`current scale setting in each unit (${SHUNT_SOURCE})`, () => {
  const mvaTenth: CurrentUnits = { currentScaleUnit: "mV/A", currentScaleStep: 0.1 };
  const mvaHundredth: CurrentUnits = { currentScaleUnit: "mV/A", currentScaleStep: 0.01 };
  const avHundredth: CurrentUnits = { currentScaleUnit: "A/V", currentScaleStep: 0.01 };

  it("0.5 mΩ × 50 = 25 mV/A is 250 steps of 0.1 mV/A, 2500 of 0.01 mV/A, and 40 A/V = 4000 steps of 0.01", () => {
    const sens = shuntSensitivityMvPerAmp(0.5, 50);
    expect(currentScaleSettingFromSensitivity(sens, mvaTenth)).toBeCloseTo(250, 9);
    expect(currentScaleSettingFromSensitivity(sens, mvaHundredth)).toBeCloseTo(2500, 9);
    expect(currentScaleSettingFromSensitivity(sens, avHundredth)).toBeCloseTo(4000, 9);
  });

  it("0.25 mΩ × 20 = 5 mV/A is 200 A/V: 0.5 V of output at 100 A, as tabled", () => {
    const setting = currentScaleSettingFromSensitivity(shuntSensitivityMvPerAmp(0.25, 20), avHundredth);
    expect(setting).toBeCloseTo(20_000, 9);
    expect(100 / (setting * 0.01)).toBeCloseTo(0.5, 12); // amps ÷ (A/V) = volts
  });

  it("the inverse gives the sensitivity back", () => {
    expect(sensitivityFromCurrentScaleSetting(250, mvaTenth)).toBeCloseTo(25, 12);
    expect(sensitivityFromCurrentScaleSetting(4000, avHundredth)).toBeCloseTo(25, 12);
  });

  it("names the bad field", () => {
    expect(() => currentScaleSettingFromSensitivity(-1, mvaTenth)).toThrowError(/sensitivityMvPerAmp/);
    expect(() => sensitivityFromCurrentScaleSetting(0, avHundredth)).toThrowError(/currentScale:/);
    expect(() => currentScaleSettingFromSensitivity(25, { currentScaleUnit: "A" as never, currentScaleStep: 1 })).toThrowError(/currentScaleUnit/);
  });
});

describe("roundSetting", () => {
  it("rounds half away from zero, symmetric around 0, without -0", () => {
    expect(roundSetting(909.0909)).toBe(909);
    expect(roundSetting(2.5)).toBe(3);
    expect(roundSetting(-2.5)).toBe(-3);
    expect(Object.is(roundSetting(-0.2), 0)).toBe(true);
    expect(() => roundSetting(Number.POSITIVE_INFINITY)).toThrowError(/setting/);
  });
});

// Property: each conversion followed by its inverse is the identity (algebraic, no outside source).
describe("round trips (fast-check)", () => {
  const positive = fc.double({ min: 1e-3, max: 1e4, noNaN: true, noDefaultInfinity: true });
  const step = fc.constantFrom(0.001, 0.01, 0.1, 1);
  const voltageUnits = fc.record({ voltageScaleUnit: fc.constantFrom("V/V" as const, "mV/V" as const), voltageScaleStep: step });
  const currentUnits = fc.record({ currentScaleUnit: fc.constantFrom("mV/A" as const, "A/V" as const), currentScaleStep: step });
  const relClose = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));

  it("ratio -> voltage setting -> ratio", () => {
    fc.assert(
      fc.property(positive, voltageUnits, (ratio, fam) => relClose(ratioFromVoltageScaleSetting(voltageScaleSettingFromRatio(ratio, fam), fam), ratio)),
    );
  });

  it("sensitivity -> current setting -> sensitivity", () => {
    fc.assert(
      fc.property(positive, currentUnits, (sens, fam) =>
        relClose(sensitivityFromCurrentScaleSetting(currentScaleSettingFromSensitivity(sens, fam), fam), sens),
      ),
    );
  });

  it("a divider ratio is always above 1 and grows with the top resistor", () => {
    const ohms = fc.double({ min: 1, max: 1e6, noNaN: true, noDefaultInfinity: true });
    fc.assert(fc.property(ohms, ohms, (top, bottom) => dividerRatio(top, bottom) > 1 && dividerRatio(top * 2, bottom) > dividerRatio(top, bottom)));
  });
});
