import type { QueryInterface } from "sequelize";

// One fly-and-recharge iteration of a worksheet: a row is written whole, in one transaction with
// the check of the worksheet so far (lib/worksheets/recharge-steps.ts), or not at all. Positions
// count from 0 without gaps.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE worksheet_steps (
      id              serial PRIMARY KEY,
      worksheet_id    integer NOT NULL REFERENCES worksheets (id) ON DELETE CASCADE,
      position        smallint NOT NULL CHECK (position >= 0),
      scale_used      integer NOT NULL CHECK (scale_used > 0),
      reported_mah    double precision NOT NULL CHECK (reported_mah > 0 AND reported_mah <= 100000),
      charged_mah     double precision NOT NULL CHECK (charged_mah > 0 AND charged_mah <= 100000),
      fully_recharged boolean NOT NULL DEFAULT true,
      created_at      timestamptz NOT NULL DEFAULT now(),
      UNIQUE (worksheet_id, position)
    )`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE worksheet_steps");
}
