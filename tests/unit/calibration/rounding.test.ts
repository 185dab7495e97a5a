import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { predictedReadingError, roundBothWays, safeRoundingSide } from "@/lib/calibration";
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
