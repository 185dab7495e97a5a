import { describe, expect, it } from "vitest";
import { ratioFromVoltageScaleSetting, revisionDividerRatio, revisionSensitivityMvPerAmp, sensitivityFromCurrentScaleSetting } from "@/lib/calibration/units";
import { minimumRatioFor } from "@/seeders/demo/hardware";
import { buildDemoScenario } from "@/seeders/demo/scenario";

// The demo's firmware families and hardware are our own inventions (issue 11): no family may store
// its settings in the tenths, hundredths or whole units, ship the round defaults or number its
// releases the way an existing firmware does, and the boards must not all share one divider.
const scenario = buildDemoScenario({ now: new Date("2026-12-02T10:30:00Z") });
const families = scenario.firmwareFamilies;

/** True when `x` sits within 1 % of a whole multiple of `unit`: the round figures a default must avoid. */
const nearMultipleOf = (x: number, unit: number) => Math.abs(x / unit - Math.round(x / unit)) * unit <= 0.01 * Math.abs(x);
/** Share of the most common value in a list. */
const topShare = (xs: number[]) => Math.max(...[...new Set(xs)].map((x) => xs.filter((y) => y === x).length)) / xs.length;

describe("firmware families of our own", () => {
  it.each(families)("$slug: releases are codenames in alphabetical order, not numbered versions", (f) => {
    const names = f.versions.map((v) => v.version);
    for (const name of names) expect(name).toMatch(/^[a-z]+$/);
    expect([...names].sort()).toEqual(names);
    // oldest first, as versionAt expects
    expect(f.versions.map((v) => -v.monthsAgo)).toEqual([...f.versions.map((v) => -v.monthsAgo)].sort((a, b) => a - b));
  });

  it.each(families)("$slug: no setting is stored in whole units, tenths, hundredths or thousandths", (f) => {
    for (const step of [f.voltageScaleStep, f.currentScaleStep]) expect([1, 0.1, 0.01, 0.001]).not.toContain(step);
    expect([0.1, 1]).not.toContain(f.currentOffsetStep);
  });

  // ratio = setting × step (V/V) or 1000 / (setting × step) (mV/V); mV/A = setting × step or 1000 / (setting × step) for A/V
  it.each(families)("$slug: defaults are whole, in range and not round figures, physically or in steps", (f) => {
    const d = f.defaults;
    expect([d.voltageScale, d.currentScale, d.currentOffset].every(Number.isInteger)).toBe(true);
    expect(d.voltageScale >= f.voltageScaleMin && d.voltageScale <= f.voltageScaleMax).toBe(true);
    expect(d.currentScale >= f.currentScaleMin && d.currentScale <= f.currentScaleMax).toBe(true);
    expect(d.currentOffset >= f.currentOffsetMin && d.currentOffset <= f.currentOffsetMax).toBe(true);
    for (const setting of [d.voltageScale, d.currentScale, d.currentOffset]) expect(setting % 10).not.toBe(0);
    expect(nearMultipleOf(ratioFromVoltageScaleSetting(d.voltageScale, f), 1)).toBe(false); // not ÷11, ÷10 or any whole ratio
    expect(nearMultipleOf(sensitivityFromCurrentScaleSetting(d.currentScale, f), 5)).toBe(false); // not 10, 25, 40 mV/A …
  });

  // 1S to 14S HV at a 3.3 V ADC needs ratios from minimumRatioFor(1) = 1.32 to minimumRatioFor(14) = 18.45 (hardware.ts);
  // 2–200 mV/A is the usual hobby sensor range (common practice, no source)
  it.each(families)("$slug: the range covers 1–14S dividers and 2–200 mV/A sensors", (f) => {
    const ratios = [ratioFromVoltageScaleSetting(f.voltageScaleMin, f), ratioFromVoltageScaleSetting(f.voltageScaleMax, f)].sort((a, b) => a - b);
    expect(ratios[0]).toBeLessThanOrEqual(minimumRatioFor(1));
    expect(ratios[1]).toBeGreaterThanOrEqual(minimumRatioFor(14));
    const sensitivities = [sensitivityFromCurrentScaleSetting(f.currentScaleMin, f), sensitivityFromCurrentScaleSetting(f.currentScaleMax, f)].sort(
      (a, b) => a - b,
    );
    expect(sensitivities[0]).toBeLessThanOrEqual(2);
    expect(sensitivities[1]).toBeGreaterThanOrEqual(200);
  });

  it("keeps an inverse and a proportional convention for each scale, and no two families share a unit set", () => {
    expect(new Set(families.map((f) => f.voltageScaleResponse))).toEqual(new Set(["proportional", "inverse"]));
    expect(new Set(families.map((f) => f.currentScaleResponse))).toEqual(new Set(["proportional", "inverse"]));
    const units = families.map(
      (f) => `${f.voltageScaleUnit}:${f.voltageScaleStep}|${f.currentScaleUnit}:${f.currentScaleStep}|${f.currentOffsetUnit}:${f.currentOffsetStep}`,
    );
    expect(new Set(units).size).toBe(families.length);
  });

  it("careless submissions send their family's invented defaults, offset included", () => {
    const careless = scenario.submissions.filter((s) => s.anomaly === "firmware_default");
    expect(careless.length).toBeGreaterThan(0);
    for (const s of careless) {
      const d = families.find((f) => f.slug === s.familySlug)!.defaults;
      if (s.voltageScale !== null) expect(s.voltageScale).toBe(d.voltageScale);
      if (s.currentScale !== null) expect(s.currentScale).toBe(d.currentScale);
      if (s.currentOffset !== null) expect(s.currentOffset).toBe(d.currentOffset);
    }
  });
});

describe("demo hardware over a realistic range", () => {
  it("published dividers use many ratios, none on more than a quarter of the revisions", () => {
    const ratios = scenario.boardRevisions.map(revisionDividerRatio).filter((r): r is number => r !== null);
    expect(new Set(ratios.map((r) => r.toFixed(2))).size).toBeGreaterThanOrEqual(10);
    expect(topShare(ratios.map((r) => Number(r.toFixed(2))))).toBeLessThanOrEqual(0.25);
  });

  it("flight controllers' dividers range over ÷8–20", () => {
    const fcs = new Set(scenario.boardModels.filter((b) => b.kind === "flight_controller").map((b) => b.slug));
    const ratios = scenario.boardRevisions
      .filter((r) => fcs.has(r.boardSlug))
      .map(revisionDividerRatio)
      .filter((r): r is number => r !== null);
    expect(Math.min(...ratios.filter((r) => r >= 8))).toBeLessThan(10);
    expect(Math.max(...ratios)).toBeGreaterThan(15);
    expect(ratios.every((r) => r <= 20)).toBe(true);
  });

  it("published current sensors use many sensitivities, none on more than a quarter of the revisions", () => {
    const sensitivities = scenario.boardRevisions.map(revisionSensitivityMvPerAmp).filter((s): s is number => s !== null);
    expect(new Set(sensitivities).size).toBeGreaterThanOrEqual(10);
    expect(topShare(sensitivities)).toBeLessThanOrEqual(0.25);
  });
});
