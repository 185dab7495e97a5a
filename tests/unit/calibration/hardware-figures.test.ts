import { describe, expect, it } from "vitest";
import { hardwareWorksheet, unwrapWorksheet } from "@/lib/calibration";
import { comparisonVerdict, figureOrigin, HARDWARE_FIELD_PATHS, hardwareFiguresFromRevision, hardwareWorksheetInput } from "@/lib/calibration/hardware-figures";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { DIVIDER, OHM } from "./sources";

const [VORNEL] = DEMO_FIRMWARE_FAMILIES; // V/V in fiftieths, mV/A in fiftieths: ÷11 is 11 / 0.02 = 550 steps, 25 mV/A is 25 / 0.02 = 1250

const shuntRevision = {
  dividerTopOhms: 10_000,
  dividerBottomOhms: 1_000,
  currentSensor: "shunt" as const,
  shuntMilliohms: 0.5,
  amplifierGain: 50,
  hallMvPerAmp: null,
  adcBits: 12,
  adcReferenceVolts: 3.3,
};

describe("from the hardware: a board revision row as the worksheet's figures", () => {
  it(`a known revision gives the whole input: ÷11 (${DIVIDER}) and 0.5 mΩ × 50 = 25 mV/A (${OHM})`, () => {
    const input = hardwareWorksheetInput(hardwareFiguresFromRevision(shuntRevision, 8), { published: { voltageScale: 550, currentScale: null } });
    expect(input).toEqual({
      divider: { topOhms: 10_000, bottomOhms: 1_000 },
      currentSensor: { kind: "shunt", shuntMilliohms: 0.5, amplifierGain: 50 },
      adc: { vrefVolts: 3.3, bits: 12 },
      maxCells: 8,
      published: { voltageScale: 550, currentScale: null },
      atAmps: null,
    });
    const sheet = unwrapWorksheet(hardwareWorksheet(input, VORNEL));
    expect(sheet.voltage!.nearestSetting).toBe(550);
    expect(sheet.voltage!.comparison!.differencePercent).toBeCloseTo(0, 12);
    expect(sheet.current!.nearestSetting).toBe(1250);
  });

  it("unknown parts (null in the record) are left out, not treated as zero", () => {
    const figures = hardwareFiguresFromRevision(
      { ...shuntRevision, dividerTopOhms: null, dividerBottomOhms: null, adcBits: null, adcReferenceVolts: null },
      null,
    );
    const input = hardwareWorksheetInput(figures);
    expect(input.divider).toBeNull();
    expect(input.adc).toBeNull();
    expect(unwrapWorksheet(hardwareWorksheet(input, VORNEL)).voltage).toBeNull();
  });

  it("no revision at all: every figure unknown, and the worksheet asks for a part", () => {
    const figures = hardwareFiguresFromRevision(null, null);
    expect(Object.values(figures).every((v) => v == null)).toBe(true);
    const r = hardwareWorksheet(hardwareWorksheetInput(figures), VORNEL);
    expect(!r.ok && r.errors.map((e) => e.field)).toEqual(["input"]);
  });

  it("half of a pair is asked for beside the missing input", () => {
    const figures = { ...hardwareFiguresFromRevision(shuntRevision, 6), dividerBottomOhms: null, amplifierGain: null };
    const r = hardwareWorksheet(hardwareWorksheetInput(figures), VORNEL);
    expect(!r.ok && r.errors.map((e) => e.field).sort()).toEqual([HARDWARE_FIELD_PATHS.amplifierGain, HARDWARE_FIELD_PATHS.dividerBottomOhms].sort());
  });

  it("a Hall sensor uses its mV/A and ignores stale shunt figures", () => {
    const figures = { ...hardwareFiguresFromRevision(shuntRevision, 6), currentSensor: "hall" as const, hallMvPerAmp: 40 };
    expect(hardwareWorksheetInput(figures).currentSensor).toEqual({ kind: "hall", mvPerAmp: 40 });
    expect(hardwareWorksheetInput({ ...figures, hallMvPerAmp: null }).currentSensor).toBeNull();
  });
});

describe("from the hardware: where a figure came from", () => {
  it.each([
    [1000, 1000, "board"],
    [1000, 1200, "typed"],
    [null, 1200, "typed"],
    [1000, null, "unknown"],
    [null, null, "unknown"],
  ] as const)("record %s, in force %s → %s", (board, inForce, origin) => {
    expect(figureOrigin(board, inForce)).toBe(origin);
  });
});

describe("from the hardware: what a difference from the published value means (thresholds: common practice, no source)", () => {
  it.each([
    // the differences are published ÷ nearest − 1 in per cent: 561 / 550 → 2, 590 / 550 → 7.3, 800 / 550 → 45.5, 1175 / 1250 → −6
    [550, 550, 0, "same-setting"],
    [550, 561, 2, "within-tolerance"],
    [550, 590, 7.3, "beyond-tolerance"],
    [550, 800, 45.5, "different-part"],
    [1250, 1175, -6, "beyond-tolerance"],
  ] as const)("parts %s, published %s (%s %) → %s", (nearest, published, differencePercent, verdict) => {
    expect(comparisonVerdict("voltage", nearest, { published, differencePercent }).verdict).toBe(verdict);
  });

  it("for current, a far difference mentions a stacked ESC's sensor", () => {
    expect(comparisonVerdict("current", 1250, { published: 2000, differencePercent: 60 }).message).toMatch(/stacked ESC/);
    expect(comparisonVerdict("voltage", 550, { published: 800, differencePercent: 45.5 }).message).not.toMatch(/stacked ESC/);
  });
});
