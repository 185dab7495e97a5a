import { describe, expect, it } from "vitest";
import { impliedCurrentScaleFromCycle } from "@/lib/calibration/evidence";
import { roundSetting } from "@/lib/calibration/units";
import { demoPayload } from "@/seeders/demo/evidence";
import { buildDemoScenario } from "@/seeders/demo/scenario";
import { QUANTITIES } from "@/lib/vocabulary";
import { recommendValue, summarise } from "@/lib/stats";
import { evidenceVerdict } from "@/lib/submissions/evidence-rows";
import { packVoltsRange } from "@/lib/submissions/limits";
import { fieldErrorsOf as fieldErrorsByPath } from "@/lib/http/field-errors";
import { submissionSchema } from "@/lib/submissions/schema";
import type { FirmwareFamily } from "@/models/FirmwareFamily";

// The demo's evidence and moderation past (seeders/demo/evidence.ts, seeders/demo/history.ts), without a
// database: every submission passes THE submission schema with its family's and board's limits,
// its stored verdict is what evidenceVerdict says, and the value history replays to the figures
// board_stats publishes. The CHECK constraints of migrations/20261205000200…400 are restated here.
const NOW = new Date("2026-12-02T10:30:00Z");
const scenario = buildDemoScenario({ now: NOW });
const familyBySlug = new Map(scenario.firmwareFamilies.map((f) => [f.slug, f]));
const boardBySlug = new Map(scenario.boardModels.map((b) => [b.slug, b]));
const boardOf = (revisionKey: string) => boardBySlug.get(revisionKey.split("@")[0])!;
const COLUMN = { voltage_scale: "voltageScale", current_scale: "currentScale", current_offset: "currentOffset" } as const;

describe("demo evidence", () => {
  it("every submission, evidence included, passes submissionSchema with its family and board", () => {
    const failures: string[] = [];
    for (const [i, s] of scenario.submissions.entries()) {
      const schema = submissionSchema({ family: familyBySlug.get(s.familySlug)!, board: boardOf(s.revisionKey) });
      const parsed = schema.safeParse(demoPayload(s, s.evidence));
      if (!parsed.success) failures.push(`#${i} ${s.method}: ${JSON.stringify(fieldErrorsByPath(parsed.error.issues))}`);
    }
    expect(failures).toEqual([]);
  });

  it("the stored summary and mismatch flag are what evidenceVerdict makes of the parsed payload", () => {
    for (const s of scenario.submissions) {
      const family = familyBySlug.get(s.familySlug)!;
      const payload = submissionSchema({ family, board: boardOf(s.revisionKey) }).parse(demoPayload(s, s.evidence));
      const verdict = evidenceVerdict(payload, family as unknown as FirmwareFamily);
      expect(s.evidenceSummary).toEqual(verdict.summary);
      expect(s.evidenceMismatch).toBe(verdict.mismatch);
    }
  });

  it("each method carries its own evidence: 1–3 readings, 3–5 cycles, 3–6 bench points, nothing when unverified", () => {
    for (const s of scenario.submissions) {
      const e = s.evidence;
      if (s.method === "unverified") expect(e).toEqual({ voltageCheck: null, cycles: [], bench: null });
      if (s.method === "multimeter") {
        expect(e.voltageCheck!.readings.length).toBeGreaterThanOrEqual(1);
        expect(e.voltageCheck!.readings.length).toBeLessThanOrEqual(3);
      }
      if (s.method === "fly_recharge") expect([3, 4, 5]).toContain(e.cycles.length);
      if (s.method === "bench_clamp") expect([3, 4, 5, 6]).toContain(e.bench!.points.length);
      if (s.method !== "fly_recharge") expect(e.cycles).toEqual([]);
      if (s.method !== "bench_clamp") expect(e.bench).toBeNull();
    }
  });

  it("recharge cycles follow new = old × reported ÷ charged (mV/A; inverse for A/V) to the value sent in", () => {
    // the fly-and-recharge rule (common practice, no source)
    for (const s of scenario.submissions.filter((x) => x.method === "fly_recharge")) {
      const family = familyBySlug.get(s.familySlug)!;
      const c = s.evidence.cycles;
      // each cycle leads to the next one's scale; the cycle before the last to the scale the last
      // one confirms, exactly or (small packs, four-digit scales) within one whole mAh's worth
      for (let i = 0; i + 2 < c.length; i++) {
        expect(c[i + 1].scaleUsed).toBe(roundSetting(impliedCurrentScaleFromCycle(c[i], family.currentScaleResponse)));
      }
      const penultimate = c.at(-2)!;
      const oneMah = penultimate.scaleUsed / Math.min(penultimate.reportedMah, penultimate.chargedMah);
      expect(Math.abs(impliedCurrentScaleFromCycle(penultimate, family.currentScaleResponse) - c.at(-1)!.scaleUsed)).toBeLessThanOrEqual(0.5 + oneMah);
      if (!s.evidenceMismatch) expect(c.at(-1)!.scaleUsed).toBe(s.currentScale);
      for (const cycle of c) {
        expect(cycle.chargedMah).toBeLessThanOrEqual(1.5 * cycle.ratedMah);
        expect(cycle.ratedMah * 0.5).toBeLessThan(cycle.chargedMah);
      }
      expect(new Set(c.map((x) => x.cells)).size).toBe(1);
    }
  });

  it("voltage readings are plausible packs for the board, measured at the main lead or the balance plug's outer pins", () => {
    for (const s of scenario.submissions.filter((x) => x.evidence.voltageCheck)) {
      const board = boardOf(s.revisionKey);
      for (const r of s.evidence.voltageCheck!.readings) {
        expect(r.cells).toBeGreaterThanOrEqual(board.minCells);
        expect(r.cells).toBeLessThanOrEqual(board.maxCells);
        const [lo, hi] = packVoltsRange(r.cells);
        expect(r.measuredVolts).toBeGreaterThanOrEqual(lo);
        expect(r.measuredVolts).toBeLessThanOrEqual(Math.min(hi, 100));
        expect(r.reportedVolts).toBeLessThanOrEqual(200);
        expect(["main_lead", "balance_outer_pins"]).toContain(r.measuredAt);
      }
    }
  });

  it("mismatches are a few: every planted mistake whose evidence covers it, plus some careless honest ones, some still pending", () => {
    const flagged = scenario.submissions.filter((s) => s.evidenceMismatch);
    expect(flagged.length).toBeGreaterThan(10);
    expect(flagged.length / scenario.submissions.length).toBeLessThan(0.05);
    expect(flagged.some((s) => s.status === "pending")).toBe(true);
    expect(flagged.some((s) => s.anomaly != null)).toBe(true);
    for (const s of flagged) expect(s.evidenceSummary).not.toBeNull(); // submissions_mismatch_has_summary
    // a decimal slip on a checked quantity is always caught
    for (const s of scenario.submissions.filter((x) => x.anomaly === "decimal_slip" && x.method !== "unverified")) {
      const checked = new Set(s.evidenceSummary?.checks.map((c) => c.quantity));
      const slipped = s.evidenceSummary?.checks.some((c) => Math.abs(c.claimed / c.implied - 1) > 0.5);
      if (checked.size && slipped) expect(s.evidenceMismatch).toBe(true);
    }
  });
});

describe("demo moderation past", () => {
  const moderators = new Map(scenario.users.filter((u) => u.role !== "contributor").map((u) => [u.id, u]));

  it("one approval event per approved submission, by a moderator who is not its contributor, at its updated_at", () => {
    const approved = scenario.submissions.filter((s) => s.status === "approved");
    expect(scenario.approvals).toHaveLength(approved.length);
    expect(new Set(scenario.approvals.map((a) => a.submission)).size).toBe(approved.length);
    for (const a of scenario.approvals) {
      const s = scenario.submissions[a.submission];
      expect(s.status).toBe("approved");
      expect(s.version).toBe(1);
      expect(moderators.get(a.actorId)?.role).toBe("moderator");
      expect(a.actorId).not.toBe(s.contributorId);
      expect(a.at).toEqual(s.updatedAt);
    }
    for (const s of scenario.submissions.filter((x) => x.status !== "approved")) expect(s.version).toBe(0);
  });

  it("history timestamps are non-decreasing and inside the scenario window, each caused by an earlier-or-same approval", () => {
    const start = new Date(NOW.getTime() - 19 * 31 * 86_400_000);
    let last = 0;
    for (const h of scenario.valueHistory) {
      expect(h.at.getTime()).toBeGreaterThanOrEqual(last);
      last = h.at.getTime();
      expect(h.at.getTime()).toBeGreaterThan(start.getTime());
      expect(h.at.getTime()).toBeLessThanOrEqual(scenario.anchor.getTime());
      expect(scenario.approvals[h.approval].at).toEqual(h.at);
      if (h.ciLow !== null) expect(h.ciLow).toBeLessThanOrEqual(h.ciHigh!); // published_value_history CHECKs
      expect(h.n).toBeGreaterThan(0);
    }
  });

  it("the newest row of every series is the median and interval of all approved values (lib/stats summarise)", () => {
    const newest = new Map(scenario.valueHistory.map((h) => [`${h.revisionKey}|${h.familySlug}|${h.quantity}`, h]));
    let groups = 0;
    for (const quantity of QUANTITIES) {
      const values = new Map<string, number[]>();
      for (const s of scenario.submissions) {
        const v = s[COLUMN[quantity]];
        if (s.status !== "approved" || v == null) continue;
        const key = `${s.revisionKey}|${s.familySlug}|${quantity}`;
        values.set(key, [...(values.get(key) ?? []), v]);
      }
      for (const [key, vs] of values) {
        const sum = summarise(vs);
        expect(newest.get(key), key).toMatchObject({
          n: sum.n,
          median: sum.median,
          ciLow: sum.ciLow,
          ciHigh: sum.ciHigh,
          recommendedValue: recommendValue(sum.median!, 1)!.setting,
        });
        groups++;
      }
    }
    expect(newest.size).toBe(groups);
  });
});
