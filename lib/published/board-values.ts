import { db } from "@/models";
import type { GroupKey } from "./group-key";
import { lookAtFeed } from "./board-values-feed";
import { readBoardHeader, readBoardValues } from "./board-values-load";
import type { BoardValues, BoardValuesFilter, FamilyUnits, RevisionValues } from "./board-values-types";

export * from "./board-values-types";

// One board's published values, for the board page and GET /api/v1/boards/{slug}/values, read
// through an in-process cache:
//  - Two caches: the point-free values (what nearly every reader asks for, small enough to keep
//    the whole catalogue) and the values with points (points=1, the board page's charts; big,
//    so fewer are kept). A point-free miss never reads or flags the points (finding 2 in
//    docs/benchmarks.md). Filtered views are derived from an entry in memory, and whatever the
//    caller builds from a view (the API's JSON bytes and their ETag) is
//    kept beside it, so a cache hit does no database work, no serialising and no hashing.
//  - invalidateBoardValues drops entries as soon as an approval changes a group in this process.
//  - Changes made by another process (npm run stats:rebuild, a second app instance) are noticed
//    through the change feed (board-values-feed.ts): one small query for the whole catalogue
//    about once a second, never more than REVALIDATE_AFTER_MS behind; an entry is read again
//    only when its board changed.
//
// Why not Next's cache: unstable_cache is a legacy API in Next 16, and 'use cache' needs the
// cacheComponents switch for the whole app. revalidateTag only works inside a Server Function or
// Route Handler, and by default serves stale data while it revalidates, whereas moderation needs
// the old figures gone at once, and this code must also work when tests or scripts call it
// directly. A Map lookup is also as close to an empty handler as a cache can get.

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
/** Built views kept per board (revision × family combinations actually asked for). */
const MAX_VIEWS_PER_ENTRY = 32;

type Entry = {
  slug: string;
  stamp: string;
  values: BoardValues;
  allFamilies: FamilyUnits[];
  revisionIds: Set<number>;
  readAt: number;
  views: Map<string, unknown>;
};

type Cache = {
  entries: Map<string, Entry>;
  /** One read per board at a time; concurrent misses share it. */
  pending: Map<string, Promise<Entry | null>>;
  max: number;
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

const newCache = (max: number): Cache => ({ entries: new Map(), pending: new Map(), max });

// On globalThis, like the Sequelize instance, so that every route bundle and dev-mode reload in
// one process shares one cache (and one invalidation reaches all readers).
const globalForCache = globalThis as unknown as { shuntbookBoardValues?: Store };
const store: Store = (globalForCache.shuntbookBoardValues ??= {
  plain: newCache(MAX_PLAIN_ENTRIES),
  points: newCache(MAX_POINTS_ENTRIES),
  epoch: 0,
  feed: { horizon: null, seenAt: 0, startedAt: 0, looking: null },
});

const cacheFor = (points: boolean): Cache => (points ? store.points : store.plain);
const caches = (): Cache[] => [store.plain, store.points];

function touch(cache: Cache, entry: Entry): Entry {
  cache.entries.delete(entry.slug);
  cache.entries.set(entry.slug, entry); // Map order is insertion order: the last is the most recent
  return entry;
}

function remember(cache: Cache, entry: Entry): void {
  touch(cache, entry);
  while (cache.entries.size > cache.max) cache.entries.delete(cache.entries.keys().next().value!);
}

/** Drops what the feed lists as changed; a read in flight for such a board must not be stored. */
function applyLook(changed: Array<[string, string]>): void {
  let racing = false;
  for (const [slug, stamp] of changed) {
    for (const cache of caches()) {
      const entry = cache.entries.get(slug);
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

async function read(cache: Cache, slug: string, points: boolean): Promise<Entry | null> {
  const epoch = store.epoch;
  const sequelize = db();
  const header = await readBoardHeader(sequelize, slug);
  if (!header) {
    cache.entries.delete(slug); // the board is gone (or never was)
    return null;
  }
  const cached = cache.entries.get(slug);
  if (cached && cached.stamp === header.stamp) {
    cached.readAt = Date.now();
    return touch(cache, cached);
  }
  // The stamp is read before the data, so data newer than its stamp can only cause an extra
  // re-read later, never stale data kept under a fresh stamp.
  const { values, allFamilies } = await readBoardValues(sequelize, header, { points });
  const entry: Entry = {
    slug,
    stamp: header.stamp,
    values,
    allFamilies,
    revisionIds: new Set(values.revisions.map((r) => r.id)),
    readAt: Date.now(),
    views: new Map(),
  };
  if (store.epoch === epoch) remember(cache, entry);
  return entry;
}

/** The cached entry, or a (shared) read; resolves after a due look at the feed. */
function entryFor(slug: string, points: boolean): Promise<Entry | null> | Entry {
  const waiting = feedFreshness();
  return waiting ? waiting.then(() => cachedOrRead(slug, points)) : cachedOrRead(slug, points);
}

function cachedOrRead(slug: string, points: boolean): Promise<Entry | null> | Entry {
  const cache = cacheFor(points);
  const cached = cache.entries.get(slug);
  if (cached && Date.now() - cached.readAt < RECHECK_AFTER_MS) return touch(cache, cached);
  let pending = cache.pending.get(slug);
  if (!pending) {
    pending = read(cache, slug, points).finally(() => {
      if (cache.pending.get(slug) === pending) cache.pending.delete(slug);
    });
    cache.pending.set(slug, pending);
  }
  return pending;
}

/**
 * A board's published values with a freshness stamp and a memo for what is built from its views;
 * null when no board has this slug. The stamp changes whenever the values can have changed, so an
 * ETag made from it (plus the view) lets a conditional request be answered without a body.
 */
export type BoardValuesSnapshot = {
  stamp: string;
  /** Every revision and family; with points only if asked for. Shared by every reader: do not mutate. */
  values: BoardValues;
  select(filter: BoardValuesFilter): SelectResult;
  /** `build()` once per view key while this entry lives, then the stored result. */
  view<T>(key: string, build: () => T): T;
  /** What `view` stored under this key, if anything; never builds. */
  peek<T>(key: string): T | undefined;
};

export type SelectResult = { ok: true; values: BoardValues } | { ok: false; field: "revision" | "family"; message: string };

function snapshotOf(entry: Entry): BoardValuesSnapshot {
  return {
    stamp: entry.stamp,
    values: entry.values,
    select: (filter) => selectBoardValues(entry, filter),
    view: <T>(key: string, build: () => T): T => {
      if (entry.views.has(key)) return entry.views.get(key) as T;
      const built = build();
      if (entry.views.size >= MAX_VIEWS_PER_ENTRY) entry.views.delete(entry.views.keys().next().value!);
      entry.views.set(key, built);
      return built;
    },
    peek: <T>(key: string) => entry.views.get(key) as T | undefined,
  };
}

/** The values of one board, with points only when `points` (they are cached apart). */
export async function loadBoardValues(slug: string, { points = false }: { points?: boolean } = {}): Promise<BoardValuesSnapshot | null> {
  const entry = await entryFor(slug, points);
  return entry ? snapshotOf(entry) : null;
}

/** The board page's entry point: the values narrowed by `filter`, or null for an unknown board. */
export async function getBoardValues(slug: string, filter: BoardValuesFilter = {}): Promise<SelectResult | null> {
  const snapshot = await loadBoardValues(slug, { points: filter.points === true });
  return snapshot ? snapshot.select(filter) : null;
}

function selectBoardValues(entry: Entry, filter: BoardValuesFilter): SelectResult {
  const { values } = entry;
  let revisions: RevisionValues[] = values.revisions;
  if (filter.revision !== undefined) {
    const wanted = filter.revision.toLowerCase();
    revisions = revisions.filter((r) => r.label.toLowerCase() === wanted);
    if (revisions.length === 0) {
      const labels = values.revisions.map((r) => r.label);
      return {
        ok: false,
        field: "revision",
        message: labels.length
          ? `This board has no revision "${filter.revision}"; its revisions are: ${labels.join(", ")}`
          : `This board has no revisions on record, so there is no revision "${filter.revision}"`,
      };
    }
  }
  let families = values.families;
  if (filter.family !== undefined) {
    const family = entry.allFamilies.find((f) => f.slug === filter.family);
    if (!family) {
      return {
        ok: false,
        field: "family",
        message: `No firmware family has the slug "${filter.family}"; the families are: ${entry.allFamilies.map((f) => f.slug).join(", ")}`,
      };
    }
    families = [family];
    revisions = revisions.map((r) => ({ ...r, families: r.families.filter((g) => g.family === family.slug) }));
  }
  // an entry without points never had them; one with points is asked for only with points=1
  if (filter.revision !== undefined && filter.family === undefined) {
    const shown = new Set(revisions.flatMap((r) => r.families.map((g) => g.family)));
    families = families.filter((f) => shown.has(f.slug));
  }
  const lastChangeAt = revisions
    .flatMap((r) => r.families.map((g) => g.lastChangeAt))
    .reduce<string | null>((a, b) => (a === null || b > a ? b : a), null);
  return { ok: true, values: { ...values, families, revisions, lastChangeAt } };
}

/**
 * What a conditional request needs: the stamp of the board's values, and the cached snapshot when
 * there is one (so that what was built from a view, e.g. its ETag, can be reused). Without a
 * cached entry only the board's stamp is read, not the board (one index lookup); null for an
 * unknown board.
 */
export async function boardValuesStamp(slug: string, { points = false }: { points?: boolean } = {}): Promise<{ stamp: string; snapshot: BoardValuesSnapshot | null } | null> {
  const waiting = feedFreshness();
  if (waiting) await waiting;
  const cache = cacheFor(points);
  const cached = cache.entries.get(slug);
  if (cached && Date.now() - cached.readAt < RECHECK_AFTER_MS) return { stamp: touch(cache, cached).stamp, snapshot: snapshotOf(cached) };
  const header = await readBoardHeader(db(), slug);
  return header ? { stamp: header.stamp, snapshot: null } : null;
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
      for (const [slug, entry] of cache.entries) {
        if ([...entry.revisionIds].some((id) => revisions!.has(id))) cache.entries.delete(slug);
      }
    }
    // a read in flight may have begun before the change committed; let it finish, but not be
    // stored, and make the next caller start a fresh one
    cache.pending.clear();
  }
}
