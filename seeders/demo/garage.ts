import type { Chemistry, WorksheetKind } from "@/lib/vocabulary";
import { DEMO_ACCOUNTS } from "./accounts";
import { DEMO_FIRMWARE_FAMILIES } from "./firmware-families";
import type { DemoSubmission } from "./submissions";
import type { DemoUser } from "./people";
import { daysAfter, isoDate, monthsBefore } from "./timeline";

// The demo contributor's garage (issue 13, item 9), so a newcomer who signs in as them sees it at
// work: two quads on demo boards, three packs with charge logs, a worksheet of each kind in
// progress, and one published worksheet linked to one of their own approved submissions (its
// entries are that submission's evidence). Every figure is invented; rows refer to each other by
// index and to the catalogue by revision key and family slug, as the rest of the scenario does.

/** The family's newest release (its own codename), as a builder who just flashed would type it. */
function newestVersion(familySlug: string): string {
  const versions = DEMO_FIRMWARE_FAMILIES.find((f) => f.slug === familySlug)?.versions ?? [];
  return versions[versions.length - 1]?.version ?? "";
}

type DemoQuad = { name: string; revisionKey: string; familySlug: string; firmwareVersion: string; esc: string; notes: string | null; createdAt: Date };
type DemoCharge = { chargedOn: string; chargedMah: number; restingVoltsPerCell: number | null; afterFullFlight: boolean };
type DemoPack = { label: string; chemistry: Chemistry; cells: number; ratedMah: number; purchasedOn: string; charges: DemoCharge[]; createdAt: Date };
type DemoWorksheet = {
  quad: number;
  pack: number | null;
  kind: WorksheetKind;
  familySlug: string;
  ratedMah: number | null;
  cells: number | null;
  startingScale: number;
  startingOffset: number | null;
  /** index into the scenario's submissions, for the published one */
  submission: number | null;
  steps: { scaleUsed: number; reportedMah: number; chargedMah: number }[];
  readings: { cells: number; reportedVolts: number; measuredVolts: number; measuredAt: "main_lead" | "balance_outer_pins" }[];
  points: { measuredAmps: number; reportedAmps: number }[];
  createdAt: Date;
};
export type DemoGarage = { ownerId: string; quads: DemoQuad[]; packs: DemoPack[]; worksheets: DemoWorksheet[] };

const KIND_OF_METHOD: Partial<Record<DemoSubmission["method"], WorksheetKind>> = { fly_recharge: "fly_recharge", multimeter: "voltage", bench_clamp: "bench" };

/** A charge log: one charge every few days from the purchase on, mAh near `typical` (invented, deterministic). */
function log(purchased: Date, typical: number, restingVolts: number, count: number): DemoCharge[] {
  return Array.from({ length: count }, (_, i) => ({
    chargedOn: isoDate(daysAfter(purchased, 6 + i * 9)),
    chargedMah: typical + ((i * 37) % 90) - 45,
    restingVoltsPerCell: i % 3 === 2 ? null : restingVolts + ((i * 7) % 5) / 100,
    afterFullFlight: i % 4 !== 3,
  }));
}

export function buildDemoGarage(users: DemoUser[], submissions: DemoSubmission[], anchor: Date): DemoGarage {
  const owner = users.find((u) => u.email === DEMO_ACCOUNTS.contributor.email)!;
  // the published worksheet: the contributor's own approved submission that a worksheet kind can stand for
  const published = submissions.findIndex((s) => s.contributorId === owner.id && s.status === "approved" && KIND_OF_METHOD[s.method] != null);
  const mine = submissions[published];
  // the second quad: a measured, approved submission on another board with all three values, for in-progress starting points
  const otherBoard = (s: DemoSubmission) => s.revisionKey.split("@")[0] !== mine.revisionKey.split("@")[0];
  const second = submissions.find(
    (s) => s.status === "approved" && otherBoard(s) && s.voltageScale != null && s.currentScale != null && s.currentOffset != null,
  )!;
  const created = monthsBefore(anchor, 8);

  const quads: DemoQuad[] = [
    {
      name: "Ridge five",
      revisionKey: mine.revisionKey,
      familySlug: mine.familySlug,
      firmwareVersion: newestVersion(mine.familySlug),
      esc: "45 A 4-in-1",
      notes: "Freestyle, 5 inch.",
      createdAt: created,
    },
    {
      name: "Long-range seven",
      revisionKey: second.revisionKey,
      familySlug: second.familySlug,
      firmwareVersion: newestVersion(second.familySlug),
      esc: "55 A 4-in-1",
      notes: null,
      createdAt: daysAfter(created, 20),
    },
  ];
  const purchased = [monthsBefore(anchor, 7), monthsBefore(anchor, 5), monthsBefore(anchor, 3)];
  const packs: DemoPack[] = [
    {
      label: "Red 1",
      chemistry: "lipo",
      cells: 4,
      ratedMah: 1300,
      purchasedOn: isoDate(purchased[0]),
      charges: log(purchased[0], 1180, 3.82, 8),
      createdAt: purchased[0],
    },
    {
      label: "Blue 2",
      chemistry: "lihv",
      cells: 6,
      ratedMah: 1100,
      purchasedOn: isoDate(purchased[1]),
      charges: log(purchased[1], 960, 3.85, 5),
      createdAt: purchased[1],
    },
    {
      label: "Tiny 3",
      chemistry: "lipo",
      cells: 1,
      ratedMah: 450,
      purchasedOn: isoDate(purchased[2]),
      charges: log(purchased[2], 390, 3.8, 4),
      createdAt: purchased[2],
    },
  ];

  const kind = KIND_OF_METHOD[mine.method]!;
  const ev = mine.evidence;
  const firstCycle = ev.cycles[0];
  const publishedSheet: DemoWorksheet = {
    quad: 0,
    pack: kind === "fly_recharge" ? 0 : null,
    kind,
    familySlug: mine.familySlug,
    ratedMah: kind === "fly_recharge" ? firstCycle.ratedMah : null,
    cells: kind === "fly_recharge" ? firstCycle.cells : null,
    startingScale: kind === "fly_recharge" ? firstCycle.scaleUsed : kind === "voltage" ? ev.voltageCheck!.scaleUsed : ev.bench!.scaleUsed,
    startingOffset: kind === "bench" ? ev.bench!.offsetUsed : null,
    submission: published,
    steps: kind === "fly_recharge" ? ev.cycles.map((c) => ({ scaleUsed: c.scaleUsed, reportedMah: c.reportedMah, chargedMah: c.chargedMah })) : [],
    readings:
      kind === "voltage"
        ? ev.voltageCheck!.readings.map((r) => ({ cells: r.cells, reportedVolts: r.reportedVolts, measuredVolts: r.measuredVolts, measuredAt: r.measuredAt }))
        : [],
    points: kind === "bench" ? ev.bench!.points.map((p) => ({ measuredAmps: p.measuredAmps, reportedAmps: p.reportedAmps })) : [],
    createdAt: new Date(mine.createdAt.getTime() - 3 * 3_600_000),
  };
  const started = daysAfter(anchor, -3);
  const base = { quad: 1, familySlug: second.familySlug, submission: null, steps: [], readings: [], points: [], createdAt: started };
  const inProgress: DemoWorksheet[] = [
    {
      ...base,
      pack: 0,
      kind: "fly_recharge",
      ratedMah: 1300,
      cells: 4,
      startingScale: second.currentScale!,
      startingOffset: null,
      steps: [{ scaleUsed: second.currentScale!, reportedMah: 1150, chargedMah: 1235 }],
    },
    {
      ...base,
      pack: null,
      kind: "voltage",
      ratedMah: null,
      cells: null,
      startingScale: second.voltageScale!,
      startingOffset: null,
      readings: [{ cells: 4, reportedVolts: 16.42, measuredVolts: 16.58, measuredAt: "main_lead" }],
    },
    {
      ...base,
      pack: null,
      kind: "bench",
      ratedMah: null,
      cells: null,
      startingScale: second.currentScale!,
      startingOffset: second.currentOffset!,
      points: [
        { measuredAmps: 2.1, reportedAmps: 2.0 },
        { measuredAmps: 5.4, reportedAmps: 5.2 },
      ],
    },
  ];
  return { ownerId: owner.id, quads, packs, worksheets: [publishedSheet, ...inProgress] };
}
