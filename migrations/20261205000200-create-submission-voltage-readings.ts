import type { QueryInterface } from "sequelize";

// A voltage check behind a submission: what the display reported against what a multimeter read on
// the same pack, with the voltage scale that was set at the time. The form enters the scale once
// for the whole check; it is stored per reading so that each row is a complete measurement.
// Rows are replaced as a whole when the submission is edited, never updated one by one.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE submission_voltage_readings (
      id              serial PRIMARY KEY,
      submission_id   integer NOT NULL REFERENCES submissions(id) ON DELETE CASCADE,
      position        smallint NOT NULL CHECK (position BETWEEN 0 AND 19),
      scale_used      integer NOT NULL CHECK (scale_used > 0),
      cells           smallint NOT NULL CHECK (cells BETWEEN 1 AND 14),
      reported_volts  double precision NOT NULL CHECK (reported_volts > 0 AND reported_volts <= 200),
      measured_volts  double precision NOT NULL CHECK (measured_volts > 0 AND measured_volts <= 100),
      -- the main battery lead, or the balance plug's two outer pins (the whole pack)
      measured_at     text NOT NULL CHECK (measured_at IN ('main_lead', 'balance_outer_pins')),
      created_at      timestamptz NOT NULL DEFAULT now(),
      -- also the index behind "the readings of submission X"
      UNIQUE (submission_id, position)
    )`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE submission_voltage_readings");
}
