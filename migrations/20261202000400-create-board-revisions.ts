import type { QueryInterface } from "sequelize";

// Sensor hardware is nullable throughout: most makers publish only part of it, and an unknown
// value must stay distinguishable from a measured one.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE board_revisions (
      id                     serial PRIMARY KEY,
      board_model_id         integer NOT NULL REFERENCES board_models(id) ON DELETE RESTRICT,
      label                  text NOT NULL CHECK (length(btrim(label)) BETWEEN 1 AND 40),
      position               smallint NOT NULL DEFAULT 0 CHECK (position >= 0),
      released_on            date,
      -- voltage divider: pack+ -> top resistor -> ADC pin -> bottom resistor -> ground
      divider_top_ohms       double precision CHECK (divider_top_ohms > 0 AND divider_top_ohms <= 10000000),
      divider_bottom_ohms    double precision CHECK (divider_bottom_ohms > 0 AND divider_bottom_ohms <= 10000000),
      current_sensor         text CHECK (current_sensor IN ('shunt', 'hall')),
      shunt_milliohms        double precision CHECK (shunt_milliohms > 0 AND shunt_milliohms <= 100),
      amplifier_gain         double precision CHECK (amplifier_gain > 0 AND amplifier_gain <= 1000),
      hall_mv_per_amp        double precision CHECK (hall_mv_per_amp > 0 AND hall_mv_per_amp <= 1000),
      adc_bits               smallint CHECK (adc_bits BETWEEN 8 AND 24),
      adc_reference_volts    double precision CHECK (adc_reference_volts > 0 AND adc_reference_volts <= 5.5),
      notes                  text CHECK (notes IS NULL OR length(notes) <= 4000),
      created_at             timestamptz NOT NULL DEFAULT now(),
      updated_at             timestamptz NOT NULL DEFAULT now(),
      UNIQUE (board_model_id, label),
      -- both divider resistors or neither: half a divider is no information
      CHECK ((divider_top_ohms IS NULL) = (divider_bottom_ohms IS NULL)),
      -- a shunt revision has no Hall sensitivity and a Hall revision has no shunt
      CHECK (current_sensor IS DISTINCT FROM 'hall' OR (shunt_milliohms IS NULL AND amplifier_gain IS NULL)),
      CHECK (current_sensor IS DISTINCT FROM 'shunt' OR hall_mv_per_amp IS NULL),
      CHECK (current_sensor IS NOT NULL OR (shunt_milliohms IS NULL AND amplifier_gain IS NULL AND hall_mv_per_amp IS NULL))
    )`);
  await queryInterface.sequelize.query("CREATE INDEX board_revisions_model_position_idx ON board_revisions (board_model_id, position)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE board_revisions");
}
