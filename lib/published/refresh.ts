import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { confidenceLabel, evidenceScore, medianCiRanks, recommendValue, relativeCiWidth } from "@/lib/stats";
import type { Method } from "@/lib/vocabulary";
import type { BoardStatRow } from "@/models";
import { AGGREGATES_SQL, GROUP_COUNTS_SQL } from "./aggregate-sql";
import type { GroupKey } from "./group-key";

/** A board_stats row as written, before the database stamps computed_at. */
export type PublishedStats = Omit<BoardStatRow, "computedAt">;

/** The part of a row PostgreSQL's aggregate computes, before the derived recommendation and confidence. */
export type GroupAggregates = Omit<PublishedStats, "recommendedValue" | "confidence">;

/**
 * A current offset sits near zero, so a CI width relative to its median means little; it is
 * judged against 10 setting steps instead when the median is smaller than that (our own rule).
 */
const OFFSET_REFERENCE_FLOOR = 10;

function methodsOf(counts: GroupAggregates["methodCounts"]): Method[] {
  return Object.entries(counts).flatMap(([method, k]) => Array<Method>(k ?? 0).fill(method as Method));
}

/** Recommended setting (the median rounded to a whole step: settings are integers) and confidence label. */
export function derivePublished(a: GroupAggregates): PublishedStats {
  const reference = a.quantity === "current_offset" ? Math.max(Math.abs(a.median), OFFSET_REFERENCE_FLOOR) : a.median;
  const confidence = confidenceLabel({
    n: a.n,
    relativeCiWidth: relativeCiWidth(a.ciLow, a.ciHigh, reference),
    evidenceScore: evidenceScore(methodsOf(a.methodCounts)),
  });
  return { ...a, recommendedValue: recommendValue(a.median, 1)!.setting, confidence: confidence.label };
}

/** Runs the two aggregate passes in PostgreSQL for the given groups (null: all of them). */
export async function computeAggregates(sequelize: Sequelize, groups: GroupKey[] | null, transaction?: Transaction): Promise<GroupAggregates[]> {
  const groupsJson = groups ? JSON.stringify(groups.map((g) => ({ r: g.boardRevisionId, f: g.firmwareFamilyId }))) : null;
  const counts = await sequelize.query<{ n: number }>(GROUP_COUNTS_SQL, {
    type: QueryTypes.SELECT,
    replacements: { groups: groupsJson },
    transaction,
  });
  const ranks = counts.flatMap(({ n }) => {
    const r = medianCiRanks(n);
    return r ? [{ n, lower: r.lower, upper: r.upper, coverage: r.coverage }] : [];
  });
  return sequelize.query<GroupAggregates>(AGGREGATES_SQL, {
    type: QueryTypes.SELECT,
    replacements: { groups: groupsJson, ranks: JSON.stringify(ranks) },
    transaction,
  });
}

const COLUMNS = [
  ["board_revision_id", "boardRevisionId"],
  ["firmware_family_id", "firmwareFamilyId"],
  ["quantity", "quantity"],
  ["n", "n"],
  ["median", "median"],
  ["q1", "q1"],
  ["q3", "q3"],
  ["iqr", "iqr"],
  ["mad", "mad"],
  ["scaled_mad", "scaledMad"],
  ["mean_abs_dev", "meanAbsDev"],
  ["ci_low", "ciLow"],
  ["ci_high", "ciHigh"],
  ["ci_coverage", "ciCoverage"],
  ["ci_lower_rank", "ciLowerRank"],
  ["ci_upper_rank", "ciUpperRank"],
  ["z_scale_rule", "zScaleRule"],
  ["outlier_count", "outlierCount"],
  ["tukey_count", "tukeyCount"],
  ["method_counts", "methodCounts"],
  ["recommended_value", "recommendedValue"],
  ["confidence", "confidence"],
  ["last_value_at", "lastValueAt"],
] as const satisfies readonly (readonly [string, keyof PublishedStats])[];

async function writeRows(sequelize: Sequelize, rows: PublishedStats[], transaction: Transaction): Promise<void> {
  const chunk = 500;
  for (let i = 0; i < rows.length; i += chunk) {
    const slice = rows.slice(i, i + chunk);
    const bind: unknown[] = [];
    const tuples = slice.map((row) => {
      const placeholders = COLUMNS.map(([, key]) => {
        bind.push(key === "methodCounts" ? JSON.stringify(row[key]) : row[key]);
        return `$${bind.length}`;
      });
      return `(${placeholders.join(", ")})`;
    });
    await sequelize.query(`INSERT INTO board_stats (${COLUMNS.map(([c]) => c).join(", ")}) VALUES ${tuples.join(", ")}`, { bind, transaction });
  }
}

/**
 * Marks the boards whose board_stats were just rewritten as changed: board_models.values_version
 * becomes this transaction's id (migrations/20261212001000-…). It is the stamp every cache of the
 * published values (lib/published/values-cache.ts, in any process) revalidates by, and it commits
 * or rolls back with the figures themselves.
 */
async function bumpValuesVersion(sequelize: Sequelize, groups: GroupKey[] | null, transaction: Transaction): Promise<void> {
  if (groups) {
    await sequelize.query(
      `UPDATE board_models SET values_version = pg_current_xact_id()
        WHERE id IN (SELECT board_model_id FROM board_revisions WHERE id IN (:revisions))`,
      { replacements: { revisions: [...new Set(groups.map((g) => g.boardRevisionId))] }, transaction },
    );
  } else {
    await sequelize.query("UPDATE board_models SET values_version = pg_current_xact_id()", { transaction });
  }
}

/**
 * Recomputes board_stats for the given groups (null: every group) inside `transaction`, or in a
 * transaction of its own. Call it in the same transaction that changes an approved submission, so
 * the published figures never disagree with the data. An advisory lock per group serialises two
 * refreshes of one group; each then reads what the other committed. The boards' change stamp is
 * bumped in the same transaction, so the values' caches and ETags move with the figures.
 */
export async function refreshGroups(sequelize: Sequelize, groups: GroupKey[] | null, transaction?: Transaction): Promise<PublishedStats[]> {
  if (!transaction) return sequelize.transaction((t) => refreshGroups(sequelize, groups, t));
  if (groups) {
    const unique = [...new Map(groups.map((g) => [`${g.boardRevisionId}:${g.firmwareFamilyId}`, g])).values()].sort(
      (a, b) => a.boardRevisionId - b.boardRevisionId || a.firmwareFamilyId - b.firmwareFamilyId,
    );
    if (unique.length === 0) return [];
    for (const g of unique) {
      await sequelize.query("SELECT pg_advisory_xact_lock(:r, :f)", { replacements: { r: g.boardRevisionId, f: g.firmwareFamilyId }, transaction });
    }
    groups = unique;
  } else {
    await sequelize.query("LOCK TABLE board_stats IN EXCLUSIVE MODE", { transaction });
    // Over the whole table PostgreSQL estimates each three-column CTE join at one row and picks
    // nested loops over CTE scans, which is quadratic (55 s instead of 2.5 s for 10 k values in
    // the benchmark). Hash joins are right for every group at once; SET LOCAL ends with the transaction.
    await sequelize.query("SET LOCAL enable_nestloop = off", { transaction });
  }
  const rows = (await computeAggregates(sequelize, groups, transaction)).map(derivePublished);
  if (groups) {
    await sequelize.query(
      `DELETE FROM board_stats WHERE (board_revision_id, firmware_family_id) IN (
         SELECT (g->>'r')::int, (g->>'f')::int FROM jsonb_array_elements(CAST(:groups AS jsonb)) AS g)`,
      { replacements: { groups: JSON.stringify(groups.map((g) => ({ r: g.boardRevisionId, f: g.firmwareFamilyId }))) }, transaction },
    );
  } else {
    await sequelize.query("DELETE FROM board_stats", { transaction });
  }
  await writeRows(sequelize, rows, transaction);
  await bumpValuesVersion(sequelize, groups, transaction);
  return rows;
}
