import { QueryTypes } from "sequelize";
import { getSequelize } from "@/lib/db/sequelize";
import { MEAN_AD_FACTOR, MIN_VALUES_TO_JUDGE, MODIFIED_Z_CUTOFF, MODIFIED_Z_FACTOR } from "@/lib/stats";
import { db } from "@/models";

// The moderation queue, read straight from PostgreSQL and paged there. Stop-gap until the back end
// in lib/moderation lands: the scoring is the same modified z-score as lib/submissions/placement.ts
// (NIST/SEMATECH e-Handbook §1.3.5.17, with lib/stats' constants and its MAD = 0 rule), done in SQL
// so that the ordering by severity works across pages.

export const QUEUE_FLAGS = ["outlier", "mismatch", "new", "none"] as const;
export type QueueFlag = (typeof QUEUE_FLAGS)[number];
export const QUEUE_AGES = ["day", "week", "older"] as const;
export type QueueAge = (typeof QUEUE_AGES)[number];
export const QUEUE_SORTS = ["severity", "oldest", "newest"] as const;
export type QueueSort = (typeof QUEUE_SORTS)[number];
export const QUEUE_PAGE_SIZE = 20;

export type QueueQuery = { page: number; sort: QueueSort; board: string | null; flag: QueueFlag | null; age: QueueAge | null };

export type QueueRow = {
  id: number;
  version: number;
  createdAt: string;
  boardSlug: string;
  boardName: string;
  revision: string;
  family: string;
  contributor: string;
  voltageScale: number | null;
  currentScale: number | null;
  currentOffset: number | null;
  /** Largest |modified z| of the three values against the approved ones, null when none could be scored. */
  maxAbsZ: number | null;
  outlier: boolean;
  mismatch: boolean;
  newContributor: boolean;
};

export type QueueCounts = Record<QueueFlag | "all", number>;
export type QueuePage = { rows: QueueRow[]; total: number; pageCount: number; counts: QueueCounts; boards: { slug: string; name: string }[] };

const one = <T extends readonly string[]>(list: T, v: string | undefined): T[number] | null => (v && (list as readonly string[]).includes(v) ? v : null);

/** The URL's search params as a queue query; anything unknown falls back to the default. */
export function parseQueueQuery(sp: Record<string, string | string[] | undefined>): QueueQuery {
  const s = (k: string) => (typeof sp[k] === "string" ? (sp[k] as string) : undefined);
  const page = Number(s("page"));
  return {
    page: Number.isSafeInteger(page) && page >= 1 ? page : 1,
    sort: one(QUEUE_SORTS, s("sort")) ?? "severity",
    board: s("board")?.trim() || null,
    flag: one(QUEUE_FLAGS, s("flag")),
    age: one(QUEUE_AGES, s("age")),
  };
}

/** The URL of the queue with `change` applied; the page goes back to 1 unless it is the change. */
export function queueHref(q: QueueQuery, change: Partial<QueueQuery>): string {
  const next = { ...q, page: "page" in change ? q.page : 1, ...change };
  const p = new URLSearchParams();
  if (next.page > 1) p.set("page", String(next.page));
  if (next.sort !== "severity") p.set("sort", next.sort);
  if (next.board) p.set("board", next.board);
  if (next.flag) p.set("flag", next.flag);
  if (next.age) p.set("age", next.age);
  const qs = p.toString();
  return qs ? `/moderation?${qs}` : "/moderation";
}

// |z| of one quantity against its published row (alias st_<q>), NULL when it cannot be scored.
const z = (col: string, st: string) => `CASE
  WHEN s.${col} IS NULL OR ${st}.n IS NULL OR ${st}.n < ${MIN_VALUES_TO_JUDGE} THEN NULL
  WHEN ${st}.mad > 0 THEN abs(${MODIFIED_Z_FACTOR} * (s.${col} - ${st}.median) / ${st}.mad)
  WHEN ${st}.mean_abs_dev > 0 THEN abs((s.${col} - ${st}.median) / (${MEAN_AD_FACTOR} * ${st}.mean_abs_dev))
  WHEN s.${col} <> ${st}.median THEN 'Infinity'::float8
  ELSE 0 END`;

const stats = (q: string) =>
  `LEFT JOIN board_stats st_${q} ON st_${q}.board_revision_id = s.board_revision_id AND st_${q}.firmware_family_id = s.firmware_family_id AND st_${q}.quantity = '${q}'`;

const SCORED = `
  SELECT s.id, s.version, s.created_at, s.voltage_scale, s.current_scale, s.current_offset, s.evidence_mismatch,
         bm.slug AS board_slug, bm.name AS board_name, br.label AS revision, ff.name AS family, u.name AS contributor,
         NOT EXISTS (SELECT 1 FROM submissions a WHERE a.contributor_id = s.contributor_id AND a.status = 'approved') AS new_contributor,
         GREATEST(${z("voltage_scale", "st_voltage_scale")}, ${z("current_scale", "st_current_scale")}, ${z("current_offset", "st_current_offset")}) AS max_abs_z
  FROM submissions s
  JOIN board_revisions br ON br.id = s.board_revision_id
  JOIN board_models bm ON bm.id = br.board_model_id
  JOIN firmware_families ff ON ff.id = s.firmware_family_id
  JOIN users u ON u.id = s.contributor_id
  ${stats("voltage_scale")} ${stats("current_scale")} ${stats("current_offset")}
  WHERE s.status = 'pending'`;

const FLAG_SQL: Record<QueueFlag, string> = {
  outlier: `max_abs_z > ${MODIFIED_Z_CUTOFF}`,
  mismatch: `evidence_mismatch`,
  new: `new_contributor`,
  none: `NOT (coalesce(max_abs_z, 0) > ${MODIFIED_Z_CUTOFF} OR evidence_mismatch OR new_contributor)`,
};
const AGE_SQL: Record<QueueAge, string> = {
  day: `created_at > now() - interval '1 day'`,
  week: `created_at > now() - interval '7 days'`,
  older: `created_at <= now() - interval '7 days'`,
};
// Severity: how far off the values are, then evidence that disagrees with them, then a first-time contributor.
const ORDER_SQL: Record<QueueSort, string> = {
  severity: `(coalesce(max_abs_z, 0) > ${MODIFIED_Z_CUTOFF}) DESC, evidence_mismatch DESC, new_contributor DESC, max_abs_z DESC NULLS LAST, created_at ASC, id ASC`,
  oldest: `created_at ASC, id ASC`,
  newest: `created_at DESC, id DESC`,
};

type Raw = {
  id: number; version: number; created_at: Date; voltage_scale: number | null; current_scale: number | null; current_offset: number | null;
  evidence_mismatch: boolean; board_slug: string; board_name: string; revision: string; family: string; contributor: string;
  new_contributor: boolean; max_abs_z: number | null;
};

export async function loadQueue(q: QueueQuery): Promise<QueuePage> {
  db();
  const sequelize = getSequelize();
  const where: string[] = [];
  const replacements: Record<string, unknown> = {};
  if (q.board) {
    where.push("board_slug = :board");
    replacements.board = q.board;
  }
  if (q.age) where.push(AGE_SQL[q.age]);
  const base = `WITH scored AS (${SCORED}) SELECT * FROM scored`;
  const filtered = [...where, ...(q.flag ? [FLAG_SQL[q.flag]] : [])];
  const whereSql = filtered.length ? ` WHERE ${filtered.join(" AND ")}` : "";
  const countWhere = where.length ? ` WHERE ${where.join(" AND ")}` : "";
  const [rows, countRows, boards] = await Promise.all([
    sequelize.query<Raw & { total: number }>(
      `${base.replace("SELECT * FROM scored", "SELECT *, count(*) OVER ()::int AS total FROM scored")}${whereSql} ORDER BY ${ORDER_SQL[q.sort]} LIMIT ${QUEUE_PAGE_SIZE} OFFSET ${(q.page - 1) * QUEUE_PAGE_SIZE}`,
      { type: QueryTypes.SELECT, replacements },
    ),
    // badge counts follow the board and age filters but not the flag one, so every badge stays useful
    sequelize.query<QueueCounts>(
      `WITH scored AS (${SCORED}) SELECT count(*)::int AS "all", ${QUEUE_FLAGS.map((f) => `count(*) FILTER (WHERE ${FLAG_SQL[f]})::int AS "${f}"`).join(", ")} FROM scored${countWhere}`,
      { type: QueryTypes.SELECT, replacements },
    ),
    sequelize.query<{ slug: string; name: string }>(`WITH scored AS (${SCORED}) SELECT DISTINCT board_slug AS slug, board_name AS name FROM scored ORDER BY name`, { type: QueryTypes.SELECT }),
  ]);
  const total = rows[0]?.total ?? (q.page > 1 ? countRows[0]?.[q.flag ?? "all"] ?? 0 : 0);
  return {
    rows: rows.map((r) => ({
      id: r.id,
      version: r.version,
      createdAt: new Date(r.created_at).toISOString(),
      boardSlug: r.board_slug,
      boardName: r.board_name,
      revision: r.revision,
      family: r.family,
      contributor: r.contributor,
      voltageScale: r.voltage_scale,
      currentScale: r.current_scale,
      currentOffset: r.current_offset,
      maxAbsZ: r.max_abs_z === null ? null : Number(r.max_abs_z),
      outlier: r.max_abs_z !== null && Number(r.max_abs_z) > MODIFIED_Z_CUTOFF,
      mismatch: r.evidence_mismatch,
      newContributor: r.new_contributor,
    })),
    total,
    pageCount: Math.max(1, Math.ceil(total / QUEUE_PAGE_SIZE)),
    counts: countRows[0] ?? { all: 0, outlier: 0, mismatch: 0, new: 0, none: 0 },
    boards,
  };
}
