import { QueryTypes, type Transaction } from "sequelize";
import { QUANTITIES, type Quantity, type QueueFlag } from "@/lib/vocabulary";
import { QUANTITY_KEYS, type QuantityKey } from "@/lib/published/board-values-types";
import { isOutlierSql, modifiedZSql } from "@/lib/published/modified-z-sql";
import { db } from "@/models";

// The flags of a submission that waits for review, computed in PostgreSQL so that the queue can
// be ordered by them across pages. The modified z-score of each value is taken against the
// PUBLISHED figures of its group, board_stats' median, MAD and z_scale_rule over the approved
// values only (the pending value is not part of what it is judged against), by the aggregate's
// own SQL formula (lib/published/modified-z-sql.ts; with no spread at all, any value off the
// median is an outlier). lib/submissions/placement.ts shows a contributor the same verdict before
// they send, by the TypeScript copy. Fewer than 3 approved values ('too_few'): no score, no flag.

const zOf = (q: Quantity) => {
  const st = `st_${q}`;
  return modifiedZSql({ value: `s.${q}`, rule: `${st}.z_scale_rule`, median: `${st}.median`, mad: `${st}.mad`, meanAbsDev: `${st}.mean_abs_dev` });
};

// board_stats' primary key (revision, family, quantity) answers each join
const statsJoin = (q: Quantity) =>
  `LEFT JOIN board_stats st_${q} ON st_${q}.board_revision_id = s.board_revision_id
     AND st_${q}.firmware_family_id = s.firmware_family_id AND st_${q}.quantity = '${q}'`;

/**
 * Submissions (alias s) with their joins and scores (and each quantity's published median and n,
 * what the score is taken against), for a WHERE on s, bm (board_models), br, ff and u. Columns:
 * see ScoredRow. Every lookup is by primary key or by submissions_contributor_status_created_idx
 * (the first-time-contributor test).
 */
function scoredSql(where: string): string {
  return `
  SELECT s.id, s.version, s.status, s.created_at AS "createdAt", s.method,
         s.board_revision_id AS "revisionId", br.label AS "revisionLabel",
         bm.id AS "boardId", bm.slug AS "boardSlug", bm.name AS "boardName",
         ff.id AS "familyId", ff.slug AS "familySlug", ff.name AS "familyName",
         u.id AS "contributorId", u.name AS "contributorName",
         s.voltage_scale AS "voltageScale", s.current_scale AS "currentScale", s.current_offset AS "currentOffset",
         s.evidence_mismatch AS mismatch,
         NOT EXISTS (SELECT 1 FROM submissions a WHERE a.contributor_id = s.contributor_id AND a.status = 'approved') AS "newContributor",
         ${QUANTITIES.map((q) => `${zOf(q)} AS "z_${q}", st_${q}.median AS "median_${q}", st_${q}.n AS "n_${q}"`).join(",\n         ")}
    FROM submissions s
    JOIN board_revisions br ON br.id = s.board_revision_id
    JOIN board_models bm ON bm.id = br.board_model_id
    JOIN firmware_families ff ON ff.id = s.firmware_family_id
    JOIN users u ON u.id = s.contributor_id
    ${QUANTITIES.map(statsJoin).join("\n    ")}
   WHERE ${where}`;
}

/** Wraps scoredSql with the derived flag columns: max_abs_z (Infinity when there is no spread to divide by), outlier. */
export function flaggedSql(where: string): string {
  const abs = QUANTITIES.map((q) => `abs("z_${q}")`).join(", ");
  return `SELECT x.*, GREATEST(${abs}) AS "maxAbsZ", ${isOutlierSql(`GREATEST(${abs})`)} AS outlier
            FROM (${scoredSql(where)}) x`;
}

/** SQL conditions on flaggedSql's columns, one per queue flag. */
export const FLAG_CONDITIONS: Record<QueueFlag, string> = {
  outlier: `outlier`,
  mismatch: `mismatch`,
  new: `"newContributor"`,
  none: `NOT (outlier OR mismatch OR "newContributor")`,
};

export type ScoredRow = {
  id: number;
  version: number;
  status: string;
  createdAt: Date;
  method: string;
  revisionId: number;
  revisionLabel: string;
  boardId: number;
  boardSlug: string;
  boardName: string;
  familyId: number;
  familySlug: string;
  familyName: string;
  contributorId: string;
  contributorName: string;
  voltageScale: number | null;
  currentScale: number | null;
  currentOffset: number | null;
  mismatch: boolean;
  newContributor: boolean;
  maxAbsZ: number | null;
  outlier: boolean;
} & Record<`z_${Quantity}` | `median_${Quantity}` | `n_${Quantity}`, number | null>;

/** JSON has no Infinity: an unbounded score is reported as null with outlier = true. */
const finiteOrNull = (v: number | null): number | null => (v === null || !Number.isFinite(Number(v)) ? null : Number(v));

/** A submission's flags as the queue, bulk approval and trust read them. */
export type SubmissionFlags = {
  /** Signed modified z per value against the approved ones; null when it could not be scored (or has no finite score). */
  modifiedZ: Record<QuantityKey, number | null>;
  /** Largest |z|; null when nothing was scored or the spread is zero (then outlier says whether it is off). */
  maxAbsZ: number | null;
  outlier: boolean;
  mismatch: boolean;
  newContributor: boolean;
  /** The flags raised, in order of severity; empty when none. */
  raised: Exclude<QueueFlag, "none">[];
};

export function flagsOfRow(row: ScoredRow): SubmissionFlags {
  const modifiedZ = Object.fromEntries(QUANTITIES.map((q) => [QUANTITY_KEYS[q], finiteOrNull(row[`z_${q}`])])) as Record<QuantityKey, number | null>;
  const raised: SubmissionFlags["raised"] = [];
  if (row.outlier) raised.push("outlier");
  if (row.mismatch) raised.push("mismatch");
  if (row.newContributor) raised.push("new");
  return { modifiedZ, maxAbsZ: finiteOrNull(row.maxAbsZ), outlier: row.outlier, mismatch: row.mismatch, newContributor: row.newContributor, raised };
}

/** One submission's scored row (any status), or null when there is none; inside `transaction` when given. */
export async function scoredSubmission(submissionId: number, transaction?: Transaction): Promise<ScoredRow | null> {
  const [row] = await db().query<ScoredRow>(flaggedSql("s.id = :id"), { replacements: { id: submissionId }, type: QueryTypes.SELECT, transaction });
  return row ?? null;
}
