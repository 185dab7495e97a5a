import type { QueryInterface } from "sequelize";

// One charge of one pack: what the charger put back and the resting voltage per cell after it.
// The count of rows is the pack's cycle count; the charges after full flights give its usable
// capacity (lib/calibration/pack.ts). Resting volts are bounded to what any lithium
// cell can read at rest (2.5–4.45 V, our own plausibility rule).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE pack_charges (
      id                     serial PRIMARY KEY,
      pack_id                integer NOT NULL REFERENCES packs (id) ON DELETE CASCADE,
      charged_on             date NOT NULL,
      charged_mah            double precision NOT NULL CHECK (charged_mah > 0 AND charged_mah <= 100000),
      resting_volts_per_cell double precision CHECK (resting_volts_per_cell IS NULL OR resting_volts_per_cell BETWEEN 2.5 AND 4.45),
      after_full_flight      boolean NOT NULL DEFAULT true,
      created_at             timestamptz NOT NULL DEFAULT now()
    )`);
  // a pack's log, oldest first
  await queryInterface.sequelize.query("CREATE INDEX pack_charges_pack_idx ON pack_charges (pack_id, charged_on, id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE pack_charges");
}
