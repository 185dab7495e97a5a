import { QueryTypes } from "sequelize";
import { db } from "@/models";
import type { BoardKind } from "@/lib/vocabulary";

export type HomeCounts = {
  boards: number;
  revisions: number;
  approvedValues: number;
  /** Boards per kind; a kind with no boards is absent. */
  boardsByKind: Partial<Record<BoardKind, number>>;
};

/** The few totals the home page shows, in one round trip. */
export async function getHomeCounts(): Promise<HomeCounts> {
  const [row] = await db().query<{
    boards: number;
    revisions: number;
    approvedValues: number;
    byKind: Record<string, number> | null;
  }>(
    `SELECT (SELECT count(*) FROM board_models) AS boards,
            (SELECT count(*) FROM board_revisions) AS revisions,
            (SELECT count(*) FROM submissions WHERE status = 'approved') AS "approvedValues",
            (SELECT jsonb_object_agg(kind, n) FROM (SELECT kind, count(*) AS n FROM board_models GROUP BY kind) k) AS "byKind"`,
    { type: QueryTypes.SELECT },
  );
  return {
    boards: row.boards,
    revisions: row.revisions,
    approvedValues: row.approvedValues,
    boardsByKind: (row.byKind ?? {}) as Partial<Record<BoardKind, number>>,
  };
}
