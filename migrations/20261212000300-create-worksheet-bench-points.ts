import type { QueryInterface } from "sequelize";

// One clamp-meter point of a bench worksheet at steady throttle: the clamp meter's current and the
// display's. The current scale and offset in force are the worksheet's starting_scale and
// starting_offset. Written whole with the fit of every earlier point (lib/worksheets/bench.ts) or
// not at all; removed like a voltage reading (removed_at set, kept, never counted), see
// 20261212000200. Limits as lib/submissions/limits.ts (MAX_BENCH_AMPS, MIN_REPORTED_AMPS).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE worksheet_bench_points (
      id              serial PRIMARY KEY,
      worksheet_id    integer NOT NULL REFERENCES worksheets (id) ON DELETE CASCADE,
      position        smallint NOT NULL CHECK (position BETWEEN 0 AND 19),
      measured_amps   double precision NOT NULL CHECK (measured_amps >= 0 AND measured_amps <= 1000),
      -- a display may read below zero at idle before its offset is set
      reported_amps   double precision NOT NULL CHECK (reported_amps >= -1000 AND reported_amps <= 1000),
      removed_at      timestamptz,
      created_at      timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query(
    "CREATE UNIQUE INDEX worksheet_bench_points_live_position_key ON worksheet_bench_points (worksheet_id, position) WHERE removed_at IS NULL",
  );
  await queryInterface.sequelize.query("CREATE INDEX worksheet_bench_points_worksheet_idx ON worksheet_bench_points (worksheet_id, position, id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE worksheet_bench_points");
}
