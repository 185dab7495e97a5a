import { describe, expect, it } from "vitest";
import { adcCountToVolts, adcLsbVolts, hardwareWorksheet, packVoltsFromAdcCount, unwrapWorksheet, WorksheetInputError } from "@/lib/calibration";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { ADC, DIVIDER, OHM } from "./sources";

const [VORNEL, SKELMAR, QUAYSEL] = DEMO_FIRMWARE_FAMILIES; // V/V + mV/A in fiftieths, V/V in fortieths + A/V in 1/200ths, mV/V in twentieths + mV/A in 1/25ths

describe(`from the hardware: the divider — ${DIVIDER}`, () => {
  // worked by hand from the divider formula: Vin, R1, R2 → Vout
  it.each([
    [16.8, 10_000, 1_000, 1.527273],
    [25.2, 100_000, 10_000, 2.290909],
    [33.6, 47_000, 4_700, 3.054545],
  ])("%s V through %s / %s Ω gives %s V at the pin", (vin, r1, r2, vout) => {
    const { voltage } = unwrapWorksheet(hardwareWorksheet({ divider: { topOhms: r1, bottomOhms: r2 } }, VORNEL));
    expect(vin / voltage!.dividerRatio).toBeCloseTo(vout, 6);
    expect(voltage!.dividerRatio).toBeCloseTo(11, 12); // all three are ÷11: "1:10" is ambiguous
  });

  // steps from seeders/demo/firmware-families.ts: 11 / 0.02 = 550, 11 / 0.025 = 440, (1000 / 11) / 0.05 = 1818.18
  it("in each family's unit: ÷11 is 550 fiftieths of V/V, 440 fortieths, or 1818.18 twentieths of mV/V", () => {
    const divider = { topOhms: 10_000, bottomOhms: 1_000 };
    expect(unwrapWorksheet(hardwareWorksheet({ divider }, VORNEL)).voltage!.exactSetting).toBeCloseTo(550, 9);
    expect(unwrapWorksheet(hardwareWorksheet({ divider }, SKELMAR)).voltage!.exactSetting).toBeCloseTo(440, 9);
    const q = unwrapWorksheet(hardwareWorksheet({ divider }, QUAYSEL)).voltage!;
    expect(q.exactSetting).toBeCloseTo(20_000 / 11, 9); // 1000 mV / 11 at the pin per pack volt, in 0.05 mV steps
    expect(q.nearestSetting).toBe(1818);
  });

  it("compares with a published value in per cent of the hardware's", () => {
    const { voltage } = unwrapWorksheet(hardwareWorksheet({ divider: { topOhms: 10_000, bottomOhms: 1_000 }, published: { voltageScale: 561 } }, VORNEL));
    expect(voltage!.comparison!.differencePercent).toBeCloseTo((11 / 550) * 100, 9); // 561 against ÷11's 550 steps: +2 %
  });

  // Divider headroom with a 3.3 V ADC (derived from the divider formula): ÷10 saturates on a full
  // 8S HV pack (needs 10.55), ÷11 covers it.
  it("headroom: ÷11 covers 8S HV on a 3.3 V ADC, ÷10 does not (derived from the divider formula)", () => {
    const adc = { vrefVolts: 3.3, bits: 12 };
    const ok11 = hardwareWorksheet({ divider: { topOhms: 10_000, bottomOhms: 1_000 }, adc, maxCells: 8 }, VORNEL);
    expect(ok11.ok && ok11.value.voltage!.headroom).toMatchObject({ saturates: false });
    expect(ok11.ok && ok11.value.voltage!.headroom!.minimumRatio).toBeCloseTo(10.55, 2);
    expect(ok11.warnings).toEqual([]);
    const ok10 = hardwareWorksheet({ divider: { topOhms: 9_000, bottomOhms: 1_000 }, adc, maxCells: 8 }, VORNEL);
    expect(ok10.ok && ok10.value.voltage!.headroom!.saturates).toBe(true);
    expect(ok10.warnings.map((w) => w.field)).toEqual(["divider"]);
  });
});

describe(`from the hardware: the current sensor — ${OHM}`, () => {
  // worked by hand by Ohm's law: shunt × gain → sensitivity, output at a current, shunt dissipation
  it.each([
    [0.5, 50, 25, 40, 1.0, 0.8],
    [0.25, 20, 5, 100, 0.5, 2.5],
  ])("%s mΩ × %s V/V = %s mV/A; at %s A: %s V out, %s W in the shunt", (mohm, gain, mvPerAmp, amps, volts, watts) => {
    const { current } = unwrapWorksheet(
      hardwareWorksheet({ currentSensor: { kind: "shunt", shuntMilliohms: mohm, amplifierGain: gain }, atAmps: amps }, VORNEL),
    );
    expect(current!.sensitivityMvPerAmp).toBeCloseTo(mvPerAmp, 12);
    expect(current!.atAmps!.outputVolts).toBeCloseTo(volts, 12);
    expect(current!.atAmps!.shuntWatts).toBeCloseTo(watts, 12);
  });

  // 25 / 0.02 = 1250; 1000 / 25 = 40 A/V, / 0.005 = 8000; 7800 is 2.5 % under 8000
  it("25 mV/A is 1250 fiftieths of mV/A, or 40 A/V = 8000 two-hundredths of A/V", () => {
    const sensor = { kind: "shunt" as const, shuntMilliohms: 0.5, amplifierGain: 50 };
    expect(unwrapWorksheet(hardwareWorksheet({ currentSensor: sensor }, VORNEL)).current!.exactSetting).toBeCloseTo(1250, 9);
    expect(unwrapWorksheet(hardwareWorksheet({ currentSensor: sensor, published: { currentScale: 7800 } }, SKELMAR)).current).toMatchObject({
      nearestSetting: 8000,
      comparison: { published: 7800, differencePercent: -2.5 },
    });
  });

  it("a Hall sensor's datasheet mV/A is used as it is, with no shunt heat", () => {
    const { current } = unwrapWorksheet(hardwareWorksheet({ currentSensor: { kind: "hall", mvPerAmp: 40 }, atAmps: 50 }, QUAYSEL));
    // 40 mV/A / 0.04 mV/A a step = 1000 steps; 50 A × 40 mV/A = 2 V
    expect(current).toMatchObject({ sensitivityMvPerAmp: 40, nearestSetting: 1000, atAmps: { outputVolts: 2, shuntWatts: null } });
  });

  it("warns outside the 2–200 mV/A usual for hobby boards (common practice, no source) and when the amplifier clips the ADC", () => {
    const r = hardwareWorksheet(
      { currentSensor: { kind: "shunt", shuntMilliohms: 5, amplifierGain: 50 }, atAmps: 20, adc: { vrefVolts: 3.3, bits: 12 } },
      VORNEL,
    );
    expect(r.warnings.map((w) => w.field).sort()).toEqual(["atAmps", "currentSensor"]);
  });
});

describe("from the hardware: field-level errors", () => {
  it("names every bad field", () => {
    const r = hardwareWorksheet(
      { divider: { topOhms: 0, bottomOhms: -1 }, currentSensor: { kind: "shunt", shuntMilliohms: Number.NaN, amplifierGain: 50 }, maxCells: 2.5 },
      VORNEL,
    );
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors.map((e) => e.field).sort()).toEqual(["currentSensor.shuntMilliohms", "divider.bottomOhms", "divider.topOhms", "maxCells"]);
  });

  it("asks for at least one part", () => {
    const r = hardwareWorksheet({}, VORNEL);
    expect(!r.ok && r.errors).toEqual([{ field: "input", message: expect.stringContaining("divider") }]);
  });

  it("an unknown sensor kind is named", () => {
    const r = hardwareWorksheet({ currentSensor: { kind: "magic" } as never }, VORNEL);
    expect(!r.ok && r.errors[0].field).toBe("currentSensor.kind");
  });
});

describe(`ADC conversion — ${ADC}`, () => {
  const adc = { vrefVolts: 3.3, bits: 12 };

  it("12 bits, 3.3 V, count 2048 → 1.650000 V", () => {
    expect(adcCountToVolts(2048, adc).toFixed(6)).toBe("1.650000");
    expect(adcLsbVolts(adc)).toBe(3.3 / 4096);
  });

  it("12 bits, count 1896 through a ÷11 divider → 16.8029 V", () => {
    expect(packVoltsFromAdcCount(1896, adc, 11).toFixed(4)).toBe("16.8029");
  });

  it("uses 2^N, not 2^N − 1: the other convention differs by 0.024 % at 12 bits (IEEE Std 1241 form, from memory)", () => {
    const other = 3.3 / (2 ** 12 - 1);
    expect((other / adcLsbVolts(adc) - 1) * 100).toBeCloseTo(0.0244, 4);
  });

  it("refuses impossible counts and ADCs with the field named", () => {
    expect(() => adcCountToVolts(4096, adc)).toThrowError(WorksheetInputError);
    expect(() => adcCountToVolts(1.5, adc)).toThrowError(/^count: /);
    try {
      adcLsbVolts({ vrefVolts: -3.3, bits: 12.5 });
      expect.unreachable();
    } catch (e) {
      expect((e as WorksheetInputError).errors.map((x) => x.field)).toEqual(["adc.vrefVolts", "adc.bits"]);
    }
    expect(() => packVoltsFromAdcCount(100, adc, 0.5)).toThrowError(/^dividerRatio: /);
  });
});
