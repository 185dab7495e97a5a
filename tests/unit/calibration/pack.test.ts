import { describe, expect, it } from "vitest";
import { CHEMISTRY_LIMITS, USED_CAPACITY_ALERT_FRACTION, packLandingGuide, unwrapWorksheet } from "@/lib/calibration";
import { LIPO_BMFA, LIPO_UW } from "./sources";

const log = (mah: number[], full = true) => mah.map((chargedMah) => ({ chargedMah, afterFullFlight: full }));

describe("when to land with a pack: used-capacity alert and land soon / land now voltages", () => {
  it(`LiPo per-cell limits with their sources: 4.20 full and 3.0 off load (${LIPO_UW}), 2.5 under load (${LIPO_BMFA}), land 3.3–3.5 (common practice)`, () => {
    const l = CHEMISTRY_LIMITS.lipo;
    expect(l.full).toEqual({ volts: 4.2, source: expect.stringContaining("University of Washington") });
    expect(l.minimumOffLoad).toEqual({ volts: 3.0, source: expect.stringContaining("University of Washington") });
    expect(l.minimumUnderLoad).toEqual({ volts: 2.5, source: "BMFA safety guidance" });
    expect(l.landUnderLoad).toEqual({ low: 3.3, high: 3.5, source: "common practice, no source" });
  });

  it("LiHV full at 4.35 V is a vendors' figure; Li-ion figures say from memory", () => {
    expect(CHEMISTRY_LIMITS.lihv.full).toEqual({ volts: 4.35, source: "vendors only: common practice" });
    expect(CHEMISTRY_LIMITS.liion.full.source).toMatch(/from memory/);
    expect(CHEMISTRY_LIMITS.liion.minimumUnderLoad).toMatchObject({ low: 2.5, high: 3.0, source: expect.stringMatching(/from memory/) });
  });

  it(`alerts at ${USED_CAPACITY_ALERT_FRACTION * 100} % of the rating without a log (common practice, no source), rounded down`, () => {
    const r = unwrapWorksheet(packLandingGuide({ chemistry: "lipo", cells: 6, ratedMah: 1333 }));
    expect(r.usedCapacityAlert).toEqual({ mah: 1066, fraction: 0.8, source: "common practice, no source" });
    expect(r.capacity).toMatchObject({ basis: "rating", basisMah: 1333, estimatedUsableMah: null, cycleCount: 0 });
    expect(r.landSoon.pack).toBeCloseTo(21, 12);
    expect(r.landNow.pack).toBeCloseTo(19.8, 12);
    expect(r.full.pack).toBeCloseTo(25.2, 12);
  });

  it("from a charge log: the median of the last 5 charges after full flights, and the cycle count", () => {
    const chargeLog = [...log([1250, 1240]), ...log([600], false), ...log([1100, 1120, 1080, 1150, 1090])];
    const r = unwrapWorksheet(packLandingGuide({ chemistry: "lihv", cells: 4, ratedMah: 1300, chargeLog, cycleCount: 40 }));
    expect(r.capacity).toMatchObject({ estimatedUsableMah: 1100, chargesUsed: 5, basis: "charge log", basisMah: 1100, cycleCount: 40 });
    expect(r.usedCapacityAlert.mah).toBe(880);
    expect(r.full.perCell).toBe(4.35);
  });

  it("a log estimate above the rating is not trusted: the rating is used, with a warning past 10 %", () => {
    const r = packLandingGuide({ chemistry: "lipo", cells: 4, ratedMah: 1000, chargeLog: log([1150, 1160, 1170]) });
    expect(r.ok && r.value.capacity).toMatchObject({ basis: "rating", basisMah: 1000 });
    expect(r.warnings.map((w) => w.field)).toEqual(["chargeLog"]);
  });

  it("too few full-flight charges: the rating, and a note", () => {
    const r = packLandingGuide({ chemistry: "lipo", cells: 4, ratedMah: 1500, chargeLog: log([1200, 1210]) });
    expect(r.ok && r.value.capacity.basis).toBe("rating");
    expect(r.warnings[0].message).toMatch(/Fewer than 3/);
  });

  it("carries the charging cautions", () => {
    expect(unwrapWorksheet(packLandingGuide({ chemistry: "liion", cells: 3, ratedMah: 3000 })).cautions.length).toBeGreaterThan(2);
  });

  it("field-level errors", () => {
    const r = packLandingGuide({ chemistry: "nimh" as never, cells: 0, ratedMah: -1, chargeLog: [{ chargedMah: 0, afterFullFlight: true }], cycleCount: 1.5 });
    expect(!r.ok && r.errors.map((e) => e.field)).toEqual(["chemistry", "cells", "ratedMah", "chargeLog.0.chargedMah", "cycleCount"]);
  });
});
