import type { QueryInterface } from "sequelize";

// Worksheets of two more kinds: the voltage check (multimeter beside the display) and the bench
// check (clamp meter beside the display). The pack columns belong to fly-and-recharge alone, so
// they become NULL for the others, and a CHECK keeps them set for fly_recharge exactly as before.
// starting_scale stays NOT NULL: every kind runs with one scale in force (the current scale for
// fly-and-recharge and bench, the voltage scale for the voltage check); the bench check also keeps
// the current offset in force, in starting_offset. Existing rows are all fly_recharge with every
// column set, so they pass every new CHECK unchanged.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
    await q("ALTER TABLE worksheets DROP CONSTRAINT worksheets_kind_check");
    await q("ALTER TABLE worksheets ADD CONSTRAINT worksheets_kind_check CHECK (kind IN ('fly_recharge', 'voltage', 'bench'))");
    await q("ALTER TABLE worksheets ALTER COLUMN rated_mah DROP NOT NULL, ALTER COLUMN cells DROP NOT NULL");
    await q(`ALTER TABLE worksheets ADD CONSTRAINT worksheets_pack_for_recharge_check
               CHECK ((kind = 'fly_recharge') = (rated_mah IS NOT NULL AND cells IS NOT NULL))`);
    // an offset may be negative or 0; the firmware family's range is checked by lib/worksheets
    await q("ALTER TABLE worksheets ADD COLUMN starting_offset integer");
    await q("ALTER TABLE worksheets ADD CONSTRAINT worksheets_offset_for_bench_check CHECK ((kind = 'bench') = (starting_offset IS NOT NULL))");
    // the quad page lists every worksheet of a quad, newest first
    await q("CREATE INDEX worksheets_quad_created_idx ON worksheets (quad_id, created_at DESC)");
  });
}

// Back to fly-and-recharge only. Voltage and bench worksheets cannot exist in that schema, so they
// are deleted (their readings and points tables are already gone: their migrations come later and
// go down first); fly-and-recharge rows are untouched.
export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
    await q("DROP INDEX worksheets_quad_created_idx");
    await q("DELETE FROM worksheets WHERE kind <> 'fly_recharge'");
    await q("ALTER TABLE worksheets DROP CONSTRAINT worksheets_offset_for_bench_check");
    await q("ALTER TABLE worksheets DROP COLUMN starting_offset");
    await q("ALTER TABLE worksheets DROP CONSTRAINT worksheets_pack_for_recharge_check");
    await q("ALTER TABLE worksheets ALTER COLUMN rated_mah SET NOT NULL, ALTER COLUMN cells SET NOT NULL");
    await q("ALTER TABLE worksheets DROP CONSTRAINT worksheets_kind_check");
    await q("ALTER TABLE worksheets ADD CONSTRAINT worksheets_kind_check CHECK (kind IN ('fly_recharge'))");
  });
}
