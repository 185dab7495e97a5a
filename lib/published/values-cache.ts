import { LRUCache } from "lru-cache";
import { QueryTypes, type Sequelize } from "sequelize";
import { db } from "@/models";
import { BOARD_STAMP_SQL, readBoardHeader, readBoardValues } from "./board-values-load";
import type { BoardValues, FamilyUnits } from "./board-values-types";
import type { GroupKey } from "./group-key";

// The in-process cache of boards' published values (board-values.ts reads through it).
//
// Design:
//  - Two LRU caches by board slug: the point-free values (what nearly every reader asks for, small
//    enough to keep the whole catalogue) and the values with points (points=1, the board page's
//    charts; big, so fewer are kept). A point-free miss never reads or flags the points (finding 2
//    in docs/benchmarks.md). Each entry also keeps what callers built from its views (the API's
//    JSON bytes and their ETag), so a hit does no database work, no serialising and no hashing.
//  - Concurrent misses of one board share one read.
//  - invalidateBoardValues drops entries as soon as an approval changes a group in this process;
//    a read in flight then finishes but is not stored (the epoch counter).
//  - Changes made by another process (npm run stats:rebuild, a second app instance) are noticed
//    through the change feed below: one small query for the whole catalogue about once a second,
//    never more than REVALIDATE_AFTER_MS behind; an entry is read again only when its board changed.
//  - Everything lives on globalThis, like the Sequelize instance, so every route bundle and
//    dev-mode reload in one process shares one cache and one invalidation reaches all readers.
//
// Why not Next's cache: unstable_cache is a legacy API in Next 16, and 'use cache' needs the
// cacheComponents switch for the whole app. revalidateTag only works inside a Server Function or
// Route Handler, and by default serves stale data while it revalidates, whereas moderation needs
// the old figures gone at once, and this code must also work when tests or scripts call it
// directly. A map lookup is also as close to an empty handler as a cache can get.

/** A look at the change feed is started when the last one began at least this long ago ... */
const LOOK_EVERY_MS = 1_000;
/** ... and waited for when the last completed one began longer ago than this (an idle process). */
const REVALIDATE_AFTER_MS = 10_000;
/**
 * Safety net: an entry is checked against its board's own stamp after this long. The feed lists
 * boards whose row changed; a deleted board has no row left to list (no path in the app deletes
 * boards; the demo seeder's undo does).
 */
const RECHECK_AFTER_MS = 300_000;
/**
 * Boards kept without points. The benchmark showed 500 too few: lookups spread over a 5,000-board
 * catalogue missed 9 times in 10. Without points the median board is ~13 KB, so keep it all; the
 * LRU bound only guards against unbounded growth.
 */
const MAX_PLAIN_ENTRIES = 6000;
/** Boards kept with points: the median board is ~50 KB with them, the busiest ~750 KB. */
const MAX_POINTS_ENTRIES = 1000;
/** Built views kept per board (revision × family combinations actually asked for); the first built goes first. */
const MAX_VIEWS_PER_ENTRY = 32;

export type CachedBoard = {
  slug: string;
  /** The board's values stamp when it was read (board-values-load.ts BOARD_STAMP_SQL). */
  stamp: string;
  values: BoardValues;
  allFamilies: FamilyUnits[];
  revisionIds: Set<number>;
  readAt: number;
  /** What callers built from this entry's views, by view key; read with peek (no reordering). */
  views: LRUCache<string, { built: unknown }>;
};

type Cache = {
  entries: LRUCache<string, CachedBoard>;
  /** One read per board at a time; concurrent misses share it. */
  pending: Map<string, Promise<CachedBoard | null>>;
};

type Store = {
  plain: Cache;
  points: Cache;
  /** Bumped by every invalidation: a read that started before one must not be stored after it. */
  epoch: number;
  feed: {
    /** From the last completed look; null before the first. */
    horizon: string | null;
    /** When the last completed look began (ms). */
    seenAt: number;
    /** When the last look began. */
    startedAt: number;
    looking: Promise<void> | null;
  };
};

const newCache = (max: number): Cache => ({ entries: new LRUCache({ max }), pending: new Map() });

const globalForCache = globalThis as unknown as { shuntbookValuesCache?: Store };
const store: Store = (globalForCache.shuntbookValuesCache ??= {
  plain: newCache(MAX_PLAIN_ENTRIES),
  points: newCache(MAX_POINTS_ENTRIES),
  epoch: 0,
  feed: { horizon: null, seenAt: 0, startedAt: 0, looking: null },
});

const cacheFor = (points: boolean): Cache => (points ? store.points : store.plain);
const caches = (): Cache[] => [store.plain, store.points];

// The change feed. Every change to a board's values sets board_models.values_version to the id
// of the changing transaction (migrations/20261212001000-…). A look at the feed asks for the
// boards whose version is at least the "horizon" of the previous look: the oldest transaction
// that was still running when that look's snapshot was taken (pg_snapshot_xmin). Every
// transaction whose changes that snapshot could not see has an id at or above it, however long it
// ran before committing, so no commit falls between two looks. (A time stamp could not promise
// that: a transaction that stamps early and commits late would slip behind a look that had
// already moved past its time.) Some boards are listed again by the next look; comparing stamps
// makes that harmless. One such query about once a second replaces a stamp query per board
// whenever its entry is a few seconds old (with 5,000 boards asked for at random that was one
// query for most requests; docs/benchmarks.md).

type FeedLook = {
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
async function lookAtFeed(sequelize: Sequelize, since: string | null): Promise<FeedLook> {
  const [row] = await sequelize.query<FeedLook>(FEED_SQL, { bind: { since }, type: QueryTypes.SELECT });
  return row;
}

/** Drops what the feed lists as changed; a read in flight for such a board must not be stored. */
function applyLook(changed: Array<[string, string]>): void {
  let racing = false;
  for (const [slug, stamp] of changed) {
    for (const cache of caches()) {
      const entry = cache.entries.peek(slug);
      if (entry && entry.stamp !== stamp) cache.entries.delete(slug);
      if (cache.pending.has(slug)) {
        cache.pending.delete(slug);
        racing = true;
      }
    }
  }
  if (racing) store.epoch += 1;
}

function look(): Promise<void> {
  const startedAt = Date.now();
  store.feed.startedAt = startedAt;
  const looking = lookAtFeed(db(), store.feed.horizon)
    .then(({ horizon, changed }) => {
      applyLook(changed);
      store.feed.horizon = horizon;
      store.feed.seenAt = startedAt;
    })
    .finally(() => {
      store.feed.looking = null;
    });
  store.feed.looking = looking;
  // a look nobody waits for must not be an unhandled rejection; the next one tries again
  looking.catch(() => undefined);
  return looking;
}

/** Starts a look in the background when one is due; returns a promise when the cache must wait for it. */
function feedFreshness(): Promise<void> | undefined {
  const now = Date.now();
  const { feed } = store;
  if (!feed.looking && now - feed.startedAt >= LOOK_EVERY_MS) look();
  if (now - feed.seenAt >= REVALIDATE_AFTER_MS) return feed.looking ?? look();
  return undefined;
}

/** Waits for a look at the change feed and applies it (tests, or after a change made elsewhere). */
export async function checkBoardValuesFeed(): Promise<void> {
  if (store.feed.looking) await store.feed.looking.catch(() => undefined);
  await look();
}

async function read(cache: Cache, slug: string, points: boolean): Promise<CachedBoard | null> {
  const epoch = store.epoch;
  const sequelize = db();
  const header = await readBoardHeader(sequelize, slug);
  if (!header) {
    cache.entries.delete(slug); // the board is gone (or never was)
    return null;
  }
  const cached = cache.entries.peek(slug);
  if (cached && cached.stamp === header.stamp) {
    cached.readAt = Date.now();
    return cache.entries.get(slug)!; // a confirmed entry becomes the most recently used
  }
  // The stamp is read before the data, so data newer than its stamp can only cause an extra
  // re-read later, never stale data kept under a fresh stamp.
  const { values, allFamilies } = await readBoardValues(sequelize, header, { points });
  const entry: CachedBoard = {
    slug,
    stamp: header.stamp,
    values,
    allFamilies,
    revisionIds: new Set(values.revisions.map((r) => r.id)),
    readAt: Date.now(),
    views: new LRUCache({ max: MAX_VIEWS_PER_ENTRY }),
  };
  if (store.epoch === epoch) cache.entries.set(slug, entry);
  return entry;
}

/** A fresh enough cached entry, marked most recently used; undefined when it must be (re)read. */
function freshEntry(cache: Cache, slug: string): CachedBoard | undefined {
  const cached = cache.entries.peek(slug);
  return cached && Date.now() - cached.readAt < RECHECK_AFTER_MS ? cache.entries.get(slug) : undefined;
}

function cachedOrRead(slug: string, points: boolean): Promise<CachedBoard | null> | CachedBoard {
  const cache = cacheFor(points);
  const cached = freshEntry(cache, slug);
  if (cached) return cached;
  let pending = cache.pending.get(slug);
  if (!pending) {
    pending = read(cache, slug, points).finally(() => {
      if (cache.pending.get(slug) === pending) cache.pending.delete(slug);
    });
    cache.pending.set(slug, pending);
  }
  return pending;
}

/** A board's cached values, or a (shared) read; null for an unknown board. Resolves after a due look at the feed. */
export function cachedBoard(slug: string, points: boolean): Promise<CachedBoard | null> | CachedBoard {
  const waiting = feedFreshness();
  return waiting ? waiting.then(() => cachedOrRead(slug, points)) : cachedOrRead(slug, points);
}

/**
 * The board's values stamp, and its cached entry when there is a fresh one. Without one only the
 * stamp is read, not the board (one index lookup); null for an unknown board.
 */
export async function cachedStamp(slug: string, points: boolean): Promise<{ stamp: string; entry: CachedBoard | null } | null> {
  const waiting = feedFreshness();
  if (waiting) await waiting;
  const cached = freshEntry(cacheFor(points), slug);
  if (cached) return { stamp: cached.stamp, entry: cached };
  const header = await readBoardHeader(db(), slug);
  return header ? { stamp: header.stamp, entry: null } : null;
}

/**
 * Drops the cached values of the boards these groups belong to. Call it after the transaction
 * that changed them has committed (e.g. `transaction.afterCommit(() => invalidateBoardValues(groups))`
 * next to refreshGroups), so no reader can re-cache the old figures in between. With no argument
 * (or null) everything is dropped, e.g. after a full rebuild; `{ slug }` drops one board, e.g.
 * after its details were edited.
 */
export function invalidateBoardValues(target: readonly GroupKey[] | { slug: string } | null = null): void {
  store.epoch += 1;
  const revisions = target && !("slug" in target) ? new Set(target.map((g) => g.boardRevisionId)) : null;
  for (const cache of caches()) {
    if (target === null) {
      cache.entries.clear();
    } else if ("slug" in target) {
      cache.entries.delete(target.slug);
    } else {
      for (const [slug, entry] of [...cache.entries.entries()]) {
        if ([...entry.revisionIds].some((id) => revisions!.has(id))) cache.entries.delete(slug);
      }
    }
    // a read in flight may have begun before the change committed; let it finish, but not be
    // stored, and make the next caller start a fresh one
    cache.pending.clear();
  }
}
