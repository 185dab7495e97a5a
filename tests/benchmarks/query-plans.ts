import { QueryTypes, type Sequelize } from "sequelize";
import { readBoardHeader, readBoardValues } from "@/lib/published/board-values-load";

// EXPLAIN (ANALYZE, BUFFERS) of exactly the SQL a values lookup runs on a cache miss. Rather than
// copy the statements out of lib/published/board-values-load.ts (where they would drift), the
// lookup's own functions are called with a Sequelize whose query() records each statement and its
// parameters; each is then explained with the same parameters.

export type QueryPlan = { sql: string; plan: string; executionMs: number | null };
export type LookupPlans = { slug: string; approvedSubmissions: number; why: string; queries: QueryPlan[] };

type Captured = { sql: string; options: { bind?: unknown; replacements?: unknown } };

function recording(sequelize: Sequelize, captured: Captured[]): Sequelize {
  return new Proxy(sequelize, {
    get(target, property, receiver) {
      if (property !== "query") return Reflect.get(target, property, receiver);
      return (sql: string, options: Captured["options"] = {}) => {
        captured.push({ sql, options });
        return target.query(sql, options as never);
      };
    },
  });
}

const squeeze = (sql: string) => sql.replace(/\s+/g, " ").trim();

export async function explainLookup(sequelize: Sequelize, slug: string): Promise<QueryPlan[]> {
  const captured: Captured[] = [];
  const recorder = recording(sequelize, captured);
  const header = await readBoardHeader(recorder, slug);
  if (!header) throw new Error(`no board has the slug ${slug}`);
  // the default view, as the benchmark asks for it: without points (points=1 adds POINTS_SQL)
  await readBoardValues(recorder, header, { points: false });
  const plans: QueryPlan[] = [];
  // each statement once more, explained (the run above warmed the buffer cache, as traffic would)
  for (const { sql, options } of captured) {
    const rows = await sequelize.query<{ "QUERY PLAN": string }>(`EXPLAIN (ANALYZE, BUFFERS) ${sql}`, {
      bind: options.bind as never,
      replacements: options.replacements as never,
      type: QueryTypes.SELECT,
    });
    const plan = rows.map((r) => r["QUERY PLAN"]).join("\n");
    const time = /Execution Time: ([\d.]+) ms/.exec(plan);
    plans.push({ sql: squeeze(sql), plan, executionMs: time ? Number(time[1]) : null });
  }
  return plans;
}

/** The board with the most approved submissions and the median one, by approved submissions. */
export async function boardsToExplain(sequelize: Sequelize): Promise<Array<{ slug: string; approvedSubmissions: number; why: string }>> {
  const rows = await sequelize.query<{ slug: string; n: number }>(
    `SELECT bm.slug, count(s.id)::int AS n
       FROM board_models bm
       JOIN board_revisions br ON br.board_model_id = bm.id
       LEFT JOIN submissions s ON s.board_revision_id = br.id AND s.status = 'approved'
      GROUP BY bm.slug ORDER BY n DESC, bm.slug`,
    { type: QueryTypes.SELECT },
  );
  if (rows.length === 0) return [];
  const busiest = rows[0];
  const median = rows[Math.floor(rows.length / 2)];
  return [
    { slug: median.slug, approvedSubmissions: median.n, why: "median board by approved submissions" },
    { slug: busiest.slug, approvedSubmissions: busiest.n, why: "busiest board" },
  ];
}

export async function explainLookups(sequelize: Sequelize): Promise<LookupPlans[]> {
  const out: LookupPlans[] = [];
  for (const board of await boardsToExplain(sequelize)) out.push({ ...board, queries: await explainLookup(sequelize, board.slug) });
  return out;
}
