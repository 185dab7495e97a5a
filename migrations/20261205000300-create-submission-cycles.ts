import type { QueryInterface } from "sequelize";

// Fly-and-recharge cycles behind a submission: the mAh the display reported used, the mAh the
// charger put back, the pack's rating and cell count, and the current scale set during that flight.
// The limits repeat lib/submissions/schema.ts, which refuses the same values with field messages.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE submission_cycles (
      id             serial PRIMARY KEY,
      submission_id  integer NOT NULL REFERENCES submissions(id) ON DELETE CASCADE,
      position       smallint NOT NULL CHECK (position BETWEEN 0 AND 19),
      scale_used     integer NOT NULL CHECK (scale_used > 0),
      reported_mah   double precision NOT NULL CHECK (reported_mah > 0 AND reported_mah <= 100000),
      charged_mah    double precision NOT NULL CHECK (charged_mah > 0 AND charged_mah <= 100000),
      rated_mah      double precision NOT NULL CHECK (rated_mah > 0 AND rated_mah <= 100000),
      cells          smallint NOT NULL CHECK (cells BETWEEN 1 AND 14),
      created_at     timestamptz NOT NULL DEFAULT now(),
      UNIQUE (submission_id, position),
      -- beyond 0.2–5 the two figures are not the same flight, whatever the scale
      CHECK (reported_mah / charged_mah BETWEEN 0.2 AND 5),
      -- no pack takes back half as much again as it is rated for
      CHECK (charged_mah <= 1.5 * rated_mah)
    )`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE submission_cycles");
}
