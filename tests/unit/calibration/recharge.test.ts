import { describe, expect, it } from "vitest";
import { CHARGED_OVER_RATED_WARNING, rechargeWorksheet, STOP_TOLERANCE, unwrapWorksheet } from "@/lib/calibration";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { LIPO_BMFA, LIPO_UW, RECHARGE_RULE, ROUNDING_SIDE } from "./sources";

const [VORNEL, SKELMAR] = DEMO_FIRMWARE_FAMILIES; // mV/A in 0.02 (inverse), A/V in 0.005 (proportional)
// A 40 mV/A sensor is 40 / 0.02 = 2000 Vornel steps, or 1000 / 40 = 25 A/V = 5000 Skelmar steps.

type Cycles = Parameters<typeof rechargeWorksheet>[0]["cycles"];
/** The worksheet of these cycles under the mV/A family, unwrapped (throws if it is refused). */
const vornelSheet = (cycles: Cycles) => unwrapWorksheet(rechargeWorksheet({ cycles }, VORNEL));

describe(`fly-and-recharge worksheet — ${RECHARGE_RULE}`, () => {
  it("inverse unit (mV/A): next = scale × reported ÷ charged", () => {
    const r = vornelSheet([{ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300 }]);
    expect(r.next.exact).toBeCloseTo((2000 * 1200) / 1300, 12);
    expect(r.iterations[0]).toMatchObject({ ratio: 1200 / 1300, usable: true });
    expect(r.iterations[0].errorPercent).toBeCloseTo((1200 / 1300 - 1) * 100, 12);
  });

  it("proportional unit (A/V): the rule inverts, next = scale × charged ÷ reported", () => {
    const r = unwrapWorksheet(rechargeWorksheet({ cycles: [{ scaleUsed: 4800, reportedMah: 1200, chargedMah: 1300 }] }, SKELMAR));
    expect(r.next.exact).toBeCloseTo((4800 * 1300) / 1200, 12); // 24 A/V read 8 % low: 5200 (26 A/V)
  });

  it(`rounds on the side that over-reports — ${ROUNDING_SIDE}`, () => {
    // inverse: 2000 × 1200 / 1300 = 1846.15 → floor 1846 makes the displayed current larger
    const inv = vornelSheet([{ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300 }]);
    expect(inv.next).toMatchObject({ down: { setting: 1846, reads: "high" }, up: { setting: 1847, reads: "low" }, safeSide: "down" });
    expect(inv.next.down.readingError).toBeCloseTo((2000 * 1200) / 1300 / 1846 - 1, 12);
    expect(inv.recommendedSetting).toBe(1846);
    expect(inv.next.why).toMatch(/lands early rather than late/);
    // proportional: 5000 × 1300 / 1200 = 5416.67 → ceil 5417 makes the displayed current larger
    const prop = unwrapWorksheet(rechargeWorksheet({ cycles: [{ scaleUsed: 5000, reportedMah: 1200, chargedMah: 1300 }] }, SKELMAR));
    expect(prop.next).toMatchObject({ safeSide: "up", recommended: { setting: 5417, reads: "high" } });
    expect(prop.next.up.readingError).toBeCloseTo(5417 / ((5000 * 1300) / 1200) - 1, 12);
  });

  it(`stop rule: within ${STOP_TOLERANCE * 100} % on two cycles in a row (our own rule, common practice)`, () => {
    const cycles = [
      { scaleUsed: 2000, reportedMah: 1000, chargedMah: 1250 },
      { scaleUsed: 1600, reportedMah: 1010, chargedMah: 1000 }, // exactly 1 % over
      { scaleUsed: 1600, reportedMah: 1200, chargedMah: 1195 },
    ];
    const done = vornelSheet(cycles);
    expect(done.stop).toMatchObject({ met: true, cycles: [1, 2] });
    expect(done.recommendedSetting).toBe(1600); // on the safe side already: keep it
    expect(done.stop.message).toMatch(/Keep 1600/);
    const notYet = vornelSheet(cycles.slice(0, 2));
    expect(notYet.stop.met).toBe(false);
    const drifting = vornelSheet([cycles[1], { scaleUsed: 1600, reportedMah: 1180, chargedMah: 1200 }]);
    expect(drifting.stop.met).toBe(false);
  });

  it("met but under-reporting: the safe rounding rather than the scale in force", () => {
    const r = vornelSheet([
      { scaleUsed: 1600, reportedMah: 995, chargedMah: 1000 },
      { scaleUsed: 1600, reportedMah: 993, chargedMah: 1000 },
    ]);
    expect(r.stop.met).toBe(true);
    expect(r.recommendedSetting).toBe(Math.floor(1600 * 0.993)); // 1588: over-reports
  });

  it("convergence data for a plot: scale, ratio and error per iteration", () => {
    const r = vornelSheet([
      { scaleUsed: 2000, reportedMah: 1000, chargedMah: 1250 },
      { scaleUsed: 1600, reportedMah: 1190, chargedMah: 1200 },
    ]);
    expect(r.convergence.map((c) => [c.scale, Number(c.errorPercent.toFixed(3))])).toEqual([
      [2000, -20],
      [1600, -0.833],
    ]);
  });

  it(`carries the charging cautions (${LIPO_BMFA}; ${LIPO_UW})`, () => {
    const r = vornelSheet([{ scaleUsed: 2000, reportedMah: 1000, chargedMah: 1000 }]);
    expect(r.cautions.map((c) => c.text).join(" ")).toMatch(/unattended.*fire-retardant.*swollen/s);
  });
});

describe("fly-and-recharge worksheet: warnings (our own rules)", () => {
  it("a cycle marked not fully recharged is left out, and the next scale comes from the one before", () => {
    const r = rechargeWorksheet(
      {
        cycles: [
          { scaleUsed: 2000, reportedMah: 1000, chargedMah: 1250 },
          { scaleUsed: 1600, reportedMah: 1100, chargedMah: 700, fullyRecharged: false },
        ],
      },
      VORNEL,
    );
    expect(r.warnings).toEqual([{ field: "cycles.1.fullyRecharged", message: expect.stringMatching(/left out/) }]);
    const v = unwrapWorksheet(r);
    expect(v.basedOn).toBe(0);
    expect(v.iterations[1]).toMatchObject({ usable: false, excludedBecause: "marked not fully recharged" });
  });

  it("a short recharge among stable cycles is suspected and left out: it would push towards under-reporting", () => {
    const cycles = [
      { scaleUsed: 2000, reportedMah: 1000, chargedMah: 1250 }, // implies 1600
      { scaleUsed: 1600, reportedMah: 1200, chargedMah: 1203 }, // implies 1596.0
      { scaleUsed: 1596, reportedMah: 1150, chargedMah: 1148 }, // implies 1598.8
      { scaleUsed: 1596, reportedMah: 1200, chargedMah: 880 }, // charger stopped early
    ];
    const r = rechargeWorksheet({ cycles }, VORNEL);
    expect(r.warnings.map((w) => w.field)).toEqual(["cycles.3.chargedMah"]);
    const v = unwrapWorksheet(r);
    expect(v.iterations[3].excludedBecause).toBe("suspected short recharge");
    expect(v.basedOn).toBe(2);
    expect(v.stop).toMatchObject({ met: true, cycles: [1, 2] });
  });

  it(`charged more than ${CHARGED_OVER_RATED_WARNING * 100} % over the rating is doubted, not refused`, () => {
    const r = rechargeWorksheet(
      {
        ratedMah: 1000,
        cycles: [
          { scaleUsed: 2000, reportedMah: 1050, chargedMah: 1150 },
          { scaleUsed: 2000, reportedMah: 1000, chargedMah: 1050, ratedMah: 1300 },
        ],
      },
      VORNEL,
    );
    expect(r.ok).toBe(true);
    expect(r.warnings.map((w) => w.field)).toEqual(["cycles.0.chargedMah"]);
  });

  it("warns when one step is coarser than the stop rule", () => {
    const r = rechargeWorksheet({ cycles: [{ scaleUsed: 60, reportedMah: 1000, chargedMah: 1000 }] }, VORNEL); // one step is 1 / 60 = 1.7 %
    expect(r.warnings.map((w) => w.message).join()).toMatch(/stops changing/);
  });
});

describe("fly-and-recharge worksheet: field-level errors", () => {
  const errorsOf = (input: unknown) => {
    const r = rechargeWorksheet(input as never, VORNEL);
    expect(r.ok).toBe(false);
    return r.ok ? [] : r.errors;
  };

  it("zero and negative mAh, a fractional scale, a missing figure", () => {
    const errors = errorsOf({
      cycles: [{ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300 }, { scaleUsed: 1850.5, reportedMah: 0, chargedMah: -5 }, { scaleUsed: 1850 }],
    });
    expect(errors.map((e) => e.field)).toEqual([
      "cycles.1.scaleUsed",
      "cycles.1.reportedMah",
      "cycles.1.chargedMah",
      "cycles.2.reportedMah",
      "cycles.2.chargedMah",
    ]);
    expect(errors[2].message).toMatch(/more than 0 mAh/);
    expect(errors[3].message).toBe("Enter the reported mAh");
  });

  it("a ratio outside 0.2–5 cannot be one flight (our own rule, limits.ts)", () => {
    expect(errorsOf({ cycles: [{ scaleUsed: 2000, reportedMah: 12000, chargedMah: 1200 }] })).toEqual([
      { field: "cycles.0.reportedMah", message: expect.stringMatching(/outside 0\.2–5/) },
    ]);
  });

  it("more than 1.5 × the rating cannot have gone in", () => {
    expect(errorsOf({ ratedMah: 1000, cycles: [{ scaleUsed: 2000, reportedMah: 1600, chargedMah: 1600 }] })[0].field).toBe("cycles.0.chargedMah");
  });

  it("no cycles, or every cycle marked incomplete", () => {
    expect(errorsOf({ cycles: [] })[0].field).toBe("cycles");
    expect(errorsOf({ cycles: [{ scaleUsed: 2000, reportedMah: 1000, chargedMah: 900, fullyRecharged: false }] })[0].field).toBe("cycles");
    expect(errorsOf({ cycles: "many" })[0].field).toBe("cycles");
  });
});
