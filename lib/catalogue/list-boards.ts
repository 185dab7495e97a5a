import { QueryTypes } from "sequelize";
import { whereOf } from "@/lib/db/where";
import { db } from "@/models";
import type { BoardFacts } from "./board-facts";
import type { CatalogueParams, CatalogueSort } from "./search-params";

export type CatalogueRow = { id: number } & BoardFacts & {
    manufacturerName: string;
    manufacturerSlug: string;
    revisionCount: number;
    approvedCount: number;
    /** Release date (YYYY-MM-DD) of the board's newest revision, null when no revision has one. */
    latestReleasedOn: string | null;
    /** How well the board matched the search text, 0–1; null when there was no search text. */
    score: number | null;
  };

export type CataloguePage = {
  rows: CatalogueRow[];
  total: number;
  page: number;
  pageSize: number;
  pageCount: number;
};

// pg_trgm thresholds for this search only (SET LOCAL inside the transaction below).
// word_similarity compares the search text with the best-matching stretch of a name, so a short
// query against a long name ("falkon" in "Falcon F7 Pro") still scores well; the default 0.6 misses
// one-letter misspellings of short words, 0.45 catches them without flooding the results.
const WORD_SIMILARITY_THRESHOLD = 0.45;
const SIMILARITY_THRESHOLD = 0.3;
// A manufacturer-name hit ranks a little below a hit on the board's own name or alias.
const MANUFACTURER_WEIGHT = 0.9;

// Every ordering ends in a unique key so that pages never overlap or skip a row.
// lower(name) in the "C" collation is plain code-point order: predictable, and what tests compare.
const NAME_ORDER = `lower(bm.name) COLLATE "C" ASC, bm.id ASC`;
const ORDER_BY: Record<CatalogueSort, string> = {
  relevance: `matched.score DESC, ${NAME_ORDER}`,
  name: NAME_ORDER,
  newest: `revs.latest_released_on DESC NULLS LAST, ${NAME_ORDER}`,
  values: `approved.approved_count DESC, ${NAME_ORDER}`,
};

/** Escapes LIKE wildcards so that a user's "%" or "_" is matched literally. */
function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

// Board ids matching the search text through the board's name, any alias, or its manufacturer,
// each with its best score. The `<%` and `%` operators (and ILIKE) can use the gin_trgm indexes
// on board_models.name and board_aliases.alias; manufacturers is small and read whole.
const MATCHED_CTE = `
  WITH hits AS (
    SELECT bm.id AS board_model_id,
           greatest(word_similarity($q, bm.name), similarity($q, bm.name)) AS score
      FROM board_models bm
     WHERE $q <% bm.name OR bm.name % $q OR bm.name ILIKE $like
    UNION ALL
    SELECT ba.board_model_id,
           greatest(word_similarity($q, ba.alias), similarity($q, ba.alias))
      FROM board_aliases ba
     WHERE $q <% ba.alias OR ba.alias % $q OR ba.alias ILIKE $like
    UNION ALL
    SELECT bm.id,
           ${MANUFACTURER_WEIGHT} * greatest(word_similarity($q, m.name), similarity($q, m.name))
      FROM manufacturers m
      JOIN board_models bm ON bm.manufacturer_id = m.id
     WHERE $q <% m.name OR m.name % $q OR m.name ILIKE $like
  ),
  matched AS (
    SELECT board_model_id, max(score)::float8 AS score FROM hits GROUP BY board_model_id
  )`;

/** The catalogue: search, filter, sort and one page of boards. Expects already-parsed params. */
export async function listBoards(params: CatalogueParams): Promise<CataloguePage> {
  const sequelize = db();
  const bind: Record<string, unknown> = {};
  const whereSql = whereOf(
    [
      ["bm.kind = $kind", "kind", params.kind],
      ["bm.mounting_pattern = $mounting", "mounting", params.mounting],
    ],
    bind,
  );
  const searching = params.q !== undefined && params.q !== "";
  if (searching) {
    bind.q = params.q;
    bind.like = likePattern(params.q!);
  }
  const sort: CatalogueSort = params.sort === "relevance" && !searching ? "name" : params.sort;

  const cte = searching ? MATCHED_CTE : "";
  const joinMatched = searching ? "JOIN matched ON matched.board_model_id = bm.id" : "";

  const countSql = `${cte} SELECT count(*) AS total FROM board_models bm ${joinMatched} ${whereSql}`;
  const pageSql = `${cte}
    SELECT bm.id, bm.slug, bm.name, bm.kind,
           bm.mounting_pattern AS "mountingPattern",
           bm.min_cells AS "minCells", bm.max_cells AS "maxCells",
           m.name AS "manufacturerName", m.slug AS "manufacturerSlug",
           revs.revision_count AS "revisionCount",
           revs.latest_released_on::text AS "latestReleasedOn",
           approved.approved_count AS "approvedCount",
           ${searching ? "matched.score" : "NULL::float8"} AS score
      FROM board_models bm
      JOIN manufacturers m ON m.id = bm.manufacturer_id
      ${joinMatched}
      CROSS JOIN LATERAL (
        SELECT count(*) AS revision_count, max(br.released_on) AS latest_released_on
          FROM board_revisions br WHERE br.board_model_id = bm.id
      ) revs
      CROSS JOIN LATERAL (
        SELECT count(*) AS approved_count
          FROM submissions s JOIN board_revisions br ON br.id = s.board_revision_id
         WHERE br.board_model_id = bm.id AND s.status = 'approved'
      ) approved
      ${whereSql}
     ORDER BY ${ORDER_BY[sort]}
     LIMIT $limit OFFSET $offset`;

  return sequelize.transaction(async (transaction) => {
    if (searching) {
      // set_config(..., true) is SET LOCAL: it ends with this transaction and leaks into no other query
      await sequelize.query("SELECT set_config('pg_trgm.word_similarity_threshold', $w, true), set_config('pg_trgm.similarity_threshold', $s, true)", {
        bind: { w: String(WORD_SIMILARITY_THRESHOLD), s: String(SIMILARITY_THRESHOLD) },
        transaction,
        type: QueryTypes.SELECT,
      });
    }
    const [{ total }] = await sequelize.query<{ total: number }>(countSql, { bind, transaction, type: QueryTypes.SELECT });
    const rows = await sequelize.query<CatalogueRow>(pageSql, {
      bind: { ...bind, limit: params.pageSize, offset: (params.page - 1) * params.pageSize },
      transaction,
      type: QueryTypes.SELECT,
    });
    return {
      rows,
      total,
      page: params.page,
      pageSize: params.pageSize,
      pageCount: Math.max(1, Math.ceil(total / params.pageSize)),
    };
  });
}
