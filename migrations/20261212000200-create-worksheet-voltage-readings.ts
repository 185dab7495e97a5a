import type { QueryInterface } from "sequelize";

// One pair of readings of a voltage worksheet: the display's pack voltage and a multimeter's at the
// same moment, and where the probes touched. The voltage scale in force is the worksheet's
// starting_scale. A row is written whole, in one transaction with the check of every earlier
// reading (lib/worksheets/voltage.ts), or not at all.
//
// A builder who mistyped removes the last reading; the row is kept with removed_at set (shown
// struck out, never counted, never published), so nothing typed at the field is lost. Positions of
// the live readings count from 0 without gaps; a removed reading keeps the position it had, which
// a new reading may take again (hence the partial unique index).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE worksheet_voltage_readings (
      id              serial PRIMARY KEY,
      worksheet_id    integer NOT NULL REFERENCES worksheets (id) ON DELETE CASCADE,
      position        smallint NOT NULL CHECK (position BETWEEN 0 AND 19),
      cells           smallint NOT NULL CHECK (cells BETWEEN 1 AND 14),
      reported_volts  double precision NOT NULL CHECK (reported_volts > 0 AND reported_volts <= 200),
      measured_volts  double precision NOT NULL CHECK (measured_volts > 0 AND measured_volts <= 100),
      measured_at     text NOT NULL CHECK (measured_at IN ('main_lead', 'balance_outer_pins')),
      removed_at      timestamptz,
      created_at      timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query(
    "CREATE UNIQUE INDEX worksheet_voltage_readings_live_position_key ON worksheet_voltage_readings (worksheet_id, position) WHERE removed_at IS NULL",
  );
  // every reading of a worksheet, live and removed, in order (the worksheet's view)
  await queryInterface.sequelize.query("CREATE INDEX worksheet_voltage_readings_worksheet_idx ON worksheet_voltage_readings (worksheet_id, position, id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE worksheet_voltage_readings");
}
