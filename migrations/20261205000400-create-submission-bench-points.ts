import type { QueryInterface } from "sequelize";

// Bench points behind a submission: the current the display reported against a DC clamp meter's
// reading, with the current scale and offset set at the time. Two or more points with different
// currents give the least-squares line that lib/calibration/evidence.ts turns into a scale and offset.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE submission_bench_points (
      id             serial PRIMARY KEY,
      submission_id  integer NOT NULL REFERENCES submissions(id) ON DELETE CASCADE,
      position       smallint NOT NULL CHECK (position BETWEEN 0 AND 19),
      scale_used     integer NOT NULL CHECK (scale_used > 0),
      offset_used    integer NOT NULL,
      -- a wrong offset can make the display read below zero at low current
      reported_amps  double precision NOT NULL CHECK (reported_amps BETWEEN -1000 AND 1000),
      measured_amps  double precision NOT NULL CHECK (measured_amps BETWEEN 0 AND 1000),
      created_at     timestamptz NOT NULL DEFAULT now(),
      UNIQUE (submission_id, position)
    )`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE submission_bench_points");
}
