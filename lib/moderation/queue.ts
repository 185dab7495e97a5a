import { QueryTypes } from "sequelize";
import { z } from "zod";
import { badRequest } from "@/lib/http/errors";
import { pageParam, pageSizeParam, parseQueryOrRefuse } from "@/lib/http/query";
import { QUANTITY_KEYS, type QuantityKey } from "@/lib/published/board-values-types";
import { db } from "@/models";
import {
  type Method,
  QUANTITIES,
  type Quantity,
  QUEUE_AGES,
  QUEUE_DEFAULT_PAGE_SIZE,
  QUEUE_FLAGS,
  QUEUE_MAX_PAGE_SIZE,
  QUEUE_SORTS,
  type QueueAge,
  type QueueFlag,
  type QueueSort,
} from "@/lib/vocabulary";
import { FLAG_CONDITIONS, flaggedSql, flagsOfRow, type ScoredRow, type SubmissionFlags } from "./flags";

// The review queue: pending submissions, filtered, ordered and paged in PostgreSQL (flags.ts
// scores them there), with a badge count per flag. Plans: the pending rows come from
// submissions_review_queue_idx (status first), the board filter from board_models' unique slug,
// each score from board_stats' primary key, first-time contributors from
// submissions_contributor_status_created_idx.

export type QueueParams = { page: number; pageSize: number; sort: QueueSort; board: string | null; flag: QueueFlag | null; age: QueueAge | null };

const MAX_PAGE = 10_000;

/** The query string's parameters; field-level messages for anything that is not one of them. */
const QueueParamsSchema = z.object({
  page: pageParam(MAX_PAGE),
  pageSize: pageSizeParam(QUEUE_MAX_PAGE_SIZE, QUEUE_DEFAULT_PAGE_SIZE),
  sort: z.enum(QUEUE_SORTS, { error: `sort is one of: ${QUEUE_SORTS.join(", ")}` }).default("severity"),
  board: z
    .string()
    .trim()
    .max(120, "board is a board's slug (at most 120 characters)")
    .regex(/^[a-z0-9-]+$/, "board is a board's slug, like example-f7")
    .nullable()
    .default(null),
  flag: z
    .enum(QUEUE_FLAGS, { error: `flag is one of: ${QUEUE_FLAGS.join(", ")}` })
    .nullable()
    .default(null),
  age: z
    .enum(QUEUE_AGES, { error: `age is one of: ${QUEUE_AGES.join(", ")}` })
    .nullable()
    .default(null),
});

/** Query-string parameters (as lib/http/query's queryRecord gives them) to QueueParams, or ApiError 400 naming each bad one. */
export function parseQueueParams(input: Record<string, string | string[] | undefined>): QueueParams {
  return parseQueryOrRefuse(QueueParamsSchema, input);
}

export type QueueRow = {
  id: number;
  /** Send it back with a decision: a decision on an older version is refused with 409. */
  version: number;
  createdAt: string;
  board: { id: number; slug: string; name: string };
  revision: { id: number; label: string };
  family: { id: number; slug: string; name: string };
  contributor: { id: string; name: string };
  method: Method;
  values: Record<QuantityKey, number | null>;
  /** Each quantity's published median and number of approved values (what the flags compare against); null when nothing is approved yet. */
  group: Record<QuantityKey, { median: number; n: number } | null>;
  /** The evidence sent with it: voltage readings, fly-and-recharge cycles, bench points, photos (removed ones not counted). */
  evidence: EvidenceCounts;
  flags: SubmissionFlags;
};

export type EvidenceCounts = { readings: number; cycles: number; benchPoints: number; photos: number };

export type QueueCounts = Record<QueueFlag | "all", number>;

export type QueuePage = {
  rows: QueueRow[];
  page: number;
  pageSize: number;
  /** Rows matching every filter, over all pages. */
  total: number;
  pageCount: number;
  /** Badge counts: pending submissions per flag under the board and age filters (not the flag filter, so every badge stays meaningful). */
  counts: QueueCounts;
  /** Boards with pending submissions under the age filter, for the board filter's choices. */
  boards: { slug: string; name: string; pending: number }[];
  params: QueueParams;
};

const AGE_CONDITIONS: Record<QueueAge, string> = {
  day: `s.created_at > now() - interval '1 day'`,
  week: `s.created_at > now() - interval '7 days'`,
  older: `s.created_at <= now() - interval '7 days'`,
};

const ORDERS: Record<QueueSort, string> = {
  // outliers first, the furthest first; then evidence that disagrees; then first-time contributors; oldest first within each
  severity: `outlier DESC, CASE WHEN outlier THEN "maxAbsZ" END DESC NULLS LAST, mismatch DESC, "newContributor" DESC, "createdAt" ASC, id ASC`,
  oldest: `"createdAt" ASC, id ASC`,
  newest: `"createdAt" DESC, id DESC`,
};

type QueueSqlRow = ScoredRow & EvidenceCounts;

// per row of the page only: each count by its table's (submission_id, position) unique index, photos by evidence_photos_submission_idx
const EVIDENCE_COUNTS = `
  (SELECT count(*)::int FROM submission_voltage_readings r WHERE r.submission_id = q.id) AS readings,
  (SELECT count(*)::int FROM submission_cycles c WHERE c.submission_id = q.id) AS cycles,
  (SELECT count(*)::int FROM submission_bench_points b WHERE b.submission_id = q.id) AS "benchPoints",
  (SELECT count(*)::int FROM evidence_photos p WHERE p.submission_id = q.id AND p.deleted_at IS NULL) AS photos`;

function groupOf(r: ScoredRow): QueueRow["group"] {
  const one = (q: Quantity) => {
    const median = r[`median_${q}`];
    const n = r[`n_${q}`];
    return median === null || n === null ? null : { median: Number(median), n: Number(n) };
  };
  return Object.fromEntries(QUANTITIES.map((q) => [QUANTITY_KEYS[q], one(q)])) as QueueRow["group"];
}

function toRow(r: QueueSqlRow): QueueRow {
  return {
    id: r.id,
    version: r.version,
    createdAt: new Date(r.createdAt).toISOString(),
    board: { id: r.boardId, slug: r.boardSlug, name: r.boardName },
    revision: { id: r.revisionId, label: r.revisionLabel },
    family: { id: r.familyId, slug: r.familySlug, name: r.familyName },
    contributor: { id: r.contributorId, name: r.contributorName },
    method: r.method as Method,
    values: { voltageScale: r.voltageScale, currentScale: r.currentScale, currentOffset: r.currentOffset },
    group: groupOf(r),
    evidence: { readings: r.readings, cycles: r.cycles, benchPoints: r.benchPoints, photos: r.photos },
    flags: flagsOfRow(r),
  };
}

/** Badge counts over pending submissions matching `where` (SQL on s/bm). */
export async function queueCounts(where = "TRUE", replacements: Record<string, unknown> = {}): Promise<QueueCounts> {
  const [row] = await db().query<QueueCounts>(
    `SELECT count(*)::int AS "all", ${QUEUE_FLAGS.map((f) => `count(*) FILTER (WHERE ${FLAG_CONDITIONS[f]})::int AS "${f}"`).join(", ")}
       FROM (${flaggedSql(`s.status = 'pending' AND ${where}`)}) q`,
    { replacements, type: QueryTypes.SELECT },
  );
  return row;
}

/**
 * One page of the review queue. Accepts raw parameters (validated here; ApiError 400 naming the
 * field) or parsed ones. An unknown board slug is a 400 on `board`; a page past the end is empty.
 */
export async function listQueue(input: Partial<QueueParams> = {}): Promise<QueuePage> {
  const checked = QueueParamsSchema.safeParse(input);
  if (!checked.success) throw badRequest(Object.fromEntries(checked.error.issues.map((i) => [String(i.path[0] ?? "query"), [i.message]])));
  const params = checked.data;
  const sequelize = db();
  const replacements: Record<string, unknown> = {};
  const common: string[] = [];
  if (params.age) common.push(AGE_CONDITIONS[params.age]);
  const ageOnly = common.length ? common.join(" AND ") : "TRUE";
  if (params.board) {
    const [board] = await sequelize.query<{ id: number }>("SELECT id FROM board_models WHERE slug = :slug", {
      replacements: { slug: params.board },
      type: QueryTypes.SELECT,
    });
    if (!board) throw badRequest({ board: [`No board has the slug "${params.board}".`] });
    common.push("bm.id = :boardId");
    replacements.boardId = board.id;
  }
  const where = common.length ? common.join(" AND ") : "TRUE";
  const flagWhere = params.flag ? FLAG_CONDITIONS[params.flag] : "TRUE";
  const [rows, counts, boards] = await Promise.all([
    sequelize.query<QueueSqlRow>(
      `SELECT q.*, ${EVIDENCE_COUNTS} FROM (${flaggedSql(`s.status = 'pending' AND ${where}`)}) q WHERE ${flagWhere}
        ORDER BY ${ORDERS[params.sort]} LIMIT :limit OFFSET :offset`,
      { replacements: { ...replacements, limit: params.pageSize, offset: (params.page - 1) * params.pageSize }, type: QueryTypes.SELECT },
    ),
    queueCounts(where, replacements),
    sequelize.query<{ slug: string; name: string; pending: number }>(
      `SELECT bm.slug, bm.name, count(*)::int AS pending
         FROM submissions s JOIN board_revisions br ON br.id = s.board_revision_id JOIN board_models bm ON bm.id = br.board_model_id
        WHERE s.status = 'pending' AND ${ageOnly}
        GROUP BY bm.id ORDER BY bm.name, bm.slug`,
      { type: QueryTypes.SELECT },
    ),
  ]);
  const total = counts[params.flag ?? "all"];
  return {
    rows: rows.map(toRow),
    page: params.page,
    pageSize: params.pageSize,
    total,
    pageCount: Math.max(1, Math.ceil(total / params.pageSize)),
    counts,
    boards,
    params,
  };
}

/**
 * The submission a moderator meets next: the first pending one in the queue's order under the same
 * filters, other than `currentId` (the one on screen, decided or not). Null when nothing else waits.
 * A board filter that no longer matches a board falls back to the whole queue.
 */
export async function nextInQueue(params: Partial<Omit<QueueParams, "page" | "pageSize">>, currentId: number): Promise<QueueRow | null> {
  const first = (p: Partial<QueueParams>) => listQueue({ ...p, page: 1, pageSize: 2 }).then((page) => page.rows.find((r) => r.id !== currentId) ?? null);
  try {
    return await first(params);
  } catch (error) {
    if (params.board) return first({ ...params, board: null });
    throw error;
  }
}
