import { publishedFiguresMoved, publishedFromValues, type ApprovedPoint } from "@/lib/published/from-values";
import { QUANTITIES, type Quantity } from "@/lib/published/quantities";
import type { ConfidenceLabel } from "@/lib/stats";
import { DEMO_ACCOUNTS } from "./accounts";
import type { DemoUser } from "./people";
import type { DemoSubmission } from "./submissions";

// The moderation past of the demo: one approval event per approved submission (by the demo
// moderator, or another moderator for the demo moderator's own, as nobody approves their own) and
// the timeline of published values those approvals made. The approvals are replayed in the order
// they happened; after each one the group's figures are worked out with the same definitions
// board_stats uses (lib/stats for the order statistics, lib/published/refresh.ts derivePublished
// for the recommended value and confidence), and a history row is written for each quantity whose
// recommended value, n or interval moved, as lib/moderation/history.ts refreshWithHistory does
// for a live approval. So the newest row of each series is what board_stats publishes.

export type DemoApproval = {
  /** index into DemoScenario.submissions */
  submission: number;
  actorId: string;
  /** the submission's updated_at: when it was approved */
  at: Date;
};

export type DemoHistoryRow = {
  revisionKey: string;
  familySlug: string;
  quantity: Quantity;
  recommendedValue: number;
  n: number;
  median: number;
  ciLow: number | null;
  ciHigh: number | null;
  confidence: ConfidenceLabel;
  at: Date;
  /** index into DemoScenario.approvals: the event that caused it */
  approval: number;
};

const COLUMN: Record<Quantity, "voltageScale" | "currentScale" | "currentOffset"> = {
  voltage_scale: "voltageScale",
  current_scale: "currentScale",
  current_offset: "currentOffset",
};

type Figures = Pick<DemoHistoryRow, "recommendedValue" | "n" | "median" | "ciLow" | "ciHigh" | "confidence">;

/** One group's published figures over `values`, as refreshGroups would compute them. */
function groupFigures(quantity: Quantity, points: ApprovedPoint[]): Figures {
  // the group's ids do not matter to the figures; the rows are matched by key afterwards
  const p = publishedFromValues({ boardRevisionId: 0, firmwareFamilyId: 0 }, quantity, points)!;
  return { recommendedValue: p.recommendedValue, n: p.n, median: p.median, ciLow: p.ciLow, ciHigh: p.ciHigh, confidence: p.confidence };
}

export function buildDemoHistory(submissions: readonly DemoSubmission[], users: readonly DemoUser[]): { approvals: DemoApproval[]; history: DemoHistoryRow[] } {
  const moderator = users.find((u) => u.email === DEMO_ACCOUNTS.moderator.email)!;
  const standIn = users.find((u) => u.role === "moderator" && u.id !== moderator.id)!;
  const order = submissions
    .map((s, i) => [s, i] as const)
    .filter(([s]) => s.status === "approved")
    .sort(([a, i], [b, j]) => a.updatedAt.getTime() - b.updatedAt.getTime() || i - j);

  const approvals: DemoApproval[] = [];
  const history: DemoHistoryRow[] = [];
  const groups = new Map<string, { points: ApprovedPoint[]; last?: Figures }>();
  for (const [s, i] of order) {
    const approval = approvals.push({ submission: i, actorId: s.contributorId === moderator.id ? standIn.id : moderator.id, at: s.updatedAt }) - 1;
    for (const quantity of QUANTITIES) {
      const value = s[COLUMN[quantity]];
      if (value == null) continue;
      const key = `${s.revisionKey}|${s.familySlug}|${quantity}`;
      const group = groups.get(key) ?? { points: [] };
      groups.set(key, group);
      group.points.push({ value, method: s.method, date: s.updatedAt });
      const figures = groupFigures(quantity, group.points);
      if (group.last && !publishedFiguresMoved(group.last, figures)) continue;
      group.last = figures;
      history.push({ revisionKey: s.revisionKey, familySlug: s.familySlug, quantity, ...figures, at: s.updatedAt, approval });
    }
  }
  return { approvals, history };
}
