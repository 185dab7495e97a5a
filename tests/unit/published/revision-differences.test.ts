import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { dividerRatio, shuntSensitivityMvPerAmp } from "@/lib/calibration/units";
import {
  describeDifference,
  readingPhrase,
  revisionDifferences,
  type FamilyResponse,
  type QuantityFigures,
  type RevisionFacts,
} from "@/lib/published/revision-differences";

// Outside references:
//  - Ohm's law for a shunt read through an amplifier: sensitivity = R_shunt × gain (0.5 mΩ × 50 = 25 mV/A).
//  - Voltage divider formula Vout = Vin·R2/(R1+R2), Horowitz & Hill 3rd ed. §1.2.3 (from memory):
//    a 10 k / 1 k pair divides by 11.
//  - How a reading follows the setting: "proportional" for a divider ratio, "inverse" for mV/A
//    (the fly-and-recharge rule: common practice, no source).
//  - Non-overlapping 95 % intervals as a conservative sign of a real difference: Schenker &
//    Gentleman, The American Statistician 55(3), 2001 (from memory).

// As the demo families (seeders/demo/firmware-families.ts): Vornel's offset in 0.5 mV, Skelmar's in 10 mA.
const VORNEL_LIKE: FamilyResponse = {
  voltageScale: { response: "proportional" }, // divider ratio in V/V
  currentScale: { response: "inverse" }, // mV/A: more mV per amp means the firmware divides more
  currentOffset: { unit: "mV", step: 0.5 },
};
const SKELMAR_LIKE: FamilyResponse = {
  voltageScale: { response: "proportional" },
  currentScale: { response: "proportional" }, // A/V: more amps per volt means a bigger reading
  currentOffset: { unit: "mA", step: 10 },
};

const fig = (median: number, ciLow: number | null, ciHigh: number | null, n = 12): QuantityFigures => ({ n, median, ciLow, ciHigh });

function revision(label: string, position: number, over: Partial<RevisionFacts> = {}): RevisionFacts {
  return {
    label,
    position,
    dividerRatio: dividerRatio(10_000, 2_200),
    currentSensor: "shunt",
    shuntMilliohms: 0.5,
    amplifierGain: 50,
    sensitivityMvPerAmp: shuntSensitivityMvPerAmp(0.5, 50),
    values: null,
    ...over,
  };
}

describe("the demo's halved shunt (Tinsel 25 AIO v1 → v2), Ohm's law: 0.6 mΩ × 45 = 27 mV/A, 0.3 mΩ × 45 = 13.5 mV/A", () => {
  // figures as the seeded demo publishes them under the V/V + mV/A family (Vornel, steps of 0.02):
  // ÷6.56 (10 k / 1.8 k) is 327.8 steps, 27 mV/A 1350 and 13.5 mV/A 675; offsets near its default of −3
  const tinsel = { dividerRatio: dividerRatio(10_000, 1_800), shuntMilliohms: 0.6, amplifierGain: 45, sensitivityMvPerAmp: shuntSensitivityMvPerAmp(0.6, 45) };
  const v1 = revision("v1", 1, {
    ...tinsel,
    values: { voltageScale: fig(328, 327, 329), currentScale: fig(1347, 1330, 1362), currentOffset: fig(-3, -3, -1) },
  });
  const v2 = revision("v2", 2, {
    ...tinsel,
    shuntMilliohms: 0.3,
    sensitivityMvPerAmp: shuntSensitivityMvPerAmp(0.3, 45),
    values: { voltageScale: fig(328, 327, 329), currentScale: fig(683, 648, 700), currentOffset: fig(-3, -6, 1) },
  });

  const diffs = revisionDifferences([v2, v1], VORNEL_LIKE);

  it("raises exactly one note, on the current scale, from both the parts and the values", () => {
    expect(diffs).toHaveLength(1);
    const [d] = diffs;
    expect(d).toMatchObject({ quantity: "currentScale", a: "v1", b: "v2", valuesDisagree: true, published: { a: true, b: true } });
    expect(d.hardware).toEqual([{ part: "shunt", a: "0.6 mΩ", b: "0.3 mΩ" }]);
    // 13.5 / 27 mV/A: the v2 board makes half the sensor voltage per amp
    expect(d.readingRatio).toBeCloseTo(0.5, 12);
  });

  it("says it plainly from v2's side and from v1's", () => {
    expect(describeDifference(diffs[0], "v2")).toBe(
      "v2 reads about half the current of v1 at the same current scale (its shunt is 0.3 mΩ, v1's 0.6 mΩ; the published values differ too): use v2's values for a v2 board.",
    );
    expect(describeDifference(diffs[0], "v1")).toBe(
      "v1 reads about twice the current of v2 at the same current scale (its shunt is 0.6 mΩ, v2's 0.3 mΩ; the published values differ too): use v1's values for a v1 board.",
    );
  });

  it("without a parts list the values alone give the same answer under the inverse mV/A setting (683 / 1347 ≈ 0.51)", () => {
    const bare = { dividerRatio: null, currentSensor: null, shuntMilliohms: null, amplifierGain: null, sensitivityMvPerAmp: null };
    const [d] = revisionDifferences(
      [
        { ...v1, ...bare },
        { ...v2, ...bare },
      ],
      VORNEL_LIKE,
    );
    expect(d.hardware).toEqual([]);
    expect(d.readingRatio).toBeCloseTo(683 / 1347, 12);
    expect(describeDifference(d, "v2")).toBe(
      "v2 reads about half the current of v1 at the same current scale (their published values differ by more than their spread allows): use v2's values for a v2 board.",
    );
  });
});

describe("values only: which way the ratio goes depends on the family's response (fly-and-recharge rule, common practice)", () => {
  const a = revision("v1", 1, { values: { currentScale: fig(4018, 3807, 4158) } });
  const b = revision("v2", 2, { values: { currentScale: fig(7867, 7182, 8325) } });
  const same = { currentSensor: null, sensitivityMvPerAmp: null };

  it("proportional (A/V): b needs a bigger setting, so at a's setting it reads less: 4018 / 7867", () => {
    const [d] = revisionDifferences(
      [
        { ...a, ...same },
        { ...b, ...same },
      ],
      SKELMAR_LIKE,
    );
    expect(d.readingRatio).toBeCloseTo(4018 / 7867, 12);
  });

  it("inverse (mV/A): the same numbers read the other way: 7867 / 4018", () => {
    const [d] = revisionDifferences(
      [
        { ...a, ...same },
        { ...b, ...same },
      ],
      VORNEL_LIKE,
    );
    expect(d.readingRatio).toBeCloseTo(7867 / 4018, 12);
  });
});

describe("no note on noise or on missing evidence (non-overlap is the conservative test, Schenker & Gentleman 2001)", () => {
  // figures in Vornel's 0.02 steps: ÷11 is 550, 25 mV/A is 1250 (seeders/demo/firmware-families.ts)
  it("overlapping intervals raise nothing", () => {
    const a = revision("v1", 1, { values: { voltageScale: fig(550, 540, 560) } });
    const b = revision("v2", 2, { values: { voltageScale: fig(565, 555, 575) } });
    expect(revisionDifferences([a, b], VORNEL_LIKE)).toEqual([]);
  });

  it("touching intervals count as overlapping", () => {
    const a = revision("v1", 1, { values: { voltageScale: fig(550, 540, 555) } });
    const b = revision("v2", 2, { values: { voltageScale: fig(565, 555, 575) } });
    expect(revisionDifferences([a, b], VORNEL_LIKE)).toEqual([]);
  });

  it("without an interval (fewer than 6 values) far-apart medians raise nothing", () => {
    const a = revision("v1", 1, { values: { voltageScale: fig(550, null, null, 4) } });
    const b = revision("v2", 2, { values: { voltageScale: fig(1100, null, null, 5) } });
    expect(revisionDifferences([a, b], VORNEL_LIKE)).toEqual([]);
  });

  it("with nothing published on either side there is nothing to mix up, even with different parts", () => {
    const a = revision("v1", 1);
    const b = revision("v2", 2, { dividerRatio: dividerRatio(10_000, 1_000) });
    expect(revisionDifferences([a, b], VORNEL_LIKE)).toEqual([]);
  });

  it("parts within 1 % tolerance are the same part (common practice, no source)", () => {
    const a = revision("v1", 1, { dividerRatio: 11, values: { voltageScale: fig(550, 540, 560) } });
    const b = revision("v2", 2, { dividerRatio: 11.05, values: { voltageScale: fig(550, 540, 560) } });
    expect(revisionDifferences([a, b], VORNEL_LIKE)).toEqual([]);
  });

  it("a halved shunt with a doubled gain reads the same (Ohm's law: 0.25 mΩ × 100 = 0.5 mΩ × 50 = 25 mV/A)", () => {
    const a = revision("v1", 1, { values: { currentScale: fig(1250, 1235, 1265) } });
    const b = revision("v2", 2, {
      shuntMilliohms: 0.25,
      amplifierGain: 100,
      sensitivityMvPerAmp: shuntSensitivityMvPerAmp(0.25, 100),
      values: { currentScale: fig(1250, 1230, 1270) },
    });
    expect(revisionDifferences([a, b], VORNEL_LIKE)).toEqual([]);
  });
});

describe("hardware notes", () => {
  it("a ÷11 divider (10 k / 1 k, divider formula) against ÷5.55 (10 k / 2.2 k): the ÷5.55 board reads about twice the voltage", () => {
    const a = revision("rev A", 1, { dividerRatio: dividerRatio(10_000, 1_000), values: { voltageScale: fig(550, 545, 555) } });
    const b = revision("rev B", 2);
    const [d] = revisionDifferences([a, b], VORNEL_LIKE);
    expect(d.quantity).toBe("voltageScale");
    expect(d.readingRatio).toBeCloseTo(11 / (12_200 / 2_200), 12);
    expect(d.published).toEqual({ a: true, b: false });
    // rev B has no values of its own: the advice is not to borrow rev A's
    expect(describeDifference(d, "rev B")).toBe(
      "rev B reads about twice the voltage of rev A at the same voltage scale (its divider ratio is ÷5.55, rev A's ÷11): do not use rev A's values on a rev B board; calibrate your own.",
    );
  });

  it("a change from shunt to Hall sensor flags the current scale and the offset", () => {
    const a = revision("v1", 1, { values: { currentScale: fig(1250, 1235, 1265), currentOffset: fig(0, -1, 1) } });
    const b = revision("v2", 2, {
      currentSensor: "hall",
      shuntMilliohms: null,
      amplifierGain: null,
      sensitivityMvPerAmp: 37.5,
      values: { currentScale: fig(2000, 1975, 2020), currentOffset: fig(0, -2, 2) },
    });
    const diffs = revisionDifferences([a, b], VORNEL_LIKE);
    expect(diffs.map((d) => d.quantity)).toEqual(["currentScale", "currentOffset"]);
    expect(diffs[0].hardware).toEqual([{ part: "current sensor", a: "a shunt", b: "a Hall sensor" }]);
    expect(diffs[0].readingRatio).toBeCloseTo(37.5 / 25, 12);
    expect(describeDifference(diffs[0], "v2")).toMatch(/^v2 reads about one and a half times the current of v1 at the same current scale/);
    expect(describeDifference(diffs[1], "v2")).toBe(
      "v2 has a different current sensor from v1 (its current sensor is a Hall sensor, v1's a shunt), so its current offset is not interchangeable: use v2's values for a v2 board.",
    );
  });

  it("an offset that moved: the shift is b's median minus a's, in the family's unit", () => {
    // in Skelmar's 10 mA steps: (−6 − 0.5) × 10 mA = −65 mA
    const a = revision("v1", 1, { values: { currentOffset: fig(0.5, 0, 1) } });
    const b = revision("v2", 2, { values: { currentOffset: fig(-6, -7, -5) } });
    const [d] = revisionDifferences([a, b], SKELMAR_LIKE);
    expect(d).toMatchObject({ quantity: "currentOffset", offsetShift: -65, offsetUnit: "mA", readingRatio: null });
    expect(describeDifference(d, "v2")).toBe(
      "v2's current offset sits about 65 mA lower than v1's (their published values differ by more than their spread allows): use v2's values for a v2 board.",
    );
    expect(describeDifference(d, "v1")).toMatch(/^v1's current offset sits about 65 mA higher than v2's/);
  });
});

describe("readingPhrase", () => {
  it.each([
    [0.5, "reads about half the current of v1"],
    [0.26, "reads about a quarter of the current of v1"],
    [3.1, "reads about three times the current of v1"],
    [1.12, "reads about 12 % more current than v1"],
    [0.9, "reads about 10 % less current than v1"],
    [1.003, "reads slightly more current than v1"],
  ])("%s → %s", (ratio, phrase) => {
    expect(readingPhrase(ratio, "current", "v1")).toBe(phrase);
  });
});

describe("properties", () => {
  const figures = fc
    .tuple(fc.integer({ min: 10, max: 5000 }), fc.integer({ min: 0, max: 50 }), fc.integer({ min: 0, max: 50 }))
    .map(([m, lo, hi]) => fig(m, m - lo, m + hi));
  const facts = (label: string, position: number) =>
    fc.record({ voltageScale: figures, currentScale: figures }).map((values) => revision(label, position, { values }));

  it("the input order does not matter, and the two sides' ratios are reciprocal", () => {
    fc.assert(
      fc.property(facts("v1", 1), facts("v2", 2), (a, b) => {
        const forward = revisionDifferences([a, b], VORNEL_LIKE);
        expect(revisionDifferences([b, a], VORNEL_LIKE)).toEqual(forward);
        for (const d of forward) {
          const fromB = describeDifference(d, "v2");
          const fromA = describeDifference(d, "v1");
          expect(fromB.startsWith("v2")).toBe(true);
          expect(fromA.startsWith("v1")).toBe(true);
          expect(fromA + fromB).not.toMatch(/NaN|undefined|Infinity/);
        }
      }),
    );
  });

  it("a revision never differs from an identical copy of itself", () => {
    fc.assert(
      fc.property(facts("v1", 1), (a) => {
        expect(revisionDifferences([a, { ...a, label: "v1b", position: 2 }], SKELMAR_LIKE)).toEqual([]);
      }),
    );
  });
});
