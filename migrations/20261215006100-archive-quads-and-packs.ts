import type { QueryInterface } from "sequelize";

// Garage rows that a published worksheet used are archived instead of deleted (issue 13, item 5):
// archived_at hides a quad or pack from the garage's lists while its worksheets, and the published
// submission they became, stay as they were. A worksheet now remembers the pack it was started
// from (pack_id, nullable: typed figures, or a pack deleted since), so a pack's delete can tell
// whether a published worksheet used it. Existing rows stay unarchived and packless.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
    await q("ALTER TABLE quads ADD COLUMN archived_at timestamptz");
    await q("ALTER TABLE packs ADD COLUMN archived_at timestamptz");
    await q("ALTER TABLE worksheets ADD COLUMN pack_id integer REFERENCES packs (id) ON DELETE SET NULL");
    // "did a published worksheet use this pack?" before a pack's delete
    await q("CREATE INDEX worksheets_pack_idx ON worksheets (pack_id)");
  });
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
    await q("DROP INDEX worksheets_pack_idx");
    await q("ALTER TABLE worksheets DROP COLUMN pack_id");
    await q("ALTER TABLE packs DROP COLUMN archived_at");
    await q("ALTER TABLE quads DROP COLUMN archived_at");
  });
}
