import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { predictedReadingError, roundBothWays, safeRoundingSide } from "@/lib/calibration";
import { VOLTAGE_HIGH_ALLOWANCE } from "@/lib/calibration/rounding";
import { ROUNDING_SIDE } from "./sources";

describe(`both roundings and the safe side — ${ROUNDING_SIDE}`, () => {
  it("inverse scale (mV/A): a smaller scale shows a larger current, so floor over-reports", () => {
    const r = roundBothWays(367.4, "inverse", "high");
    expect(r.down).toMatchObject({ setting: 367, reads: "high" });
    expect(r.down.readingError).toBeCloseTo(367.4 / 367 - 1, 12);
    expect(r.up).toMatchObject({ setting: 368, reads: "low" });
    expect(r.up.readingError).toBeCloseTo(367.4 / 368 - 1, 12);
    expect(r.safeSide).toBe("down");
    expect(r.recommended.setting).toBe(367);
  });

  it("proportional scale (A/V): the display grows with the scale, so ceil over-reports", () => {
    const r = roundBothWays(4012.3, "proportional", "high");
    expect(r.up.readingError).toBeCloseTo(4013 / 4012.3 - 1, 12);
    expect(r.safeSide).toBe("up");
    expect(r.recommended).toMatchObject({ setting: 4013, reads: "high" });
  });

  it("voltage reads low on its safe side: floor for V/V, ceil for mV/V", () => {
    expect(safeRoundingSide("proportional", "low")).toBe("down");
    expect(safeRoundingSide("inverse", "low")).toBe("up");
  });

  it("a setting that is whole to 12 digits is not pushed to its neighbour", () => {
    const r = roundBothWays(0.1 * 3 * 1000, "inverse", "high"); // 300.00000000000006
    expect(r.down.setting).toBe(300);
    expect(r.up.setting).toBe(300);
    expect(r.recommended).toMatchObject({ setting: 300, readingError: 0, reads: "true" });
  });

  it("flags a rounding outside the family's range", () => {
    expect(roundBothWays(9.5, "proportional", "high", { min: 10, max: 100 })).toMatchObject({ down: { withinRange: false }, up: { withinRange: true } });
  });

  it("property: the recommended rounding never reads on the unsafe side, and is at most one step away", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.constantFrom("inverse" as const, "proportional" as const),
        fc.constantFrom("high" as const, "low" as const),
        (exact, response, safe) => {
          const r = roundBothWays(exact, response, safe);
          expect(Math.abs(r.recommended.setting - exact)).toBeLessThanOrEqual(1);
          const err = predictedReadingError(r.recommended.setting, exact, response);
          if (safe === "high") expect(err).toBeGreaterThanOrEqual(-1e-9);
          else expect(err).toBeLessThanOrEqual(1e-9);
        },
      ),
    );
  });
});

// The voltage scale's rule (our own rule, from the daily-paths issue): the nearest whole step unless it
// reads high by more than VOLTAGE_HIGH_ALLOWANCE (0.1 %), then the step that reads lower. Worked by hand.
describe("voltage rounding: nearest step unless it reads more than 0.1 % high (our own rule)", () => {
  it("proportional (V/V): exact 105.9857 → 106, reading 0.0135 % high, beats 105 reading 0.93 % low", () => {
    const exact = 105 / (1 - 0.0093); // 105 reads 0.93 % low
    const r = roundBothWays(exact, "proportional", "low", undefined, VOLTAGE_HIGH_ALLOWANCE);
    expect(r.down.readingError).toBeCloseTo(-0.0093, 12);
    expect(r.up.readingError).toBeCloseTo(106 / exact - 1, 12);
    expect(r.up.readingError!).toBeLessThan(0.0002);
    expect(r.recommendedSide).toBe("up");
    expect(r.recommended.setting).toBe(106);
  });

  it("proportional (V/V): exact 105.8 → 105, since 106 would read 0.19 % high", () => {
    const r = roundBothWays(105.8, "proportional", "low", undefined, VOLTAGE_HIGH_ALLOWANCE);
    expect(r.up.readingError).toBeCloseTo(106 / 105.8 - 1, 12); // +0.189 %
    expect(r.recommended).toMatchObject({ setting: 105, reads: "low" });
  });

  it("inverse (mV/V): exact 250.02 → 250, reading 0.008 % high (250.02 ÷ 250 − 1), beats 251 reading 0.39 % low", () => {
    const r = roundBothWays(250.02, "inverse", "low", undefined, VOLTAGE_HIGH_ALLOWANCE);
    expect(r.down.readingError).toBeCloseTo(250.02 / 250 - 1, 12);
    expect(r.safeSide).toBe("up");
    expect(r.recommendedSide).toBe("down");
    expect(r.recommended.setting).toBe(250);
  });

  it("inverse (mV/V): exact 250.4 → 251 (nearest is 250, but it reads 0.16 % high)", () => {
    const r = roundBothWays(250.4, "inverse", "low", undefined, VOLTAGE_HIGH_ALLOWANCE);
    expect(r.recommended).toMatchObject({ setting: 251, reads: "low" });
  });

  it("property: within one step, never more than the allowance on the unsafe side, and the nearer step unless it errs past it", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 1e5, noNaN: true }),
        fc.constantFrom("inverse" as const, "proportional" as const),
        fc.constantFrom(0, VOLTAGE_HIGH_ALLOWANCE, 0.01),
        (exact, response, allowance) => {
          const r = roundBothWays(exact, response, "low", undefined, allowance);
          expect(Math.abs(r.recommended.setting - exact)).toBeLessThanOrEqual(1);
          expect(predictedReadingError(r.recommended.setting, exact, response)).toBeLessThanOrEqual(allowance + 1e-9);
          const other = r.recommendedSide === "down" ? r.up : r.down;
          if (Math.abs(other.setting - exact) < Math.abs(r.recommended.setting - exact)) expect(other.readingError!).toBeGreaterThan(allowance);
        },
      ),
    );
  });
});
