import { describe, expect, it } from "vitest";
import { CONFIDENCE_EXPLANATIONS, confidenceLabel, evidenceScore, recommendValue, relativeCiWidth, StatsInputError } from "@/lib/stats";
import { CONFIDENCE_TITLES } from "@/lib/vocabulary";

// Rounding to a whole setting: nearest, ties away from zero — the roundTiesToAway rule of IEEE Std
// 754-2008 §4.3.1 (from memory). The step comes from firmware_families.*_step.
describe("recommendValue(median, step)", () => {
  it("returns the whole setting and the value it stands for", () => {
    expect(recommendValue(11.04, 0.1)).toEqual({ setting: 110, value: 11, step: 0.1 });
    expect(recommendValue(401.7, 1)).toEqual({ setting: 402, value: 402, step: 1 });
    expect(recommendValue(23.9, 5)).toEqual({ setting: 5, value: 25, step: 5 });
  });

  it("a decimal midpoint rounds away from zero despite binary float (11.35 / 0.1 = 113.49999999999999)", () => {
    expect(11.35 / 0.1).toBeLessThan(113.5); // the float trap the 12-digit cut exists for
    expect(recommendValue(11.35, 0.1)).toMatchObject({ setting: 114, value: 11.4 });
    expect(recommendValue(4.35, 0.01)).toMatchObject({ setting: 435, value: 4.35 }); // 434.99999999999994 → 435
    expect(recommendValue(11.05, 0.1)).toMatchObject({ setting: 111, value: 11.1 });
    expect(recommendValue(-2.5, 1)).toMatchObject({ setting: -3 });
    expect(recommendValue(2.5, 1)).toMatchObject({ setting: 3 });
    expect(recommendValue(-0.2, 1)).toEqual({ setting: 0, value: 0, step: 1 }); // 0, not −0
  });

  it("can round up or down for callers that must err on one side", () => {
    expect(recommendValue(11.01, 0.1, "up")).toMatchObject({ setting: 111, value: 11.1 });
    expect(recommendValue(11.09, 0.1, "down")).toMatchObject({ setting: 110, value: 11 });
    expect(recommendValue(11.1, 0.1, "up")).toMatchObject({ setting: 111 }); // already on a step
  });

  it("no median (no data) gives null", () => {
    expect(recommendValue(null, 0.1)).toBeNull();
  });

  it("bad input names the field", () => {
    expect(() => recommendValue(11, 0)).toThrow(/^step: must be greater than 0/);
    expect(() => recommendValue(11, -1)).toThrow(/^step:/);
    expect(() => recommendValue(11, Number.NaN)).toThrow(/^step: must be a number/);
    expect(() => recommendValue(Number.POSITIVE_INFINITY, 1)).toThrow(/^median: must be finite/);
    expect(() => recommendValue(11, 1, "sideways" as "up")).toThrow(StatsInputError);
  });
});

// Confidence labels are our own definitions (lib/stats/confidence.ts), no outside source: these tests
// pin the documented thresholds, boundaries inclusive.
describe("confidence labels", () => {
  it("weighs clamp and fly-and-recharge evidence above a multimeter, unverified least", () => {
    expect(evidenceScore(["bench_clamp", "fly_recharge"])).toBe(1);
    expect(evidenceScore(["bench_clamp", "multimeter"])).toBeCloseTo(0.8, 12);
    expect(evidenceScore(["unverified"])).toBe(0.2);
    expect(evidenceScore([])).toBeNull();
    expect(() => evidenceScore(["guesswork" as "multimeter"])).toThrow(/^methods\[0\]:/);
  });

  it("relative CI width is (high − low) / |reference|, null without a CI or with a zero reference", () => {
    expect(relativeCiWidth(10.9, 11.2, 11.05)).toBeCloseTo(0.3 / 11.05, 12);
    expect(relativeCiWidth(-1, 1, -10)).toBeCloseTo(0.2, 12);
    expect(relativeCiWidth(null, null, 11)).toBeNull();
    expect(relativeCiWidth(-3, 2, 0)).toBeNull();
  });

  it("strong needs n ≥ 10, width ≤ 2 % and evidence ≥ 0.75 (boundaries included)", () => {
    expect(confidenceLabel({ n: 10, relativeCiWidth: 0.02, evidenceScore: 0.75 }).label).toBe("strong");
    expect(confidenceLabel({ n: 40, relativeCiWidth: 0.004, evidenceScore: 1 })).toMatchObject({ label: "strong", heldBackBy: [] });
  });

  it("fair needs n ≥ 6, width ≤ 5 % and evidence ≥ 0.5, and says what held it back", () => {
    const c = confidenceLabel({ n: 12, relativeCiWidth: 0.01, evidenceScore: 0.6 });
    expect(c.label).toBe("fair");
    expect(c.heldBackBy).toEqual(["too few values were measured against a reference"]);
    expect(confidenceLabel({ n: 6, relativeCiWidth: 0.05, evidenceScore: 0.5 }).label).toBe("fair");
    expect(confidenceLabel({ n: 9, relativeCiWidth: 0.01, evidenceScore: 1 }).label).toBe("fair");
  });

  it("weak otherwise: wide, no interval yet, or unchecked", () => {
    expect(confidenceLabel({ n: 30, relativeCiWidth: 0.08, evidenceScore: 1 }).label).toBe("weak");
    expect(confidenceLabel({ n: 30, relativeCiWidth: 0.01, evidenceScore: 0.2 }).label).toBe("weak");
    const few = confidenceLabel({ n: 4, relativeCiWidth: null, evidenceScore: 1 });
    expect(few.label).toBe("weak");
    expect(few.heldBackBy).toContain("no 95 % range for the middle value yet");
  });

  it("too few to judge below 3 values", () => {
    expect(confidenceLabel({ n: 2, relativeCiWidth: null, evidenceScore: 1 })).toMatchObject({ label: "too_few", title: "Too few to judge" });
    expect(confidenceLabel({ n: 0, relativeCiWidth: null, evidenceScore: null }).label).toBe("too_few");
  });

  it("every label has a title and a plain-words explanation for the UI", () => {
    for (const label of ["strong", "fair", "weak", "too_few"] as const) {
      expect(CONFIDENCE_TITLES[label].length).toBeGreaterThan(0);
      expect(CONFIDENCE_EXPLANATIONS[label].length).toBeGreaterThan(40);
    }
  });

  it("bad input names the field", () => {
    expect(() => confidenceLabel({ n: -1, relativeCiWidth: null, evidenceScore: null })).toThrow(/^n:/);
    expect(() => confidenceLabel({ n: 8, relativeCiWidth: -0.1, evidenceScore: null })).toThrow(/^relativeCiWidth:/);
    expect(() => confidenceLabel({ n: 8, relativeCiWidth: 0.01, evidenceScore: 1.5 })).toThrow(/^evidenceScore:/);
  });
});
