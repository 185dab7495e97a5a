import { QueryTypes, type Sequelize } from "sequelize";
import { BOARD_STAMP_SQL } from "./board-values-load";

// The change feed the values cache revalidates by (board-values.ts): one small query, at most
// about once a second for the whole catalogue, instead of a stamp query per board whenever its
// entry is a few seconds old (with 5,000 boards asked for at random that was one query for most
// requests; docs/benchmarks.md).
//
// Every change to a board's values sets board_models.values_version to the id of the changing
// transaction (migrations/20261212001000-…). A look at the feed asks for the boards whose
// version is at least the "horizon" of the previous look: the oldest transaction that was still
// running when that look's snapshot was taken (pg_snapshot_xmin). Every transaction whose changes
// that snapshot could not see has an id at or above it, however long it ran before committing, so
// no commit falls between two looks. (A time stamp could not promise that: a transaction that
// stamps early and commits late would slip behind a look that had already moved past its time.)
// Some boards are listed again by the next look; comparing stamps makes that harmless.

export type FeedLook = {
  /** The horizon to ask from next time. */
  horizon: string;
  /** Boards that may have changed since the previous look, with their current stamps. */
  changed: Array<[slug: string, stamp: string]>;
};

// pg_current_snapshot() is the statement's own snapshot, so the horizon and the rows agree.
// With no horizon yet (the first look) only the horizon is read. board_models_values_version_idx
// answers the range.
const FEED_SQL = `
  SELECT pg_snapshot_xmin(pg_current_snapshot())::text AS horizon,
         coalesce((SELECT json_agg(json_build_array(bm.slug, ${BOARD_STAMP_SQL}))
                     FROM board_models bm
                    WHERE bm.values_version >= CAST($since AS xid8)), '[]'::json) AS changed`;

/** One look at the feed: what changed since `since` (a horizon from the previous look; null: nothing, just start). */
export async function lookAtFeed(sequelize: Sequelize, since: string | null): Promise<FeedLook> {
  const [row] = await sequelize.query<FeedLook>(FEED_SQL, { bind: { since }, type: QueryTypes.SELECT });
  return row;
}
