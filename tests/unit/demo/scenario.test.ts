import { describe, expect, it } from "vitest";
import { dividerRatio, revisionDividerRatio, revisionSensitivityMvPerAmp } from "@/lib/calibration/units";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { minimumRatioFor } from "@/seeders/demo/hardware";
import { DEMO_LANDMARKS, buildDemoScenario } from "@/seeders/demo/scenario";
import { BOARD_KINDS, METHODS, ROLES, SENSING_SOURCES, STATUSES } from "@/lib/vocabulary";

// Pure checks of the demo scenario (no database). The patterns below restate the CHECK
// constraints of migrations/ so that a bad row fails here, with a readable message, before a seed.
const NOW = new Date("2026-12-02T10:30:00Z");
const scenario = buildDemoScenario({ now: NOW });
const SLUG = /^[a-z0-9]+(-[a-z0-9]+)*$/;
const MOUNTING = /^[0-9]{1,2}(\.[0-9])?x[0-9]{1,2}(\.[0-9])?$/;
const FIRMWARE_VERSION = /^[0-9A-Za-z][0-9A-Za-z.+-]{0,31}$/;
const EMAIL = /^[^@\s]+@[^@\s]+$/;

const familyBySlug = new Map(scenario.firmwareFamilies.map((f) => [f.slug, f]));
const truthByKey = new Map(scenario.truths.map((t) => [t.revisionKey, t]));
const countByRevision = new Map<string, number>();
for (const s of scenario.submissions) countByRevision.set(s.revisionKey, (countByRevision.get(s.revisionKey) ?? 0) + 1);
const key = (boardSlug: string, label: string) => `${boardSlug}@${label}`;
const duplicates = (xs: string[]) => xs.filter((x, i) => xs.indexOf(x) !== i);
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

describe("determinism", () => {
  it("the same seed and day build the same scenario", () => {
    expect(buildDemoScenario({ now: new Date("2026-12-02T23:59:00Z") })).toEqual(scenario);
  });

  it("another seed builds different people and submissions", () => {
    const other = buildDemoScenario({ now: NOW, seed: 7 });
    expect(other.users.map((u) => u.email)).not.toEqual(scenario.users.map((u) => u.email));
    expect(other.submissions.map((s) => s.voltageScale)).not.toEqual(scenario.submissions.map((s) => s.voltageScale));
  });

  it("the evidence, approvals and value history are part of what one seed and day fix", () => {
    const again = buildDemoScenario({ now: new Date("2026-12-02T00:00:01Z") });
    expect(again.submissions.map((s) => s.evidence)).toEqual(scenario.submissions.map((s) => s.evidence));
    expect(again.approvals).toEqual(scenario.approvals);
    expect(again.valueHistory).toEqual(scenario.valueHistory);
    expect(scenario.valueHistory.length).toBeGreaterThan(scenario.approvals.length);
  });
});

describe("sizes and uniqueness", () => {
  it("has about the intended size", () => {
    expect(scenario.manufacturers).toHaveLength(8);
    expect(scenario.firmwareFamilies).toHaveLength(3);
    expect(scenario.boardModels.length).toBeGreaterThanOrEqual(55);
    expect(scenario.users).toHaveLength(25 + 3);
    expect(scenario.submissions.length).toBeGreaterThan(1400);
    expect(scenario.submissions.length).toBeLessThan(1700);
  });

  it("has no duplicate slugs, names, revision labels, e-mails or aliases", () => {
    expect(duplicates(scenario.manufacturers.map((m) => m.slug))).toEqual([]);
    expect(duplicates(scenario.manufacturers.map((m) => m.name))).toEqual([]);
    expect(duplicates(scenario.boardModels.map((b) => b.slug))).toEqual([]);
    expect(duplicates(scenario.boardModels.map((b) => `${b.manufacturerSlug}/${b.name}`))).toEqual([]);
    expect(duplicates(scenario.firmwareFamilies.map((f) => f.slug))).toEqual([]);
    expect(duplicates(scenario.firmwareFamilies.map((f) => f.name))).toEqual([]);
    expect(duplicates(scenario.boardRevisions.map((r) => r.key))).toEqual([]);
    expect(duplicates(scenario.users.map((u) => u.email.toLowerCase()))).toEqual([]);
    expect(duplicates(scenario.users.map((u) => u.id))).toEqual([]);
    expect(duplicates(scenario.boardAliases.map((a) => `${a.boardSlug}/${a.alias.toLowerCase()}`))).toEqual([]);
  });

  it("every slug matches the migrations' slug pattern and length", () => {
    for (const m of scenario.manufacturers) expect(m.slug.length <= 80 && SLUG.test(m.slug), m.slug).toBe(true);
    for (const b of scenario.boardModels) expect(b.slug.length <= 120 && SLUG.test(b.slug), b.slug).toBe(true);
    for (const f of scenario.firmwareFamilies) expect(f.slug.length <= 60 && SLUG.test(f.slug), f.slug).toBe(true);
  });
});

describe("catalogue rows satisfy the schema", () => {
  it("manufacturers have no website or an https .example one", () => {
    for (const m of scenario.manufacturers) expect(m.website === null || /^https:\/\/[a-z0-9-]+\.example$/.test(m.website), m.slug).toBe(true);
  });

  it("boards cover every kind, with valid mounting patterns and 1–3 / 4–8 cells", () => {
    expect(new Set(scenario.boardModels.map((b) => b.kind))).toEqual(new Set(BOARD_KINDS));
    for (const b of scenario.boardModels) {
      expect(MOUNTING.test(b.mountingPattern), b.slug).toBe(true);
      expect(b.minCells, b.slug).toBeGreaterThanOrEqual(1);
      expect(b.minCells, b.slug).toBeLessThanOrEqual(3);
      expect(b.maxCells, b.slug).toBeGreaterThanOrEqual(4);
      expect(b.maxCells, b.slug).toBeLessThanOrEqual(8);
      const revisions = scenario.boardRevisions.filter((r) => r.boardSlug === b.slug);
      expect(revisions.length, b.slug).toBeGreaterThanOrEqual(1);
      expect(revisions.length, b.slug).toBeLessThanOrEqual(3);
    }
  });

  it("revision hardware follows the CHECK constraints of board_revisions", () => {
    for (const r of scenario.boardRevisions) {
      expect(r.dividerTopOhms === null, r.key).toBe(r.dividerBottomOhms === null);
      if (r.currentSensor === "hall") expect(r.shuntMilliohms ?? r.amplifierGain, r.key).toBeNull();
      if (r.currentSensor === "shunt") expect(r.hallMvPerAmp, r.key).toBeNull();
      if (r.currentSensor === null) expect(r.shuntMilliohms ?? r.amplifierGain ?? r.hallMvPerAmp, r.key).toBeNull();
      if (r.shuntMilliohms !== null) expect(r.shuntMilliohms >= 0.25 && r.shuntMilliohms <= 1, r.key).toBe(true);
      if (r.amplifierGain !== null) expect(r.amplifierGain >= 20 && r.amplifierGain <= 100, r.key).toBe(true);
      expect([null, 12]).toContain(r.adcBits);
      expect([null, 3.3]).toContain(r.adcReferenceVolts);
      expect(r.label.trim().length).toBeGreaterThan(0);
    }
  });

  it("known hardware and unknown hardware both occur", () => {
    expect(scenario.boardRevisions.some((r) => r.dividerTopOhms === null)).toBe(true);
    expect(scenario.boardRevisions.some((r) => r.currentSensor === "shunt" && r.shuntMilliohms === null)).toBe(true);
    expect(scenario.boardRevisions.some((r) => r.currentSensor === "hall")).toBe(true);
  });

  // Divider headroom with a 3.3 V ADC (derived from the divider formula): ratio ≥ pack V / 3.3,
  // here for HV cells at 4.35 V (common practice). 8S HV needs 10.55, which ÷11 covers.
  it("every divider, published or invented, keeps a full HV pack of the board's max cells under 3.3 V", () => {
    expect(minimumRatioFor(8)).toBeCloseTo(10.545, 2);
    for (const r of scenario.boardRevisions) {
      const board = scenario.boardModels.find((b) => b.slug === r.boardSlug)!;
      const ratio = truthByKey.get(r.key)!.physical.ratio;
      expect(ratio, r.key).toBeGreaterThanOrEqual(minimumRatioFor(board.maxCells));
    }
  });

  it("aliases: most boards have 1–3, and each alias differs from its board's name", () => {
    const perBoard = scenario.boardModels.map((b) => scenario.boardAliases.filter((a) => a.boardSlug === b.slug).length);
    expect(perBoard.filter((n) => n > 0).length).toBeGreaterThan(scenario.boardModels.length / 2);
    expect(Math.max(...perBoard)).toBeLessThanOrEqual(3);
    for (const a of scenario.boardAliases) {
      const board = scenario.boardModels.find((b) => b.slug === a.boardSlug)!;
      expect(a.alias.toLowerCase(), a.alias).not.toBe(board.name.toLowerCase());
    }
  });

  it("firmware families use three different unit sets and satisfy the family CHECKs", () => {
    const units = scenario.firmwareFamilies.map(
      (f) => `${f.voltageScaleUnit}:${f.voltageScaleStep}|${f.currentScaleUnit}:${f.currentScaleStep}|${f.currentOffsetUnit}`,
    );
    expect(new Set(units).size).toBe(3);
    for (const f of scenario.firmwareFamilies) {
      expect(f.voltageScaleUnit === "V/V", f.slug).toBe(f.voltageScaleResponse === "proportional");
      expect(f.currentScaleUnit === "A/V", f.slug).toBe(f.currentScaleResponse === "proportional");
      expect(f.voltageScaleMin > 0 && f.voltageScaleMin < f.voltageScaleMax).toBe(true);
      expect(f.currentScaleMin > 0 && f.currentScaleMin < f.currentScaleMax).toBe(true);
      expect(f.currentOffsetMin < 0 && 0 < f.currentOffsetMax).toBe(true);
      expect(f.voltageScaleStep > 0 && f.currentScaleStep > 0 && f.currentOffsetStep > 0).toBe(true);
    }
  });
});

describe("true settings come from the hardware (lib/calibration/units.ts)", () => {
  // divider formula: a 12 k / 1 k pair divides by (12 + 1) / 1 = 13; 0.75 mΩ × 40 V/V = 30 mV/A (Ohm's law).
  // In steps (seeders/demo/firmware-families.ts): 13 / 0.02 = 650, 13 / 0.025 = 520, 1000 / 13 mV/V / 0.05 = 1538.46.
  it("a ÷13 revision's true voltage scale is 650 / 520 / 1538.46 steps in the three families", () => {
    const r = scenario.boardRevisions.find((x) => x.dividerTopOhms === 12_000 && x.dividerBottomOhms === 1_000)!;
    expect(revisionDividerRatio(r)).toBe(dividerRatio(12_000, 1_000));
    const t = truthByKey.get(r.key)!.settings;
    expect(t.vornel.voltageScale).toBeCloseTo(650, 9);
    expect(t.skelmar.voltageScale).toBeCloseTo(520, 9);
    expect(t.quaysel.voltageScale).toBeCloseTo(20_000 / 13, 9);
  });

  // 30 mV/A: 30 / 0.02 = 1500; 1000 / 30 = 33.33 A/V, / 0.005 = 6666.67; 30 / 0.04 = 750
  it("a 0.75 mΩ × 40 revision's true current scale is 1500 / 6666.67 (33.33 A/V) / 750 steps", () => {
    const r = scenario.boardRevisions.find((x) => x.shuntMilliohms === 0.75 && x.amplifierGain === 40)!;
    expect(revisionSensitivityMvPerAmp(r)).toBe(30);
    const t = truthByKey.get(r.key)!.settings;
    expect(t.vornel.currentScale).toBeCloseTo(1500, 9);
    expect(t.skelmar.currentScale).toBeCloseTo(20_000 / 3, 9);
    expect(t.quaysel.currentScale).toBeCloseTo(750, 9);
  });

  it("published hardware is what the truth uses", () => {
    for (const r of scenario.boardRevisions) {
      const p = truthByKey.get(r.key)!.physical;
      const ratio = revisionDividerRatio(r);
      const sens = revisionSensitivityMvPerAmp(r);
      if (ratio !== null) expect(p.ratio, r.key).toBe(ratio);
      if (sens !== null) expect(p.sensitivityMvPerAmp, r.key).toBe(sens);
      expect(p.ratioPublished, r.key).toBe(ratio !== null);
      expect(p.sensitivityPublished, r.key).toBe(sens !== null);
    }
  });
});

describe("submissions", () => {
  it("every value is a whole step within its family's range; at least one value each", () => {
    for (const s of scenario.submissions) {
      const f = familyBySlug.get(s.familySlug)!;
      expect([s.voltageScale, s.currentScale, s.currentOffset].some((v) => v !== null)).toBe(true);
      if (s.voltageScale !== null) {
        expect(Number.isInteger(s.voltageScale)).toBe(true);
        expect(s.voltageScale).toBeGreaterThanOrEqual(f.voltageScaleMin);
        expect(s.voltageScale).toBeLessThanOrEqual(f.voltageScaleMax);
      }
      if (s.currentScale !== null) {
        expect(Number.isInteger(s.currentScale)).toBe(true);
        expect(s.currentScale).toBeGreaterThanOrEqual(f.currentScaleMin);
        expect(s.currentScale).toBeLessThanOrEqual(f.currentScaleMax);
      }
      if (s.currentOffset !== null) {
        expect(Number.isInteger(s.currentOffset)).toBe(true);
        expect(s.currentOffset).toBeGreaterThanOrEqual(f.currentOffsetMin);
        expect(s.currentOffset).toBeLessThanOrEqual(f.currentOffsetMax);
      }
    }
  });

  it("use only allowed enum values and their family's release codenames, like dunlin", () => {
    for (const s of scenario.submissions) {
      expect(STATUSES).toContain(s.status);
      expect(METHODS).toContain(s.method);
      expect(SENSING_SOURCES).toContain(s.sensingSource);
      expect(s.firmwareVersion).toMatch(FIRMWARE_VERSION);
      expect(familyBySlug.get(s.familySlug)!.versions.map((v) => v.version)).toContain(s.firmwareVersion);
      expect(s.notes === null || s.notes.length <= 10_000).toBe(true);
    }
  });

  it("mix methods, sources and statuses: mostly approved, some pending, a few rejected and changes_requested", () => {
    const share = (pred: (s: (typeof scenario.submissions)[number]) => boolean) => scenario.submissions.filter(pred).length / scenario.submissions.length;
    expect(new Set(scenario.submissions.map((s) => s.method))).toEqual(new Set(METHODS));
    expect(new Set(scenario.submissions.map((s) => s.sensingSource))).toEqual(new Set(SENSING_SOURCES));
    expect(share((s) => s.status === "approved")).toBeGreaterThan(0.6);
    expect(share((s) => s.status === "pending")).toBeGreaterThan(0.05);
    expect(share((s) => s.status === "rejected")).toBeGreaterThan(0.01);
    expect(share((s) => s.status === "changes_requested")).toBeGreaterThan(0.01);
    expect(share((s) => s.status === "rejected")).toBeLessThan(0.15);
  });

  it("are spread over the last ~18 months, after the revision shipped, by people who had joined", () => {
    const revision = new Map(scenario.boardRevisions.map((r) => [r.key, r]));
    const user = new Map(scenario.users.map((u) => [u.id, u]));
    const eighteenMonths = 18 * 30.44 * 86_400_000;
    for (const s of scenario.submissions) {
      expect(s.createdAt.getTime()).toBeLessThanOrEqual(scenario.anchor.getTime());
      expect(scenario.anchor.getTime() - s.createdAt.getTime()).toBeLessThanOrEqual(eighteenMonths + 86_400_000);
      expect(s.createdAt >= new Date(revision.get(s.revisionKey)!.releasedOn), s.revisionKey).toBe(true);
      expect(s.updatedAt >= s.createdAt).toBe(true);
      expect(user.get(s.contributorId), s.contributorId).toBeDefined();
      expect(user.get(s.contributorId)!.createdAt <= s.createdAt).toBe(true);
    }
    const months = new Set(scenario.submissions.map((s) => s.createdAt.toISOString().slice(0, 7)));
    expect(months.size).toBeGreaterThanOrEqual(17);
  });

  it("honest values scatter a few percent around the truth: medians land within 3 % (or one step)", () => {
    const groups = new Map<string, number[]>();
    for (const s of scenario.submissions) {
      if (s.anomaly || s.status !== "approved" || s.voltageScale === null) continue;
      const k = `${s.revisionKey}|${s.familySlug}`;
      groups.set(k, [...(groups.get(k) ?? []), s.voltageScale]);
    }
    let checked = 0;
    for (const [k, values] of groups) {
      if (values.length < 10) continue;
      const [revisionKey, family] = k.split("|");
      const truth = truthByKey.get(revisionKey)!.settings[family].voltageScale;
      expect(Math.abs(median(values) - truth), k).toBeLessThanOrEqual(Math.max(1, 0.03 * truth));
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });

  // within 10 mV at the sensor, in each mV family's own step (0.5 mV, 0.25 mV)
  it("current offsets stay small around zero for most submissions", () => {
    const offsetsMv = scenario.submissions
      .filter((s) => s.currentOffset !== null && s.familySlug !== "skelmar")
      .map((s) => s.currentOffset! * familyBySlug.get(s.familySlug)!.currentOffsetStep);
    expect(offsetsMv.length).toBeGreaterThan(200);
    expect(offsetsMv.filter((o) => Math.abs(o) <= 10).length / offsetsMv.length).toBeGreaterThan(0.9);
  });

  it("include deliberate outliers, each well away from the truth", () => {
    const planted = scenario.submissions.filter((s) => s.anomaly === "decimal_slip" || s.anomaly === "other_board" || s.anomaly === "wrong_family");
    expect(new Set(planted.map((s) => s.anomaly))).toEqual(new Set(["decimal_slip", "other_board", "wrong_family"]));
    expect(planted.length).toBeGreaterThanOrEqual(10);
    for (const s of planted) {
      const t = truthByKey.get(s.revisionKey)!.settings[s.familySlug];
      const off = (v: number | null, exact: number) => v !== null && Math.abs(v - exact) / exact > 0.12;
      expect(off(s.voltageScale, t.voltageScale) || off(s.currentScale, t.currentScale), JSON.stringify(s)).toBe(true);
    }
  });
});

describe("landmarks (DEMO_LANDMARKS)", () => {
  it("popular boards have 80+ submissions and many boards have 10–30", () => {
    const perBoard = (slug: string) => scenario.boardRevisions.filter((r) => r.boardSlug === slug).reduce((n, r) => n + (countByRevision.get(r.key) ?? 0), 0);
    for (const slug of DEMO_LANDMARKS.popularBoards) expect(perBoard(slug), slug).toBeGreaterThanOrEqual(80);
    const middling = scenario.boardModels.filter((b) => perBoard(b.slug) >= 10 && perBoard(b.slug) <= 30);
    expect(middling.length).toBeGreaterThanOrEqual(25);
  });

  it("includes revisions with exactly 0, 1 and 2 submissions, and only those are that sparse", () => {
    const { none, one, two } = DEMO_LANDMARKS.sparseRevisions;
    const expected = new Map<string, number>();
    for (const [list, n] of [
      [none, 0],
      [one, 1],
      [two, 2],
    ] as const) {
      for (const r of list) {
        const k = key(r.boardSlug, r.label);
        expect(
          scenario.boardRevisions.some((x) => x.key === k),
          k,
        ).toBe(true);
        expect(countByRevision.get(k) ?? 0, k).toBe(n);
        expected.set(k, n);
      }
    }
    for (const r of scenario.boardRevisions) {
      if (!expected.has(r.key)) expect(countByRevision.get(r.key) ?? 0, r.key).toBeGreaterThanOrEqual(3);
    }
  });

  it("the hardware-change board really changed its shunt between revisions", () => {
    const { boardSlug, before, after } = DEMO_LANDMARKS.hardwareChange;
    const b = scenario.boardRevisions.find((r) => r.key === key(boardSlug, before))!;
    const a = scenario.boardRevisions.find((r) => r.key === key(boardSlug, after))!;
    expect(revisionSensitivityMvPerAmp(b)).toBe(27); // 0.6 mΩ × 45 (Ohm's law)
    expect(revisionSensitivityMvPerAmp(a)).toBe(13.5); // 0.3 mΩ × 45
    expect((countByRevision.get(b.key) ?? 0) >= 10 && (countByRevision.get(a.key) ?? 0) >= 10).toBe(true);
  });

  it("distinctive aliases belong to the named boards; misspellings point at real boards", () => {
    for (const { alias, boardSlug } of DEMO_LANDMARKS.distinctiveAliases) {
      expect(scenario.boardAliases).toContainEqual({ alias, boardSlug });
    }
    for (const { boardSlug } of DEMO_LANDMARKS.misspellings) expect(scenario.boardModels.some((b) => b.slug === boardSlug)).toBe(true);
  });
});

describe("people", () => {
  it("are mostly contributors with a couple of moderators and one admin, plus one demo account per role", () => {
    const community = scenario.users.filter((u) => u.password === null);
    const count = (role: string) => community.filter((u) => u.role === role).length;
    expect(count("admin")).toBe(1);
    expect(count("moderator")).toBe(2);
    expect(count("contributor")).toBe(22);
    for (const account of Object.values(DEMO_ACCOUNTS)) {
      const u = scenario.users.find((x) => x.email === account.email)!;
      expect(u.role).toBe(account.role);
      expect(u.password).toBe(account.password);
    }
    expect(new Set(scenario.users.map((u) => u.role))).toEqual(new Set(ROLES));
  });

  it("use reserved example domains only, with valid addresses and names", () => {
    for (const u of scenario.users) {
      expect(u.email).toMatch(EMAIL);
      expect(u.email).toMatch(/\.(example|test)$/);
      expect(u.name.trim().length).toBeGreaterThan(0);
      expect(u.name.length).toBeLessThanOrEqual(80);
    }
  });

  it("the demo contributor has a history in every status", () => {
    const mine = scenario.submissions.filter((s) => s.contributorId === scenario.users.find((u) => u.email === DEMO_ACCOUNTS.contributor.email)!.id);
    expect(new Set(mine.map((s) => s.status))).toEqual(new Set(STATUSES));
  });
});
