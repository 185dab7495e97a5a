import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { currentScaleSettingFromSensitivity, sensitivityFromCurrentScaleSetting } from "@/lib/calibration/units";
import { EXPECTED_MAX_CYCLES, rechargeWorksheet, STOP_TOLERANCE, unwrapWorksheet, type RechargeCycleInput } from "@/lib/calibration";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { RECHARGE_RULE, ROUNDING_SIDE } from "./sources";

// A simulated board and pilot, modelled from the physics rather than from the worksheet:
//   the sensor puts out S mV per amp (the true sensitivity); the firmware divides by the
//   sensitivity its setting stands for (units.ts), so the OSD's mAh = consumed × S ÷ S_assumed,
//   shown as a whole mAh;
//   each pack's capacity scatters ±5 % per cycle and each flight uses 55–80 % of it;
//   the charger puts back consumed ÷ efficiency (a fixed 95–100 % per run) with ±0.3 % scatter,
//   shown as a whole mAh;
//   the pilot enters what the worksheet recommends (the safe, over-reporting rounding).
// Claim (the rule "takes 3–5 cycles": common practice, no source): from a start
// up to ±30 % off, the stop rule (≤ 1 % on two cycles in a row) is met within EXPECTED_MAX_CYCLES
// (5; in this simulation it takes 3, or 2 when the start is already within 1 %).
// Error budget of one cycle after the first (derived below, our own arithmetic): the ratio shown
// differs from 1 by at most the product of
//   - the charger's scatter between two runs, (1 + e) ÷ (1 − e);
//   - one setting step, s ÷ (s − 1), because the next setting is a whole number;
//   - four whole-mAh roundings (reported and charged, this cycle and the last), (1 + ½ ÷ m) ÷ (1 − ½ ÷ m) each.
// So the 1 % claim can only hold where that budget fits inside 1 %: charger scatter ±0.15 %,
// at least 400 setting steps, packs of 1,000 mAh and more. Over the wider range (±0.3 %,
// 200 steps, 450 mAh) the ratio is checked against the budget itself, which fast-check found
// to exceed 1 % by a hair (1.0100376), so no 1 % promise is made there.

type Family = (typeof DEMO_FIRMWARE_FAMILIES)[number];
type Flight = { capacity: number; depth: number; chargerScatter: number };

function fly(family: Family, sensitivity: number, efficiency: number, ratedMah: number, start: number, flights: Flight[], stopEarly = true) {
  const cycles: RechargeCycleInput[] = [];
  let scale = start;
  let result = null as ReturnType<typeof rechargeWorksheet> | null;
  for (const f of flights) {
    const consumed = ratedMah * f.capacity * f.depth;
    const reportedMah = Math.round((consumed * sensitivity) / sensitivityFromCurrentScaleSetting(scale, family));
    const chargedMah = Math.round((consumed / efficiency) * (1 + f.chargerScatter));
    cycles.push({ scaleUsed: scale, reportedMah, chargedMah });
    result = rechargeWorksheet({ ratedMah, cycles }, family);
    const value = unwrapWorksheet(result);
    if (value.stop.met && stopEarly) break;
    scale = value.recommendedSetting;
  }
  return { cycles, result: result! };
}

const flightWithScatter = (scatter: number) =>
  fc.record({
    capacity: fc.double({ min: 0.95, max: 1.05, noNaN: true }),
    depth: fc.double({ min: 0.55, max: 0.8, noNaN: true }),
    chargerScatter: fc.double({ min: -scatter, max: scatter, noNaN: true }),
  });
const flight = flightWithScatter(0.003);

/** The budget above for one run: the widest factor a cycle after the first may be off by. */
function cycleBudget(cycles: RechargeCycleInput[], scatter: number) {
  const m = Math.min(...cycles.flatMap((c) => [c.reportedMah, c.chargedMah]));
  const smallest = Math.min(...cycles.map((c) => c.scaleUsed));
  const rounding = ((1 + 0.5 / m) / (1 - 0.5 / m)) ** 2;
  const charger = (1 + scatter) / (1 - scatter);
  return { charger, rounding, step: smallest / (smallest - 1) };
}

describe(`iterating the ${RECHARGE_RULE} on a simulated sensor, rounding: ${ROUNDING_SIDE}`, () => {
  it(`converges within ${EXPECTED_MAX_CYCLES} cycles to within ${STOP_TOLERANCE * 100} % from up to ±30 % off, in every unit`, () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...DEMO_FIRMWARE_FAMILIES),
        fc.double({ min: 2, max: 200, noNaN: true }), // mV/A, the range hobby boards use (common practice, no source)
        fc.double({ min: 0.7, max: 1.3, noNaN: true }),
        fc.double({ min: 0.95, max: 1, noNaN: true }),
        fc.integer({ min: 1_000, max: 10_000 }),
        fc.array(flightWithScatter(0.0015), { minLength: EXPECTED_MAX_CYCLES, maxLength: EXPECTED_MAX_CYCLES }),
        (family, sensitivity, off, efficiency, ratedMah, flights) => {
          const trueSetting = currentScaleSettingFromSensitivity(sensitivity, family);
          fc.pre(trueSetting >= 400 && trueSetting * 1.3 <= family.currentScaleMax);
          const start = Math.max(family.currentScaleMin, Math.round(trueSetting * off));
          const { cycles, result } = fly(family, sensitivity, efficiency, ratedMah, start, flights);
          const value = unwrapWorksheet(result);
          expect(value.stop.met).toBe(true);
          expect(cycles.length).toBeLessThanOrEqual(EXPECTED_MAX_CYCLES);
          // a clean simulation raises no warning: no short recharge, nothing over the rating
          expect(result.warnings).toEqual([]);
          // and the scale it ends on over-reports the charger's count, or misses by under 1 %
          const last = value.iterations[value.iterations.length - 1];
          expect(last.ratio).toBeGreaterThanOrEqual(1 - STOP_TOLERANCE);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("after the first cycle every ratio stays within the error budget, converged or not, over the wider range", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 4, max: 40, noNaN: true }), // mV/A: 200–2000 steps of 0.02 mV/A
        fc.double({ min: 0.7, max: 1.3, noNaN: true }),
        fc.integer({ min: 450, max: 10_000 }),
        fc.array(flight, { minLength: 8, maxLength: 8 }),
        (sensitivity, off, ratedMah, flights) => {
          const family = DEMO_FIRMWARE_FAMILIES[0]; // 0.02 mV/A steps: 200–2000 of them
          const start = Math.round(currentScaleSettingFromSensitivity(sensitivity, family) * off);
          const { cycles, result } = fly(family, sensitivity, 0.98, ratedMah, start, flights, false);
          const { charger, rounding, step } = cycleBudget(cycles, 0.003);
          // Once the stop rule is met on the safe side the worksheet keeps the setting, so the next
          // ratio is the last one (≤ 1 % over) moved by the charger's scatter; otherwise one step.
          const high = charger * rounding * Math.max(step, 1 + STOP_TOLERANCE);
          const low = 1 / (charger * rounding);
          for (const it of unwrapWorksheet(result).iterations.slice(1)) {
            expect(it.ratio).toBeLessThanOrEqual(high);
            expect(it.ratio).toBeGreaterThanOrEqual(low);
          }
        },
      ),
      { numRuns: 300 },
    );
  });

  it("where the budget fits inside 1 %, every cycle until the stop rule is met is within it, and later ones drift only by the charger and the roundings", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 8, max: 40, noNaN: true }), // mV/A: 400–2000 steps of 0.02 mV/A
        fc.double({ min: 0.7, max: 1.3, noNaN: true }),
        fc.array(flightWithScatter(0.0015), { minLength: 8, maxLength: 8 }),
        (sensitivity, off, flights) => {
          const family = DEMO_FIRMWARE_FAMILIES[0]; // 0.02 mV/A steps: 400–2000 of them
          const start = Math.round(currentScaleSettingFromSensitivity(sensitivity, family) * off);
          const { cycles, result } = fly(family, sensitivity, 0.98, 1500, start, flights, false);
          const its = unwrapWorksheet(result).iterations;
          const { charger, rounding } = cycleBudget(cycles, 0.0015);
          const firstMet = its.findIndex(
            (it, i) => i > 0 && Math.abs(it.ratio - 1) <= STOP_TOLERANCE + 1e-12 && Math.abs(its[i - 1].ratio - 1) <= STOP_TOLERANCE + 1e-12,
          );
          expect(firstMet).toBeGreaterThan(0);
          expect(firstMet).toBeLessThan(EXPECTED_MAX_CYCLES);
          // after the first met pair a kept setting drifts only by the charger's scatter and the roundings
          for (const it of its.slice(firstMet + 1)) expect(Math.abs(it.ratio - 1)).toBeLessThanOrEqual((1 + STOP_TOLERANCE) * charger * rounding - 1);
          for (const it of its.slice(1, firstMet + 1)) expect(Math.abs(it.ratio - 1)).toBeLessThanOrEqual(STOP_TOLERANCE + 1e-12);
        },
      ),
      { numRuns: 100 },
    );
  });

  it("a charger stopped early mid-run is caught and does not throw the scale off (our own rule)", () => {
    const family = DEMO_FIRMWARE_FAMILIES[0]; // 0.02 mV/A steps
    const sensitivity = 25;
    const flights: Flight[] = [1, 2, 3, 4].map(() => ({ capacity: 1, depth: 0.75, chargerScatter: 0 }));
    const { cycles } = fly(family, sensitivity, 0.98, 1500, 1600, flights, false); // started as if 32 mV/A (1600 × 0.02)
    cycles.push({ ...cycles[3], chargedMah: Math.round(cycles[3].chargedMah * 0.7) });
    const r = rechargeWorksheet({ ratedMah: 1500, cycles }, family);
    const v = unwrapWorksheet(r);
    expect(v.iterations[4].excludedBecause).toBe("suspected short recharge");
    expect(r.warnings.map((w) => w.field)).toEqual(["cycles.4.chargedMah"]);
    expect(v.recommendedSetting).toBeLessThanOrEqual(Math.floor(currentScaleSettingFromSensitivity(sensitivity, family)));
  });
});
