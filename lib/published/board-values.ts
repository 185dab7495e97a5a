import type { BoardValues, BoardValuesFilter, RevisionValues } from "./board-values-types";
import { cachedBoard, cachedStamp, type CachedBoard } from "./values-cache";
import { readFamilyUnits } from "./board-values-load";
import { db } from "@/models";

export * from "./board-values-types";
export { checkBoardValuesFeed, invalidateBoardValues } from "./values-cache";

// One board's published values, for the board page and GET /api/v1/boards/{slug}/values, read
// through the values cache (values-cache.ts): whole boards are cached, and the filtered views
// are derived from an entry in memory, with whatever a caller builds from a view kept beside it.

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

function snapshotOf(entry: CachedBoard): BoardValuesSnapshot {
  return {
    stamp: entry.stamp,
    values: entry.values,
    select: (filter) => selectBoardValues(entry, filter),
    view: <T>(key: string, build: () => T): T => {
      const kept = entry.views.peek(key);
      if (kept) return kept.built as T;
      const built = build();
      entry.views.set(key, { built });
      return built;
    },
    peek: <T>(key: string) => entry.views.peek(key)?.built as T | undefined,
  };
}

/** The values of one board, with points only when `points` (they are cached apart). */
export async function loadBoardValues(slug: string, { points = false }: { points?: boolean } = {}): Promise<BoardValuesSnapshot | null> {
  const entry = await cachedBoard(slug, points);
  return entry ? snapshotOf(entry) : null;
}

/** Every firmware family's units: what a board with nothing published can be computed in. */
export function listFamilyUnits() {
  return readFamilyUnits(db());
}

/** The board page's entry point: the values narrowed by `filter`, or null for an unknown board. */
export async function getBoardValues(slug: string, filter: BoardValuesFilter = {}): Promise<SelectResult | null> {
  const snapshot = await loadBoardValues(slug, { points: filter.points === true });
  return snapshot ? snapshot.select(filter) : null;
}

function selectBoardValues(entry: CachedBoard, filter: BoardValuesFilter): SelectResult {
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
  const lastChangeAt = revisions.flatMap((r) => r.families.map((g) => g.lastChangeAt)).reduce<string | null>((a, b) => (a === null || b > a ? b : a), null);
  return { ok: true, values: { ...values, families, revisions, lastChangeAt } };
}

/**
 * What a conditional request needs: the stamp of the board's values, and the cached snapshot when
 * there is one (so that what was built from a view, e.g. its ETag, can be reused). Without a
 * cached entry only the board's stamp is read, not the board (one index lookup); null for an
 * unknown board.
 */
export async function boardValuesStamp(
  slug: string,
  { points = false }: { points?: boolean } = {},
): Promise<{ stamp: string; snapshot: BoardValuesSnapshot | null } | null> {
  const found = await cachedStamp(slug, points);
  return found ? { stamp: found.stamp, snapshot: found.entry ? snapshotOf(found.entry) : null } : null;
}
