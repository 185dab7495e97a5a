import { QueryTypes, type Sequelize } from "sequelize";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { BOARD_KINDS, type BoardKind } from "@/lib/vocabulary";
import { FAMILY_UNIT_COLUMNS } from "@/models/FirmwareFamily";

// The benchmark's synthetic data set: invented makers and boards named by number (nothing here is
// meant to look like a product), the demo's three invented firmware families, and as many
// submissions as asked for. The catalogue (at most 5 000 boards and 15 000 revisions) is built
// here as plain rows and sent as one JSON document per table; the submissions (up to a million)
// are generated inside PostgreSQL by one INSERT … SELECT over generate_series, so no row crosses
// the wire. The random draws are seeded (setseed), so a size always gets the same data.

export type SyntheticManufacturer = { slug: string; name: string };
export type SyntheticBoard = {
  slug: string;
  name: string;
  manufacturerSlug: string;
  kind: BoardKind;
  mountingPattern: string;
  minCells: number;
  maxCells: number;
};
export type SyntheticRevision = { boardSlug: string; label: string; position: number };
export type SyntheticCatalogue = { manufacturers: SyntheticManufacturer[]; boards: SyntheticBoard[]; revisions: SyntheticRevision[] };

/** Boards per invented maker: a long list of makers each with a few dozen boards. */
const BOARDS_PER_MAKER = 40;
const MOUNTING_PATTERNS = ["30.5x30.5", "20x20", "25.5x25.5", "16x16"] as const;
const CELL_RANGES = [
  [2, 6],
  [1, 4],
  [3, 8],
  [2, 12],
] as const;

const pad = (n: number, width: number) => String(n).padStart(width, "0");

/** Board i (from 0) has 1, 2 or 3 revisions in turn: two on average, as catalogues tend to. */
export function revisionsOfBoard(i: number): number {
  return 1 + (i % 3);
}

export function buildSyntheticCatalogue(boardCount: number): SyntheticCatalogue {
  const makerCount = Math.max(1, Math.ceil(boardCount / BOARDS_PER_MAKER));
  const manufacturers = Array.from({ length: makerCount }, (_, m) => ({ slug: `benchmark-maker-${pad(m + 1, 3)}`, name: `Benchmark Maker ${pad(m + 1, 3)}` }));
  const boards: SyntheticBoard[] = [];
  const revisions: SyntheticRevision[] = [];
  for (let i = 0; i < boardCount; i++) {
    const slug = `benchmark-board-${pad(i + 1, 5)}`;
    const [minCells, maxCells] = CELL_RANGES[i % CELL_RANGES.length];
    boards.push({
      slug,
      name: `Benchmark Board ${pad(i + 1, 5)}`,
      manufacturerSlug: manufacturers[i % makerCount].slug,
      kind: BOARD_KINDS[i % BOARD_KINDS.length],
      mountingPattern: MOUNTING_PATTERNS[i % MOUNTING_PATTERNS.length],
      minCells,
      maxCells,
    });
    for (let k = 0; k < revisionsOfBoard(i); k++) revisions.push({ boardSlug: slug, label: `v${k + 1}`, position: k });
  }
  return { manufacturers, boards, revisions };
}

/** Contributors: about 40 submissions each, within bounds that keep small sizes varied. */
export function syntheticUserCount(submissions: number): number {
  return Math.min(25_000, Math.max(20, Math.ceil(submissions / 40)));
}

export type FamilyDraw = {
  slug: string;
  /** submissions whose uniform draw falls in [lo, hi) get this family */
  lo: number;
  hi: number;
  versions: string[];
  /** the family's shipped settings, around which the synthetic values scatter */
  voltageScale: number;
  currentScale: number;
  currentOffset: number;
};

/** The demo families' shares as cumulative intervals of [0, 1), for a single uniform draw per row. */
export function familyDraws(families = DEMO_FIRMWARE_FAMILIES): FamilyDraw[] {
  const total = families.reduce((sum, f) => sum + f.share, 0);
  let lo = 0;
  return families.map((f, i) => {
    const hi = i === families.length - 1 ? 1 : lo + f.share / total;
    const draw = {
      slug: f.slug,
      lo,
      hi,
      versions: f.versions.map((v) => v.version),
      voltageScale: f.defaults.voltageScale,
      currentScale: f.defaults.currentScale,
      currentOffset: f.defaults.currentOffset,
    };
    lo = hi;
    return draw;
  });
}

/**
 * How unevenly submissions fall on revisions: revision ⌊R · u^SKEW⌋ for a uniform u. With 1.5 a
 * few revisions are popular (the first of 10 000 gets about 0.2 % of all submissions) and most
 * have a handful, as in any community catalogue (our own choice, no source).
 */
export const SUBMISSION_SKEW = 1.5;
/** setseed() argument: fixed, so every run of a size builds identical data. */
const SQL_SEED = 0.4242;

// Values are whole settings (the firmware stores integers) scattered about ±1 % around a per
// revision "true" setting, which is the family's shipped setting moved by a hash of the revision
// id (its hardware). About 3 % are careless submissions that send the shipped settings unchanged
// (the families' invented, non-round defaults, offset included), so the outlier rules have work to do. The sum of three uniforms is a cheap bell shape.
const SUBMISSIONS_SQL = `
WITH revs AS (SELECT id, (row_number() OVER (ORDER BY id) - 1)::int AS k FROM board_revisions),
people AS (SELECT id, (row_number() OVER (ORDER BY id) - 1)::int AS k FROM users),
fam AS (
  SELECT ff.id, x.lo, x.hi, x.versions, x."voltageScale" AS dv, x."currentScale" AS dc, x."currentOffset" AS doff,
         ff.voltage_scale_min AS vmin, ff.voltage_scale_max AS vmax, ff.current_scale_min AS cmin,
         ff.current_scale_max AS cmax, ff.current_offset_min AS omin, ff.current_offset_max AS omax
    FROM jsonb_to_recordset(CAST(:families AS jsonb))
         AS x(slug text, lo float8, hi float8, versions text[], "voltageScale" float8, "currentScale" float8, "currentOffset" float8)
    JOIN firmware_families ff ON ff.slug = x.slug),
draws AS (
  SELECT g,
         least(floor(:revisions * power(random(), :skew))::int, :revisions - 1) AS rk,
         least(floor(:users * random())::int, :users - 1) AS uk,
         random() AS u_family, random() AS u_version, random() AS u_status, random() AS u_method, random() AS u_source,
         random() AS u_vnull, random() AS u_cnull, random() AS u_onull, random() AS u_careless,
         random() + random() + random() - 1.5 AS n_v, random() + random() + random() - 1.5 AS n_c,
         random() + random() + random() - 1.5 AS n_o, random() AS u_age, random() AS u_edit
    FROM generate_series(1, :n) AS g),
placed AS (
  SELECT d.*, r.id AS revision_id, p.id AS contributor_id, f.*,
         ((r.id::bigint * 2654435761) % 4294967296) / 4294967296.0 AS hw_v,
         ((r.id::bigint * 2246822519 + 7) % 4294967296) / 4294967296.0 AS hw_c,
         ((r.id::bigint * 3266489917 + 13) % 4294967296) / 4294967296.0 AS hw_o,
         now() - interval '6 days' - interval '1 day' * (900 * d.u_age) AS created
    FROM draws d
    JOIN revs r ON r.k = d.rk
    JOIN people p ON p.k = d.uk
    JOIN fam f ON d.u_family >= f.lo AND d.u_family < f.hi)
INSERT INTO submissions (board_revision_id, firmware_family_id, firmware_version, contributor_id, sensing_source, method,
                         voltage_scale, current_scale, current_offset, status, created_at, updated_at)
SELECT revision_id, id,
       versions[1 + least(floor(u_version * array_length(versions, 1))::int, array_length(versions, 1) - 1)],
       contributor_id,
       CASE WHEN u_source < 0.70 THEN 'board_adc' WHEN u_source < 0.85 THEN 'esc_telemetry' WHEN u_source < 0.95 THEN 'power_module' ELSE 'estimate' END,
       CASE WHEN u_method < 0.45 THEN 'multimeter' WHEN u_method < 0.65 THEN 'bench_clamp' WHEN u_method < 0.85 THEN 'fly_recharge' ELSE 'unverified' END,
       CASE WHEN u_vnull < 0.05 THEN NULL WHEN u_careless < 0.03 THEN dv
            ELSE greatest(vmin, least(vmax, round(dv * (0.7 + 0.6 * hw_v) * (1 + 0.02 * n_v)))) END,
       CASE WHEN u_cnull < 0.25 AND u_vnull >= 0.05 THEN NULL WHEN u_careless < 0.03 THEN dc
            ELSE greatest(cmin, least(cmax, round(dc * (0.5 + hw_c) * (1 + 0.02 * n_c)))) END,
       CASE WHEN u_onull < 0.40 THEN NULL WHEN u_careless < 0.03 THEN doff
            ELSE greatest(omin, least(omax, round(doff + 40 * (hw_o - 0.5) + 3 * n_o))) END,
       CASE WHEN u_status < 0.85 THEN 'approved' WHEN u_status < 0.93 THEN 'pending' WHEN u_status < 0.98 THEN 'rejected' ELSE 'changes_requested' END,
       created, created + interval '1 hour' * (72 * u_edit)
  FROM placed`;

export type SeedCounts = { manufacturers: number; boards: number; revisions: number; users: number; submissions: number };

const FAMILY_COLUMNS = ["slug", "name", "description", ...FAMILY_UNIT_COLUMNS];

const snakeToCamel = (s: string) => s.replace(/_([a-z])/g, (_, c: string) => c.toUpperCase());

/**
 * Seeds an empty, migrated database with the synthetic data set, in one transaction, then
 * VACUUM ANALYZEs it so the planner sees the real sizes (as autovacuum would soon after a load).
 */
export async function seedSyntheticData(sequelize: Sequelize, size: { boards: number; submissions: number }): Promise<SeedCounts> {
  const catalogue = buildSyntheticCatalogue(size.boards);
  const users = syntheticUserCount(size.submissions);
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements, transaction });
    await run("SELECT setseed(:seed)", { seed: SQL_SEED });
    const families = DEMO_FIRMWARE_FAMILIES.map((f) => Object.fromEntries(FAMILY_COLUMNS.map((c) => [c, (f as Record<string, unknown>)[snakeToCamel(c)]])));
    await run(
      `INSERT INTO firmware_families (${FAMILY_COLUMNS.join(", ")})
       SELECT ${FAMILY_COLUMNS.join(", ")} FROM jsonb_populate_recordset(NULL::firmware_families, CAST(:rows AS jsonb))`,
      { rows: JSON.stringify(families) },
    );
    await run(`INSERT INTO manufacturers (slug, name) SELECT slug, name FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS x(slug text, name text)`, {
      rows: JSON.stringify(catalogue.manufacturers),
    });
    await run(
      `INSERT INTO board_models (manufacturer_id, slug, name, kind, mounting_pattern, min_cells, max_cells)
       SELECT m.id, x.slug, x.name, x.kind, x."mountingPattern", x."minCells", x."maxCells"
         FROM jsonb_to_recordset(CAST(:rows AS jsonb))
              AS x(slug text, name text, "manufacturerSlug" text, kind text, "mountingPattern" text, "minCells" int, "maxCells" int)
         JOIN manufacturers m ON m.slug = x."manufacturerSlug"`,
      { rows: JSON.stringify(catalogue.boards) },
    );
    await run(
      `INSERT INTO board_revisions (board_model_id, label, position)
       SELECT b.id, x.label, x.position
         FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS x("boardSlug" text, label text, position int)
         JOIN board_models b ON b.slug = x."boardSlug"
        ORDER BY b.id, x.position`,
      { rows: JSON.stringify(catalogue.revisions) },
    );
    await run(
      `INSERT INTO users (name, email, role)
       SELECT 'Benchmark Contributor ' || g, 'benchmark-contributor-' || g || '@shuntbook.test', 'contributor'
         FROM generate_series(1, :users) AS g`,
      { users },
    );
    await run(SUBMISSIONS_SQL, {
      n: size.submissions,
      revisions: catalogue.revisions.length,
      users,
      skew: SUBMISSION_SKEW,
      families: JSON.stringify(familyDraws()),
    });
  });
  await sequelize.query("VACUUM ANALYZE");
  const [counts] = await sequelize.query<SeedCounts>(
    `SELECT (SELECT count(*) FROM manufacturers)::int AS manufacturers, (SELECT count(*) FROM board_models)::int AS boards,
            (SELECT count(*) FROM board_revisions)::int AS revisions, (SELECT count(*) FROM users)::int AS users,
            (SELECT count(*) FROM submissions)::int AS submissions`,
    { type: QueryTypes.SELECT },
  );
  return counts;
}
