import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { migrateDownAll, migrateUp, pendingMigrations } from "@/lib/db/migrate";
import { createSequelize } from "@/lib/db/sequelize";
import * as benchPoints from "@/migrations/20261212000300-create-worksheet-bench-points";
import * as voltageReadings from "@/migrations/20261212000200-create-worksheet-voltage-readings";
import * as worksheetKinds from "@/migrations/20261212000100-allow-voltage-and-bench-worksheets";
import { setupTestDatabase } from "@/tests/support/database";
import { insertFixture } from "@/tests/support/fixtures";

const database = setupTestDatabase("migrated");

const EXPECTED_TABLES = [
  "accounts",
  "audit_events",
  "board_aliases",
  "board_models",
  "board_revisions",
  "board_stats",
  "ended_sessions",
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
  "sign_up_tokens",
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

  it("worksheets: pack columns for fly_recharge only, the offset for bench only; the kinds' down keeps fly-and-recharge rows and restores the old schema", async () => {
    const fx = await insertFixture(sequelize);
    const [quad] = await sequelize.query<{ id: number }>(
      "INSERT INTO quads (owner_id, name, board_revision_id, firmware_family_id) VALUES ($1, 'Q', $2, $3) RETURNING id",
      {
        bind: [fx.userId, fx.revisionIds[0], fx.familyId],
        type: QueryTypes.SELECT,
      },
    );
    const sheet = (kind: string, ratedMah: number | null, cells: number | null, offset: number | null) =>
      sequelize.query(
        `INSERT INTO worksheets (owner_id, quad_id, kind, firmware_family_id, rated_mah, cells, starting_scale, starting_offset, starting_source)
         VALUES ($1, $2, $3, $4, $5, $6, 400, $7, 'own')`,
        { bind: [fx.userId, quad.id, kind, fx.familyId, ratedMah, cells, offset] },
      );
    await sheet("fly_recharge", 1500, 4, null);
    await sheet("voltage", null, null, null);
    await sheet("bench", null, null, 0);
    const refused: Array<Parameters<typeof sheet>> = [
      ["fly_recharge", null, 4, null],
      ["voltage", 1500, 4, null],
      ["bench", null, null, null],
      ["voltage", null, null, 0],
      ["guess", null, null, null],
    ];
    for (const bad of refused) await expect(sheet(...bad), JSON.stringify(bad)).rejects.toThrow(/check constraint/);

    const qi = sequelize.getQueryInterface();
    for (const m of [benchPoints, voltageReadings, worksheetKinds]) await m.down(qi);
    const kinds = await sequelize.query<{ kind: string }>("SELECT kind FROM worksheets", { type: QueryTypes.SELECT });
    expect(kinds.map((k) => k.kind)).toEqual(["fly_recharge"]);
    await expect(sheet("voltage", 1500, 4, null)).rejects.toThrow(/starting_offset|check constraint/);
    await expect(
      sequelize.query(
        "INSERT INTO worksheets (owner_id, quad_id, kind, firmware_family_id, rated_mah, cells, starting_scale, starting_source) VALUES ($1, $2, 'fly_recharge', $3, NULL, 4, 400, 'own')",
        { bind: [fx.userId, quad.id, fx.familyId] },
      ),
    ).rejects.toThrow(/not-null|null value/);
    for (const m of [worksheetKinds, voltageReadings, benchPoints]) await m.up(qi);
    expect(await tables()).toEqual(EXPECTED_TABLES);
    await sheet("bench", null, null, -20);
  });

  it("check constraints refuse impossible values", async () => {
    await expect(sequelize.query("INSERT INTO manufacturers (slug, name) VALUES ('Not A Slug', 'x')")).rejects.toThrow(/check constraint/);
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
