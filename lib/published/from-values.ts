import { describeFlags, meanAbsDeviationAroundMedian, summarise } from "@/lib/stats";
import type { Method, Quantity } from "@/lib/vocabulary";
import type { GroupKey } from "./group-key";
import { derivePublished, type GroupAggregates, type PublishedStats } from "./refresh";

// What board_stats would publish for a set of approved values, worked out in TypeScript: lib/stats
// for the order statistics and flags (held to 1e-9 against the SQL aggregates) and the refresh's
// own derivePublished for the recommended setting and confidence. For "what if" figures (the
// moderator's review) and for replaying a past (the demo's history), where running the SQL per
// step would be wasteful. Null for no values.

export type ApprovedPoint = { value: number; method: Method; date: Date };

/** The figures a reader of the published value sees change: the history keeps a row when one moves. */
export type ShownFigures = { recommendedValue: number | null; n: number; ciLow: number | null; ciHigh: number | null };

/** Whether the published value moved from `a` to `b` (undefined: not published); the value-history rule. */
export function publishedFiguresMoved(a: ShownFigures | undefined, b: ShownFigures | undefined): boolean {
  return (
    (a?.recommendedValue ?? null) !== (b?.recommendedValue ?? null) ||
    (a?.n ?? 0) !== (b?.n ?? 0) ||
    (a?.ciLow ?? null) !== (b?.ciLow ?? null) ||
    (a?.ciHigh ?? null) !== (b?.ciHigh ?? null)
  );
}

export function publishedFromValues(group: GroupKey, quantity: Quantity, points: readonly ApprovedPoint[]): PublishedStats | null {
  if (points.length === 0) return null;
  const values = points.map((p) => p.value);
  const s = summarise(values);
  const report = describeFlags(values);
  const methodCounts: GroupAggregates["methodCounts"] = {};
  for (const p of points) methodCounts[p.method] = (methodCounts[p.method] ?? 0) + 1;
  return derivePublished({
    ...group,
    quantity,
    n: s.n,
    median: s.median!,
    q1: s.q1!,
    q3: s.q3!,
    iqr: s.iqr!,
    mad: s.mad!,
    scaledMad: s.scaledMad!,
    meanAbsDev: meanAbsDeviationAroundMedian(values, s.median!),
    ciLow: s.ciLow,
    ciHigh: s.ciHigh,
    ciCoverage: s.ciCoverage,
    ciLowerRank: s.ciRanks?.lower ?? null,
    ciUpperRank: s.ciRanks?.upper ?? null,
    zScaleRule: report.zScaleRule,
    outlierCount: report.points.filter((p) => p.outlier).length,
    tukeyCount: report.points.filter((p) => p.tukey !== "none").length,
    methodCounts,
    lastValueAt: new Date(Math.max(...points.map((p) => p.date.getTime()))),
  });
}
