import type { EvidenceSummary } from "@/lib/calibration/evidence";
import { roundSetting } from "@/lib/calibration/units";
import type { ClaimedValues } from "@/lib/submissions/claimed";
import { METHOD_EVIDENCE } from "@/lib/submissions/schema";
import type { BoardKind, Method, SensingSource, SubmissionStatus } from "@/lib/vocabulary";
import { DEMO_ACCOUNTS } from "./accounts";
import type { PopularityTier } from "./boards";
import { offsetSetting, type DemoCatalogue, type DemoTruth, type TrueSettings } from "./catalogue";
import type { DemoFirmwareFamily } from "./firmware-families";
import type { DemoEvidence } from "./evidence";
import type { DemoUser } from "./people";
import { createRng, type Rng } from "./random";
import { SUBMISSION_WINDOW_MONTHS, daysAfter, monthsBefore, monthsBetween } from "./timeline";

// Invented community submissions. Each value scatters around the revision's true setting (from its
// hardware, through lib/calibration/units.ts) with a spread that depends on how it was measured,
// then is rounded to whole steps as the firmware stores it. A few deliberate mistakes are mixed in
// so that the outlier flags have something to find.

/** Why a value is deliberately wrong; null for an honest (if noisy) measurement. */
type Anomaly = "decimal_slip" | "other_board" | "wrong_family" | "firmware_default";

export type DemoSubmission = ClaimedValues & {
  revisionKey: string;
  familySlug: string;
  contributorId: string;
  status: SubmissionStatus;
  createdAt: Date;
  updatedAt: Date;
  anomaly: Anomaly | null;
  /** 1 for an approved one (its seeded approval event's "after", so an admin can revert it), else 0 */
  version: number;
  /** filled in by seeders/demo/evidence.ts attachDemoEvidence */
  evidence: DemoEvidence;
  evidenceSummary: EvidenceSummary | null;
  evidenceMismatch: boolean;
};

type ValueField = "voltageScale" | "currentScale";

const TIER_TOTALS: Record<PopularityTier, readonly [number, number]> = { hot: [85, 130], common: [10, 30], niche: [3, 9] };
/** Revisions not fixed on purpose get at least this many, so that only the landmarks are sparse. */
const MIN_DRAWN_PER_REVISION = 3;

const METHOD_WEIGHTS: ReadonlyArray<readonly [Method, number]> = [
  ["multimeter", 34],
  ["fly_recharge", 30],
  ["bench_clamp", 14],
  ["unverified", 22],
];

// Relative standard deviation of a value by method (invented for the scenario, roughly what a
// careful bench check versus a guess would give: common practice, no source).
const VOLTAGE_SPREAD: Record<Method, number> = { multimeter: 0.006, bench_clamp: 0.01, fly_recharge: 0.015, unverified: 0.045 };
const CURRENT_SPREAD: Record<Method, number> = { multimeter: 0.03, bench_clamp: 0.02, fly_recharge: 0.035, unverified: 0.08 };
/** spread of the measured zero error, in mV at the sensor */
const OFFSET_SPREAD_MV: Record<Method, number> = { multimeter: 1, bench_clamp: 1, fly_recharge: 2, unverified: 5 };
const SOURCE_CURRENT_FACTOR: Record<SensingSource, number> = { board_adc: 1, power_module: 1, esc_telemetry: 1.4, estimate: 2.5 };

const SOURCES_BY_KIND: Record<BoardKind, ReadonlyArray<readonly [SensingSource, number]>> = {
  flight_controller: [
    ["board_adc", 82],
    ["esc_telemetry", 10],
    ["power_module", 4],
    ["estimate", 4],
  ],
  aio: [
    ["board_adc", 86],
    ["esc_telemetry", 8],
    ["estimate", 6],
  ],
  esc_4in1: [
    ["board_adc", 62],
    ["esc_telemetry", 35],
    ["estimate", 3],
  ],
  pdb: [
    ["board_adc", 92],
    ["estimate", 8],
  ],
  power_module: [
    ["power_module", 92],
    ["board_adc", 8],
  ],
};

/** Probability that a submission for this kind of board includes each value. */
const INCLUDES_BY_KIND: Record<BoardKind, { voltage: number; current: number }> = {
  flight_controller: { voltage: 0.97, current: 0.3 },
  aio: { voltage: 0.9, current: 0.85 },
  esc_4in1: { voltage: 0.12, current: 0.97 },
  pdb: { voltage: 0.3, current: 0.95 },
  power_module: { voltage: 0.9, current: 0.9 },
};

const STATUS_WEIGHTS: ReadonlyArray<readonly [SubmissionStatus, number]> = [
  ["approved", 80],
  ["pending", 11],
  ["rejected", 4],
  ["changes_requested", 5],
];
const UNVERIFIED_STATUS_WEIGHTS: ReadonlyArray<readonly [SubmissionStatus, number]> = [
  ["approved", 55],
  ["pending", 22],
  ["rejected", 10],
  ["changes_requested", 13],
];
const OUTLIER_STATUS_WEIGHTS: ReadonlyArray<readonly [SubmissionStatus, number]> = [
  ["rejected", 40],
  ["pending", 25],
  ["approved", 25],
  ["changes_requested", 10],
];

const NOTES: Record<Method, readonly string[]> = {
  multimeter: [
    "Pack voltage checked with a bench multimeter on the balance lead at storage charge.",
    "Compared the OSD with my multimeter at full charge and again near landing voltage.",
    "Multimeter on the main leads, props off, board powered from the pack.",
  ],
  bench_clamp: [
    "Clamp meter on the battery lead at a steady load on the bench, props off and the frame strapped down.",
    "Checked at about 5 A and 15 A with a clamp meter; the two points agree.",
  ],
  fly_recharge: [
    "Four fly-and-recharge cycles; the OSD mAh now ends within 2 % of what the charger puts back.",
    "Adjusted over three packs until the OSD mAh matched the charger.",
    "Fly-and-recharge over five packs, rounded so the OSD slightly over-reports.",
  ],
  unverified: ["Taken from a build log, not checked myself.", "Values a friend uses on the same board.", "Not measured yet, will update after a proper check."],
};

function clampToRange(value: number, min: number, max: number): number {
  return Math.min(max, Math.max(min, value));
}

function rangeOf(family: DemoFirmwareFamily, field: ValueField): readonly [number, number] {
  return field === "voltageScale" ? [family.voltageScaleMin, family.voltageScaleMax] : [family.currentScaleMin, family.currentScaleMax];
}

const inRange = (value: number, [min, max]: readonly [number, number]) => value >= min && value <= max;

/** Split a board's total over its revisions by how long each has been out, largest remainder first. */
function allocate(total: number, weights: number[]): number[] {
  if (weights.length === 0) return [];
  const floor = weights.map(() => MIN_DRAWN_PER_REVISION);
  const rest = Math.max(0, total - MIN_DRAWN_PER_REVISION * weights.length);
  const sum = weights.reduce((a, b) => a + b, 0);
  const exact = weights.map((w) => (rest * w) / sum);
  const counts = exact.map((e, i) => floor[i] + Math.floor(e));
  const order = exact.map((e, i) => [e - Math.floor(e), i] as const).sort((a, b) => b[0] - a[0]);
  let left = rest - exact.reduce((a, e) => a + Math.floor(e), 0);
  for (const [, i] of order) {
    if (left-- <= 0) break;
    counts[i]++;
  }
  return counts;
}

function versionAt(family: DemoFirmwareFamily, createdAt: Date, anchor: Date, rng: Rng): string {
  const released = family.versions.filter((v) => monthsBefore(anchor, v.monthsAgo) <= createdAt);
  if (released.length === 0) return family.versions[0].version;
  // most people run the newest release of the day, some lag behind
  const weighted = released.map((v, i) => [v.version, i === released.length - 1 ? 3 : i === released.length - 2 ? 2 : 1] as const);
  return rng.weighted(weighted);
}

type Context = {
  rng: Rng;
  anchor: Date;
  families: readonly DemoFirmwareFamily[];
  familyBySlug: Map<string, DemoFirmwareFamily>;
  contributors: ReadonlyArray<readonly [DemoUser, number]>;
};

type Draw = {
  revisionKey: string;
  kind: BoardKind;
  releasedOn: Date;
  truth: DemoTruth;
  family: DemoFirmwareFamily;
  /** the sparse landmarks are kept clean: careful method, approved, no anomaly */
  clean: boolean;
};

function drawSubmission(ctx: Context, d: Draw): DemoSubmission {
  const { rng, anchor } = ctx;
  const fam = d.family;
  const truth = d.truth.settings[fam.slug];
  const method: Method = d.clean ? rng.pick(["multimeter", "bench_clamp"] as const) : rng.weighted(METHOD_WEIGHTS);
  const sensingSource = d.clean ? (d.kind === "power_module" ? "power_module" : "board_adc") : rng.weighted(SOURCES_BY_KIND[d.kind]);
  const status: SubmissionStatus = d.clean ? "approved" : rng.weighted(method === "unverified" ? UNVERIFIED_STATUS_WEIGHTS : STATUS_WEIGHTS);

  const includes = INCLUDES_BY_KIND[d.kind];
  let hasVoltage = rng.chance(includes.voltage);
  const hasCurrent = rng.chance(includes.current);
  if (!hasVoltage && !hasCurrent) hasVoltage = d.kind === "flight_controller" || rng.chance(0.5);
  const hasCurrentValue = hasCurrent || !hasVoltage;

  // a flight controller's current comes from whatever ESC it is stacked with: noisier
  const stackFactor = d.kind === "flight_controller" ? 1.5 : 1;
  const currentSd = CURRENT_SPREAD[method] * SOURCE_CURRENT_FACTOR[sensingSource] * stackFactor;
  const scatter = (exact: number, sd: number, field: ValueField) => clampToRange(roundSetting(exact * (1 + sd * rng.normal())), ...rangeOf(fam, field));

  let voltageScale = hasVoltage ? scatter(truth.voltageScale, VOLTAGE_SPREAD[method], "voltageScale") : null;
  let currentScale = hasCurrentValue ? scatter(truth.currentScale, currentSd, "currentScale") : null;
  let currentOffset: number | null = null;
  if (hasCurrentValue && rng.chance(0.6)) {
    // many people leave the offset at the firmware's default unless they measured it
    const measured = method !== "unverified" && (method !== "fly_recharge" || rng.chance(0.5));
    const zeroErrorMv = d.truth.physical.zeroErrorMv + OFFSET_SPREAD_MV[method] * rng.normal();
    currentOffset = measured
      ? clampToRange(roundSetting(offsetSetting({ ...d.truth.physical, zeroErrorMv }, fam)), fam.currentOffsetMin, fam.currentOffsetMax)
      : fam.defaults.currentOffset;
  }

  let anomaly: Anomaly | null = null;
  if (!d.clean && method === "unverified" && rng.chance(0.1)) {
    // sent in the firmware's out-of-the-box values without measuring anything
    if (voltageScale != null) voltageScale = fam.defaults.voltageScale;
    if (currentScale != null) currentScale = fam.defaults.currentScale;
    if (currentOffset != null) currentOffset = fam.defaults.currentOffset;
    const off = (v: number | null, exact: number) => v != null && Math.abs(v - exact) / exact > 0.03;
    if (off(voltageScale, truth.voltageScale) || off(currentScale, truth.currentScale)) anomaly = "firmware_default";
  }

  const windowStart = new Date(Math.max(daysAfter(d.releasedOn, 7).getTime(), monthsBefore(anchor, SUBMISSION_WINDOW_MONTHS).getTime()));
  const windowEnd = new Date(anchor.getTime() - 2 * 3_600_000);
  // pending work is recent: moderators clear the queue within a couple of months
  const from = status === "pending" ? new Date(Math.max(windowStart.getTime(), daysAfter(anchor, -60).getTime())) : windowStart;
  const createdAt = rng.faker.date.between({ from, to: windowEnd });
  const updatedAt = status === "pending" ? createdAt : new Date(Math.min(daysAfter(createdAt, 0.5 + rng.uniform() * 12).getTime(), windowEnd.getTime()));

  return {
    revisionKey: d.revisionKey,
    familySlug: fam.slug,
    contributorId: rng.weighted(ctx.contributors).id,
    firmwareVersion: versionAt(fam, createdAt, anchor, rng),
    sensingSource,
    method,
    voltageScale,
    currentScale,
    currentOffset,
    status,
    notes: rng.chance(0.3) ? rng.pick(NOTES[method]) : null,
    createdAt,
    updatedAt,
    anomaly,
    version: 0,
    evidence: { voltageCheck: null, cycles: [], bench: null },
    evidenceSummary: null,
    evidenceMismatch: false,
  };
}

/**
 * The method a submission can really have been checked by, given the values it sends: a voltage
 * check needs a voltage scale, recharge cycles and bench points a current scale (the schema's
 * METHOD_EVIDENCE and cross-field rules). A voltage-only "fly and recharge" or "bench" submission
 * was checked with a multimeter; a current-only "multimeter" one on the bench with a clamp meter.
 * No random draw, so nothing else in the scenario moves; a note written for the old method is
 * swapped for the same-numbered note of the new one.
 */
function fitMethodToValues(s: DemoSubmission): void {
  const needs = METHOD_EVIDENCE[s.method];
  let method = s.method;
  if ((needs.cycles || needs.bench) && s.currentScale == null) method = "multimeter";
  else if (needs.voltageCheck === "required" && s.voltageScale == null) method = "bench_clamp";
  if (method === s.method) return;
  const index = s.notes == null ? -1 : NOTES[s.method].indexOf(s.notes);
  if (index >= 0) s.notes = NOTES[method][index % NOTES[method].length];
  s.method = method;
}

function setStatus(s: DemoSubmission, status: SubmissionStatus, anchor: Date, rng: Rng): void {
  s.status = status;
  if (status === "pending") {
    // keep a re-labelled pending entry in the recent queue
    if (s.createdAt < daysAfter(anchor, -60)) s.createdAt = daysAfter(anchor, -(2 + rng.uniform() * 50));
    s.updatedAt = s.createdAt;
  } else if (s.updatedAt <= s.createdAt) {
    s.updatedAt = new Date(Math.min(daysAfter(s.createdAt, 1).getTime(), anchor.getTime() - 3_600_000));
  }
}

/** Plant the deliberate mistakes on popular boards, where the statistics have enough to judge by. */
function plantOutliers(ctx: Context, candidates: DemoSubmission[], truths: Map<string, DemoTruth>): void {
  const { rng, anchor, familyBySlug } = ctx;
  const plan: Anomaly[] = [...Array(6).fill("decimal_slip"), ...Array(4).fill("other_board"), ...Array(4).fill("wrong_family")];
  const pool = rng.faker.helpers.shuffle([...candidates]);
  const allTruths = [...truths.values()];

  for (const kind of plan) {
    while (pool.length > 0) {
      const s = pool.pop()!;
      const fam = familyBySlug.get(s.familySlug)!;
      const exact = truths.get(s.revisionKey)!.settings[fam.slug];
      const field: ValueField = s.currentScale != null && (s.voltageScale == null || rng.chance(0.5)) ? "currentScale" : "voltageScale";
      const value = s[field];
      if (value == null) continue;
      const range = rangeOf(fam, field);
      let planted: number | null = null;

      if (kind === "decimal_slip") {
        planted = [value * 10, value / 10].map(roundSetting).find((v) => inRange(v, range)) ?? null;
      } else if (kind === "other_board") {
        // a value copied from a different board whose hardware differs by more than 15 %
        const other = rng.faker.helpers
          .shuffle(allTruths)
          .map((t) => t.settings[fam.slug][field])
          .find((v) => Math.abs(v - exact[field]) / exact[field] > 0.15);
        planted = other == null ? null : roundSetting(other);
      } else {
        // the right physical value typed in another family's units
        const other = ctx.families.find((f) => f.slug !== fam.slug && Math.abs(exact[field] - truthIn(truths, s, f)[field]) / exact[field] > 0.5);
        planted = other ? roundSetting(truthIn(truths, s, other)[field]) : null;
      }
      if (planted == null || !inRange(planted, range) || planted <= 0) continue;
      s[field] = planted;
      s.anomaly = kind;
      setStatus(s, rng.weighted(OUTLIER_STATUS_WEIGHTS), anchor, rng);
      break;
    }
  }
}

function truthIn(truths: Map<string, DemoTruth>, s: DemoSubmission, family: DemoFirmwareFamily): TrueSettings {
  return truths.get(s.revisionKey)!.settings[family.slug];
}

/** Give the demo sign-in accounts a history of their own, with every status represented. */
function assignDemoAccounts(ctx: Context, candidates: DemoSubmission[], users: readonly DemoUser[]): void {
  const byEmail = new Map(users.map((u) => [u.email, u]));
  const plan: Array<[string, SubmissionStatus[]]> = [
    [DEMO_ACCOUNTS.contributor.email, ["approved", "approved", "approved", "approved", "pending", "pending", "changes_requested", "rejected"]],
    [DEMO_ACCOUNTS.moderator.email, ["approved", "approved", "approved"]],
    [DEMO_ACCOUNTS.admin.email, ["approved"]],
  ];
  const pool = ctx.rng.faker.helpers.shuffle([...candidates]);
  for (const [email, statuses] of plan) {
    const user = byEmail.get(email)!;
    for (const status of statuses) {
      const s = pool.pop();
      if (!s) return;
      s.contributorId = user.id;
      setStatus(s, status, ctx.anchor, ctx.rng);
    }
  }
}

export type SubmissionInput = {
  catalogue: DemoCatalogue;
  families: readonly DemoFirmwareFamily[];
  users: readonly DemoUser[];
  anchor: Date;
  seed: number;
};

export function buildDemoSubmissions({ catalogue, families, users, anchor, seed }: SubmissionInput): DemoSubmission[] {
  const rng = createRng(seed);
  const demoEmails = new Set<string>(Object.values(DEMO_ACCOUNTS).map((a) => a.email));
  // a few regulars send most of the data (a long tail, like any community); staff send less
  const community = rng.faker.helpers.shuffle(users.filter((u) => !demoEmails.has(u.email)));
  const contributors = community.map((u, i) => [u, (u.role === "contributor" ? 1 : 0.4) / Math.pow(i + 1, 0.7)] as const);
  const familyBySlug = new Map(families.map((f) => [f.slug, f]));
  const ctx: Context = { rng, anchor, families, familyBySlug, contributors };

  const truths = new Map(catalogue.truths.map((t) => [t.revisionKey, t]));
  const all: DemoSubmission[] = [];
  const outlierCandidates: DemoSubmission[] = [];
  const accountCandidates: DemoSubmission[] = [];

  for (const board of catalogue.boardModels) {
    const revisions = catalogue.boardRevisions.filter((r) => r.boardSlug === board.slug);
    const drawn = revisions.filter((r) => r.fixedSubmissionCount == null);
    const [lo, hi] = TIER_TOTALS[board.tier];
    const total = rng.int(lo, hi);
    const weights = drawn.map((r) => Math.max(1, Math.min(24, monthsBetween(new Date(r.releasedOn), anchor))));
    const allocated = allocate(total, weights);
    const counts = new Map(drawn.map((r, i) => [r.key, allocated[i]]));
    // each board leans towards the families its owners tend to fly
    const familyWeights = families.map((f) => [f, f.share * (0.5 + rng.uniform())] as const);

    for (const r of revisions) {
      const clean = r.fixedSubmissionCount != null;
      const n = clean ? r.fixedSubmissionCount! : counts.get(r.key)!;
      for (let i = 0; i < n; i++) {
        const family = clean ? families[0] : rng.weighted(familyWeights);
        const s = drawSubmission(ctx, { revisionKey: r.key, kind: board.kind, releasedOn: new Date(r.releasedOn), truth: truths.get(r.key)!, family, clean });
        all.push(s);
        if (clean || s.anomaly) continue;
        (board.tier === "hot" ? outlierCandidates : accountCandidates).push(s);
      }
    }
  }

  plantOutliers(ctx, outlierCandidates, truths);
  assignDemoAccounts(
    ctx,
    accountCandidates.filter((s) => s.anomaly == null),
    users,
  );
  all.forEach(fitMethodToValues);
  for (const s of all) if (s.status === "approved") s.version = 1;
  // ids follow time, as they would in a real database
  return all.sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime());
}
