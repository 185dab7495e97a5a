import type { QueryInterface } from "sequelize";

// A fly-and-recharge iteration mistyped at the field can be taken back, as a voltage reading or a
// bench point can (migrations/20261212000200-…): the row stays with removed_at set, shown struck
// out, never counted, never published, so nothing typed is lost. Live iterations still count from
// 0 without gaps; a removed one keeps its position, which the next iteration may take again, so
// the unique (worksheet_id, position) becomes a partial unique index over the live rows.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    ALTER TABLE worksheet_steps ADD COLUMN removed_at timestamptz;
    ALTER TABLE worksheet_steps DROP CONSTRAINT worksheet_steps_worksheet_id_position_key;
    CREATE UNIQUE INDEX worksheet_steps_live_position_key ON worksheet_steps (worksheet_id, position) WHERE removed_at IS NULL;
    -- every iteration of a worksheet, live and removed, in order (the worksheet's view)
    CREATE INDEX worksheet_steps_worksheet_idx ON worksheet_steps (worksheet_id, position, id);`);
}

// Going back: the taken-back rows cannot fit the old unique constraint beside the live ones that
// replaced them, and the old schema has no way to say "not counted", so they are deleted.
export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    DELETE FROM worksheet_steps WHERE removed_at IS NOT NULL;
    DROP INDEX worksheet_steps_worksheet_idx;
    DROP INDEX worksheet_steps_live_position_key;
    ALTER TABLE worksheet_steps ADD CONSTRAINT worksheet_steps_worksheet_id_position_key UNIQUE (worksheet_id, position);
    ALTER TABLE worksheet_steps DROP COLUMN removed_at;`);
}
