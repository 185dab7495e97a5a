import fc from "fast-check";
import { mean } from "simple-statistics";
import { describe, expect, it } from "vitest";
import { MAX_ABS_VALUE, StatsInputError, summarise } from "@/lib/stats";

const FIELDS = ["n", "median", "q1", "q3", "iqr", "mad", "scaledMad", "ciLow", "ciHigh", "ciCoverage", "state"];

describe("summarise(): defined behaviour for small n, even n and ties", () => {
  it("n = 0: every figure null, state too_few, never NaN", () => {
    const s = summarise([]);
    expect(Object.keys(s)).toEqual(expect.arrayContaining(FIELDS));
    expect(s).toMatchObject({
      n: 0,
      median: null,
      q1: null,
      q3: null,
      iqr: null,
      mad: null,
      scaledMad: null,
      ciLow: null,
      ciHigh: null,
      ciCoverage: null,
      state: "too_few",
    });
  });

  it("n = 1 and n = 2: centre and spread reported, state too_few, no CI", () => {
    expect(summarise([11.2])).toMatchObject({ n: 1, median: 11.2, q1: 11.2, q3: 11.2, iqr: 0, mad: 0, state: "too_few", ciLow: null });
    // Two values: median is their mean (type 7 at h = 0.5); quartiles at h = 0.25 and 0.75.
    expect(summarise([10, 12])).toMatchObject({ n: 2, median: 11, q1: 10.5, q3: 11.5, mad: 1, state: "too_few" });
  });

  it("n = 3 is the first 'ok'", () => {
    expect(summarise([1, 2, 30]).state).toBe("ok");
  });

  it("even n: the median is the mean of the two middle values (simple-statistics `mean` on them)", () => {
    const s = summarise([110, 104, 108, 112, 106, 109]);
    expect(s.median).toBe(mean([108, 109]));
  });

  it("ties: [3, 3, 3, 7] has median 3, MAD 0 and a CI that is still defined when n ≥ 6", () => {
    expect(summarise([3, 3, 3, 7])).toMatchObject({ median: 3, q1: 3, q3: 4, mad: 0, scaledMad: 0 });
    const many = summarise([5, 5, 5, 5, 5, 5, 5, 5, 5, 5]);
    expect(many).toMatchObject({ median: 5, mad: 0, ciLow: 5, ciHigh: 5, state: "ok" });
    expect(many.ciRanks).toMatchObject({ lower: 2, upper: 9 });
  });

  it("never returns NaN or Infinity, and the figures are ordered (fast-check)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -MAX_ABS_VALUE, max: MAX_ABS_VALUE, noNaN: true }), { maxLength: 120 }), (xs) => {
        const s = summarise(xs);
        for (const key of FIELDS) {
          const v = (s as unknown as Record<string, unknown>)[key];
          if (typeof v === "number") expect(Number.isFinite(v)).toBe(true);
        }
        if (s.n > 0) {
          expect(s.q1!).toBeLessThanOrEqual(s.median!);
          expect(s.median!).toBeLessThanOrEqual(s.q3!);
          expect(s.mad!).toBeGreaterThanOrEqual(0);
        }
      }),
    );
  });

  it("does not reorder the caller's array", () => {
    const xs = [3, 1, 2];
    summarise(xs);
    expect(xs).toEqual([3, 1, 2]);
  });
});

describe("summarise(): bad input names the entry", () => {
  it.each([
    [[1, Number.NaN], "values[1]: must be a number"],
    [[Infinity], "values[0]: must be finite"],
    [[1, 2, "3"], "values[2]: must be a number"],
    [[2e12], "values[0]: must be between"],
  ])("%j → %s", (xs, message) => {
    expect(() => summarise(xs as number[])).toThrow(StatsInputError);
    expect(() => summarise(xs as number[])).toThrow(message);
  });

  it("a non-array is refused with the field named", () => {
    try {
      summarise("1,2,3" as unknown as number[]);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(StatsInputError);
      expect((e as StatsInputError).field).toBe("values");
    }
  });
});
