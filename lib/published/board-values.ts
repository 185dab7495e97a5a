import { db } from "@/models";
import type { GroupKey } from "./quantities";
import { readBoardHeader, readBoardValues } from "./board-values-load";
import type { BoardValues, BoardValuesFilter, FamilyUnits, GroupValues, QuantityKey, QuantityValues, RevisionValues } from "./board-values-types";

export * from "./board-values-types";

// One board's published values, for the board page and GET /api/v1/boards/{slug}/values, read
// through an in-process cache:
//  - An entry holds the whole board (every revision and family, with points) and the stamp it
//    was read under (board-values-load.ts). Filtered or point-free views, and their JSON text,
//    are derived from it in memory, so a cache hit does no database work at all.
//  - invalidateBoardValues drops entries as soon as an approval changes a group in this process.
//  - Changes made by another process (npm run stats:rebuild, a second app instance) are noticed by
//    re-reading the stamp (one small query) once an entry is REVALIDATE_AFTER_MS old.
//
// Why not Next's cache: unstable_cache is a legacy API in Next 16, and 'use cache' needs the
// cacheComponents switch for the whole app. revalidateTag only works inside a Server Function or
// Route Handler, and by default serves stale data while it revalidates, whereas moderation needs
// the old figures gone at once, and this code must also work when tests or scripts call it
// directly. A Map lookup is also as close to an empty handler as a cache can get.

const REVALIDATE_AFTER_MS = 10_000;
/**
 * Boards kept. The benchmark showed 500 too few: lookups spread over a 5,000-board catalogue
 * missed 9 times in 10, and each miss costs ~11 ms of SQL. The whole catalogue fits (the median
 * board is ~50 KB with points), so keep it all; the LRU bound only guards against unbounded growth.
 */
const MAX_ENTRIES = 6000;
/** Serialised views kept per board (revision × family × points combinations actually asked for). */
const MAX_BODIES_PER_ENTRY = 32;

type Entry = {
  slug: string;
  stamp: string;
  values: BoardValues;
  allFamilies: FamilyUnits[];
  revisionIds: Set<number>;
  checkedAt: number;
  bodies: Map<string, string>;
};

type Store = {
  entries: Map<string, Entry>;
  /** Bumped by every invalidation: a read that started before one must not be stored after it. */
  epoch: number;
  /** One read per board at a time; concurrent misses share it. */
  pending: Map<string, Promise<Entry | null>>;
};

// On globalThis, like the Sequelize instance, so that every route bundle and dev-mode reload in
// one process shares one cache (and one invalidation reaches all readers).
const globalForCache = globalThis as unknown as { shuntbookBoardValues?: Store };
const store: Store = (globalForCache.shuntbookBoardValues ??= { entries: new Map(), epoch: 0, pending: new Map() });

function touch(entry: Entry): Entry {
  store.entries.delete(entry.slug);
  store.entries.set(entry.slug, entry); // Map order is insertion order: the last is the most recent
  return entry;
}

function remember(entry: Entry): void {
  touch(entry);
  while (store.entries.size > MAX_ENTRIES) store.entries.delete(store.entries.keys().next().value!);
}

async function read(slug: string): Promise<Entry | null> {
  const epoch = store.epoch;
  const sequelize = db();
  const header = await readBoardHeader(sequelize, slug);
  if (!header) return null;
  const cached = store.entries.get(slug);
  if (cached && cached.stamp === header.stamp) {
    cached.checkedAt = Date.now();
    return touch(cached);
  }
  // The stamp is read before the data, so data newer than its stamp can only cause an extra
  // re-read later, never stale data kept under a fresh stamp.
  const { values, allFamilies } = await readBoardValues(sequelize, header);
  const entry: Entry = {
    slug,
    stamp: header.stamp,
    values,
    allFamilies,
    revisionIds: new Set(values.revisions.map((r) => r.id)),
    checkedAt: Date.now(),
    bodies: new Map(),
  };
  if (store.epoch === epoch) remember(entry);
  return entry;
}

/** The cached entry if it is young enough, else a (shared) re-read. */
function entryFor(slug: string): Promise<Entry | null> | Entry {
  const cached = store.entries.get(slug);
  if (cached && Date.now() - cached.checkedAt < REVALIDATE_AFTER_MS) return touch(cached);
  let pending = store.pending.get(slug);
  if (!pending) {
    pending = read(slug).finally(() => store.pending.delete(slug));
    store.pending.set(slug, pending);
  }
  return pending;
}

/**
 * A board's published values with a freshness stamp and a memo for serialised views; null when no
 * board has this slug. The stamp changes whenever the values can have changed, so an ETag made
 * from it (plus the filter) lets a conditional request be answered without touching `values`.
 */
export type BoardValuesSnapshot = {
  stamp: string;
  /** Every revision and family, with points. Do not mutate: it is shared by every reader. */
  values: BoardValues;
  select(filter: BoardValuesFilter): SelectResult;
  /** `build()` once per view key, then the stored text. */
  serialised(key: string, build: () => string): string;
};

export type SelectResult = { ok: true; values: BoardValues } | { ok: false; field: "revision" | "family"; message: string };

export async function loadBoardValues(slug: string): Promise<BoardValuesSnapshot | null> {
  const entry = await entryFor(slug);
  if (!entry) return null;
  return {
    stamp: entry.stamp,
    values: entry.values,
    select: (filter) => selectBoardValues(entry, filter),
    serialised: (key, build) => {
      let body = entry.bodies.get(key);
      if (body === undefined) {
        body = build();
        if (entry.bodies.size >= MAX_BODIES_PER_ENTRY) entry.bodies.delete(entry.bodies.keys().next().value!);
        entry.bodies.set(key, body);
      }
      return body;
    },
  };
}

/** The board page's entry point: the values narrowed by `filter`, or null for an unknown board. */
export async function getBoardValues(slug: string, filter: BoardValuesFilter = {}): Promise<SelectResult | null> {
  const snapshot = await loadBoardValues(slug);
  return snapshot ? snapshot.select(filter) : null;
}

function withoutPoints(q: QuantityValues | null): QuantityValues | null {
  if (!q) return null;
  const { points: _points, ...rest } = q;
  return rest;
}

const KEYS: QuantityKey[] = ["voltageScale", "currentScale", "currentOffset"];

function stripPoints(group: GroupValues): GroupValues {
  const out = { ...group };
  for (const key of KEYS) out[key] = withoutPoints(group[key]);
  return out;
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
  if (!filter.points) revisions = revisions.map((r) => ({ ...r, families: r.families.map(stripPoints) }));
  if (filter.revision !== undefined && filter.family === undefined) {
    const shown = new Set(revisions.flatMap((r) => r.families.map((g) => g.family)));
    families = families.filter((f) => shown.has(f.slug));
  }
  const lastChangeAt = revisions
    .flatMap((r) => r.families.map((g) => g.lastChangeAt))
    .reduce<string | null>((a, b) => (a === null || b > a ? b : a), null);
  return { ok: true, values: { ...values, families, revisions, lastChangeAt } };
}

/** The stamp of a board's values, from the cache when young enough; null for an unknown board. */
export async function boardValuesStamp(slug: string): Promise<string | null> {
  const cached = store.entries.get(slug);
  if (cached && Date.now() - cached.checkedAt < REVALIDATE_AFTER_MS) return touch(cached).stamp;
  // A conditional request needs only the stamp: read the header alone rather than the whole board
  // (the benchmark showed the 304 path no faster than a full lookup when it went through entryFor).
  const epoch = store.epoch;
  const header = await readBoardHeader(db(), slug);
  if (!header) return null;
  if (cached && cached.stamp === header.stamp && store.epoch === epoch) cached.checkedAt = Date.now();
  return header.stamp;
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
  if (target === null) {
    store.entries.clear();
  } else if ("slug" in target) {
    store.entries.delete(target.slug);
  } else {
    const revisions = new Set(target.map((g) => g.boardRevisionId));
    for (const [slug, entry] of store.entries) {
      if ([...entry.revisionIds].some((id) => revisions.has(id))) store.entries.delete(slug);
    }
  }
  // a read in flight may have begun before the change committed; let it finish, but not be stored,
  // and make the next caller start a fresh one
  store.pending.clear();
}
