import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { migrateDownAll, migrateUp, pendingMigrations } from "@/lib/db/migrate";
import { createSequelize } from "@/lib/db/sequelize";
import { useTestDatabase } from "@/tests/support/database";

const database = useTestDatabase("migrated");

const EXPECTED_TABLES = [
  "accounts",
  "audit_events",
  "board_aliases",
  "board_models",
  "board_revisions",
  "board_stats",
  "evidence_photos",
  "firmware_families",
  "idempotency_keys",
  "manufacturers",
  "pack_charges",
  "packs",
  "password_reset_tokens",
  "published_value_history",
  "quads",
  "rate_limits",
  "sessions",
  "submission_bench_points",
  "submission_cycles",
  "submission_voltage_readings",
  "submissions",
  "users",
  "verification_tokens",
  "worksheet_bench_points",
  "worksheet_steps",
  "worksheet_voltage_readings",
  "worksheets",
];

describe("migrations", () => {
  let sequelize: ReturnType<typeof createSequelize>;
  beforeAll(() => {
    sequelize = createSequelize(database.url(), { poolMax: 1 });
  });
  afterAll(() => sequelize.close());

  const tables = () =>
    sequelize
      .query<{ name: string }>(
        "SELECT table_name::text AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'SequelizeMeta' ORDER BY 1",
        { type: QueryTypes.SELECT },
      )
      .then((rows) => rows.map((r) => r.name));

  // the job queue's own schema (lib/jobs), made by a migration from pg-boss's construction plan
  const jobSchemaExists = () =>
    sequelize
      .query<{ n: number }>("SELECT count(*) AS n FROM information_schema.tables WHERE table_schema = 'pgboss' AND table_name IN ('job', 'queue', 'version')", {
        type: QueryTypes.SELECT,
      })
      .then(([row]) => row.n === 3);

  it("the template was migrated from zero: nothing pending, every table present", async () => {
    expect(await pendingMigrations(sequelize)).toEqual([]);
    expect(await tables()).toEqual(EXPECTED_TABLES);
    expect(await jobSchemaExists()).toBe(true);
  });

  it("every down runs, leaving no table and no extension, then every up applies again", async () => {
    const downs = await migrateDownAll(sequelize);
    expect(downs.length).toBeGreaterThanOrEqual(EXPECTED_TABLES.length);
    expect(await tables()).toEqual([]);
    const [ext] = await sequelize.query<{ n: number }>("SELECT count(*) AS n FROM pg_extension WHERE extname = 'pg_trgm'", {
      type: QueryTypes.SELECT,
    });
    expect(ext.n).toBe(0);
    expect(await jobSchemaExists()).toBe(false);

    const ups = await migrateUp(sequelize);
    expect(ups).toEqual([...downs].reverse());
    expect(await tables()).toEqual(EXPECTED_TABLES);
    expect(await jobSchemaExists()).toBe(true);
  });

  it("check constraints refuse impossible values", async () => {
    await expect(
      sequelize.query("INSERT INTO manufacturers (slug, name) VALUES ('Not A Slug', 'x')"),
    ).rejects.toThrow(/check constraint/);
    await sequelize.query("INSERT INTO manufacturers (slug, name) VALUES ('acme-test', 'Test maker')");
    await expect(
      sequelize.query(
        "INSERT INTO board_models (manufacturer_id, slug, name, kind, mounting_pattern, max_cells) SELECT id, 'b', 'B', 'toaster', '20x20', 6 FROM manufacturers",
      ),
    ).rejects.toThrow(/check constraint/);
    await expect(
      sequelize.query(
        "INSERT INTO board_models (manufacturer_id, slug, name, kind, mounting_pattern, min_cells, max_cells) SELECT id, 'b', 'B', 'aio', '20x20', 6, 4 FROM manufacturers",
      ),
    ).rejects.toThrow(/check constraint/);
  });
});
