import { QueryTypes, type Sequelize } from "sequelize";
import { CONFIDENCE_EXPLANATIONS, flagPoints, recommendValue } from "@/lib/stats";
import { type BoardKind, CONFIDENCE_TITLES, type Method, QUANTITIES, type Quantity } from "@/lib/vocabulary";
import type { BoardStatRow } from "@/models/BoardStat";
import { familyUnitColumnsSql, type FamilyUnitFields, type FirmwareFamily } from "@/models/FirmwareFamily";
import { QUANTITY_KEYS, type BoardValues, type FamilyUnits, type GroupValues, type QuantityValues, type ValuePoint } from "./board-values-types";

// Reads one board's published values from PostgreSQL, uncached (values-cache.ts caches them).
// The figures come from board_stats as PostgreSQL computed them; only the per-value flags are
// computed here, with lib/stats, because they belong to each value rather than to the group.

export type BoardHeader = {
  id: number;
  slug: string;
  name: string;
  kind: BoardKind;
  manufacturerSlug: string;
  manufacturerName: string;
  /** Changes whenever anything in this board's values response can change; see BOARD_STAMP_SQL. */
  stamp: string;
};

/** The stamp of board row `bm`, as BOARD_SQL and the change feed (values-cache.ts) read it. */
export const BOARD_STAMP_SQL = `concat_ws('|', bm.id, bm.values_version, (extract(epoch FROM bm.created_at) * 1000000)::bigint)`;

// The stamp is the board row's values_version (migrations/20261212001000-…): the id of the last
// transaction that changed anything the values response is built from. refreshGroups sets it for
// every change to board_stats (and so to the approved submissions behind them, the points), and
// triggers set it for edits to the board, its maker, its revisions and the firmware families.
// created_at tells apart two databases that happen to share ids and transaction ids (a test
// database re-made from a template, a benchmark database seeded again). One index lookup by slug,
// whatever the size of the board: the stamp used to count the board's approved submissions here.
const BOARD_SQL = `
  SELECT bm.id, bm.slug, bm.name, bm.kind, m.slug AS "manufacturerSlug", m.name AS "manufacturerName",
         ${BOARD_STAMP_SQL} AS stamp
    FROM board_models bm JOIN manufacturers m ON m.id = bm.manufacturer_id
   WHERE bm.slug = $slug`;

/** The board's header and freshness stamp, or null when no board has this slug. */
export async function readBoardHeader(sequelize: Sequelize, slug: string): Promise<BoardHeader | null> {
  // no stored slug is longer (CHECK on board_models.slug): skip the round trip
  if (slug.length > 120) return null;
  const [row] = await sequelize.query<BoardHeader>(BOARD_SQL, { bind: { slug }, type: QueryTypes.SELECT });
  return row ?? null;
}

/** The board_stats columns a reader is shown, keyed by the short group names STATS_SQL selects. */
type StatsRow = Omit<BoardStatRow, "boardRevisionId" | "firmwareFamilyId" | "meanAbsDev" | "ciLowerRank" | "ciUpperRank" | "zScaleRule"> & {
  revisionId: number;
  familyId: number;
};

type PointRow = {
  revisionId: number;
  familyId: number;
  method: Method;
  updatedAt: Date;
} & Record<Quantity, number | null>;

type FamilyRow = Pick<FirmwareFamily, "id" | "slug" | "name" | "description"> & FamilyUnitFields;

const REVISIONS_SQL = `SELECT id, label, position FROM board_revisions WHERE board_model_id = $board ORDER BY position, id`;

const STATS_SQL = `
  SELECT bs.board_revision_id AS "revisionId", bs.firmware_family_id AS "familyId", bs.quantity, bs.n,
         bs.median, bs.q1, bs.q3, bs.iqr, bs.mad, bs.scaled_mad AS "scaledMad",
         bs.ci_low AS "ciLow", bs.ci_high AS "ciHigh", bs.ci_coverage AS "ciCoverage",
         bs.outlier_count AS "outlierCount", bs.tukey_count AS "tukeyCount", bs.method_counts AS "methodCounts",
         bs.recommended_value AS "recommendedValue", bs.confidence,
         bs.last_value_at AS "lastValueAt", bs.computed_at AS "computedAt"
    FROM board_stats bs JOIN board_revisions br ON br.id = bs.board_revision_id
   WHERE br.board_model_id = $board`;

// Oldest first, so a chart of the points reads left to right in time.
const POINTS_SQL = `
  SELECT s.board_revision_id AS "revisionId", s.firmware_family_id AS "familyId", s.method, s.updated_at AS "updatedAt",
         s.voltage_scale, s.current_scale, s.current_offset
    FROM submissions s JOIN board_revisions br ON br.id = s.board_revision_id
   WHERE br.board_model_id = $board AND s.status = 'approved'
   ORDER BY s.updated_at, s.id`;

const FAMILIES_SQL = `SELECT id, slug, name, description, ${familyUnitColumnsSql()} FROM firmware_families ORDER BY name, id`;

function familyUnits(f: FamilyRow): FamilyUnits {
  return {
    slug: f.slug,
    name: f.name,
    description: f.description,
    voltageScale: { unit: f.voltageScaleUnit, step: f.voltageScaleStep, response: f.voltageScaleResponse, min: f.voltageScaleMin, max: f.voltageScaleMax },
    currentScale: { unit: f.currentScaleUnit, step: f.currentScaleStep, response: f.currentScaleResponse, min: f.currentScaleMin, max: f.currentScaleMax },
    currentOffset: { unit: f.currentOffsetUnit, step: f.currentOffsetStep, min: f.currentOffsetMin, max: f.currentOffsetMax },
  };
}

/** Every firmware family's units, for a board with nothing published yet (settings from its parts). */
export async function readFamilyUnits(sequelize: Sequelize): Promise<FamilyUnits[]> {
  return (await sequelize.query<FamilyRow>(FAMILIES_SQL, { type: QueryTypes.SELECT })).map(familyUnits);
}

const UNIT_OF: Record<Quantity, (u: FamilyUnits) => { unit: string; step: number }> = {
  voltage_scale: (u) => u.voltageScale,
  current_scale: (u) => u.currentScale,
  current_offset: (u) => u.currentOffset,
};

function quantityValues(row: StatsRow, units: FamilyUnits, points: ValuePoint[] | null): QuantityValues {
  const { unit, step } = UNIT_OF[row.quantity](units);
  // board_stats keeps the recommendation as a whole setting; recommendValue turns it back into the
  // physical value with the same 12-digit cut the recommendation itself used (lib/stats/recommend.ts)
  const physical = recommendValue(row.recommendedValue * step, step)!;
  return {
    n: row.n,
    median: row.median,
    q1: row.q1,
    q3: row.q3,
    iqr: row.iqr,
    mad: row.mad,
    scaledMad: row.scaledMad,
    ciLow: row.ciLow,
    ciHigh: row.ciHigh,
    ciCoverage: row.ciCoverage,
    outlierCount: row.outlierCount,
    tukeyCount: row.tukeyCount,
    methodCounts: row.methodCounts,
    recommended: { setting: row.recommendedValue, value: physical.value, unit, step },
    confidence: { label: row.confidence, title: CONFIDENCE_TITLES[row.confidence], explanation: CONFIDENCE_EXPLANATIONS[row.confidence] },
    lastChangeAt: row.lastValueAt.toISOString(),
    computedAt: row.computedAt.toISOString(),
    // absent rather than undefined, so the point-free JSON has no trace of it
    ...(points ? { points } : {}),
  };
}

/** The group's approved values of one quantity, flagged by lib/stats over exactly those values. */
function pointsOf(rows: PointRow[], quantity: Quantity): ValuePoint[] {
  const present = rows.filter((r) => r[quantity] !== null);
  const flags = flagPoints(present.map((r) => r[quantity]!));
  return present.map((r, i) => ({
    value: flags[i].value,
    method: r.method,
    date: r.updatedAt.toISOString(),
    outlier: flags[i].outlier,
    modifiedZ: flags[i].modifiedZ,
  }));
}

const groupKey = (revisionId: number, familyId: number) => `${revisionId}:${familyId}`;

function groupBy<T>(rows: T[], key: (row: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const row of rows) {
    const k = key(row);
    const list = out.get(k);
    if (list) list.push(row);
    else out.set(k, [row]);
  }
  return out;
}

/**
 * Every revision's published values, and every firmware family's units (the filter needs to know
 * which family slugs exist). With `points`, each quantity also carries its approved values and
 * their flags; without, those are neither read nor flagged: the point-free view is what nearly
 * every reader asks for, and the points are most of the work on a busy board (finding 2 in
 * docs/benchmarks.md: 8.4 of 11.3 ms of SQL for the busiest). Three or four queries, side by side.
 */
export async function readBoardValues(
  sequelize: Sequelize,
  header: BoardHeader,
  { points: withPoints }: { points: boolean },
): Promise<{ values: BoardValues; allFamilies: FamilyUnits[] }> {
  const bind = { board: header.id };
  const [revisions, stats, families, points] = await Promise.all([
    sequelize.query<{ id: number; label: string; position: number }>(REVISIONS_SQL, { bind, type: QueryTypes.SELECT }),
    sequelize.query<StatsRow>(STATS_SQL, { bind, type: QueryTypes.SELECT }),
    sequelize.query<FamilyRow>(FAMILIES_SQL, { type: QueryTypes.SELECT }),
    withPoints ? sequelize.query<PointRow>(POINTS_SQL, { bind, type: QueryTypes.SELECT }) : Promise.resolve([]),
  ]);

  const unitsById = new Map(families.map((f) => [f.id, familyUnits(f)]));
  const statsByGroup = groupBy(stats, (r) => groupKey(r.revisionId, r.familyId));
  const pointsByGroup = groupBy(points, (r) => groupKey(r.revisionId, r.familyId));
  const usedFamilies = new Set<number>();
  let newest: string | null = null;

  const revisionValues = revisions.map((revision) => {
    const groups: GroupValues[] = [];
    for (const family of families) {
      const rows = statsByGroup.get(groupKey(revision.id, family.id));
      if (!rows) continue;
      const units = unitsById.get(family.id)!;
      const groupPoints = pointsByGroup.get(groupKey(revision.id, family.id)) ?? [];
      const group = { family: family.slug, lastChangeAt: "", voltageScale: null, currentScale: null, currentOffset: null } as GroupValues;
      for (const quantity of QUANTITIES) {
        const row = rows.find((r) => r.quantity === quantity);
        if (!row) continue;
        const q = quantityValues(row, units, withPoints ? pointsOf(groupPoints, quantity) : null);
        group[QUANTITY_KEYS[quantity]] = q;
        if (q.lastChangeAt > group.lastChangeAt) group.lastChangeAt = q.lastChangeAt;
      }
      if (newest === null || group.lastChangeAt > newest) newest = group.lastChangeAt;
      usedFamilies.add(family.id);
      groups.push(group);
    }
    return { id: revision.id, label: revision.label, position: revision.position, families: groups };
  });

  return {
    values: {
      board: { slug: header.slug, name: header.name, kind: header.kind, manufacturer: { slug: header.manufacturerSlug, name: header.manufacturerName } },
      families: families.filter((f) => usedFamilies.has(f.id)).map((f) => unitsById.get(f.id)!),
      revisions: revisionValues,
      lastChangeAt: newest,
    },
    allFamilies: [...unitsById.values()],
  };
}
