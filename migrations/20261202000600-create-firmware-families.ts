import type { QueryInterface } from "sequelize";

// A firmware family defines what its settings mean physically. Values are only comparable inside
// one family, so the statistics group by it and the worksheets convert through these columns.
//   voltage scale, unit 'V/V':  one step = voltage_scale_step of divider ratio (pack V per ADC-pin V);
//                               the displayed voltage grows with the setting (proportional).
//   voltage scale, unit 'mV/V': one step = voltage_scale_step mV at the ADC pin per pack volt;
//                               the displayed voltage shrinks as it grows (inverse).
//   current scale, unit 'mV/A': sensor output per amp; the displayed current shrinks as it grows.
//   current scale, unit 'A/V':  amps per volt of sensor output; the displayed current grows with it.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE firmware_families (
      id                      serial PRIMARY KEY,
      slug                    text NOT NULL UNIQUE CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$' AND length(slug) <= 60),
      name                    text NOT NULL UNIQUE CHECK (length(btrim(name)) BETWEEN 1 AND 80),
      description             text CHECK (description IS NULL OR length(description) <= 4000),
      voltage_scale_unit      text NOT NULL CHECK (voltage_scale_unit IN ('V/V', 'mV/V')),
      voltage_scale_step      double precision NOT NULL CHECK (voltage_scale_step > 0),
      voltage_scale_response  text NOT NULL CHECK (voltage_scale_response IN ('proportional', 'inverse')),
      voltage_scale_min       double precision NOT NULL CHECK (voltage_scale_min > 0),
      voltage_scale_max       double precision NOT NULL,
      current_scale_unit      text NOT NULL CHECK (current_scale_unit IN ('mV/A', 'A/V')),
      current_scale_step      double precision NOT NULL CHECK (current_scale_step > 0),
      current_scale_response  text NOT NULL CHECK (current_scale_response IN ('proportional', 'inverse')),
      current_scale_min       double precision NOT NULL CHECK (current_scale_min > 0),
      current_scale_max       double precision NOT NULL,
      current_offset_unit     text NOT NULL CHECK (current_offset_unit IN ('mV', 'mA')),
      current_offset_step     double precision NOT NULL CHECK (current_offset_step > 0),
      current_offset_min      double precision NOT NULL,
      current_offset_max      double precision NOT NULL,
      created_at              timestamptz NOT NULL DEFAULT now(),
      updated_at              timestamptz NOT NULL DEFAULT now(),
      CHECK (voltage_scale_min < voltage_scale_max),
      CHECK (current_scale_min < current_scale_max),
      CHECK (current_offset_min < current_offset_max),
      -- the unit fixes the direction: a ratio multiplies the reading, an attenuation divides it
      CHECK ((voltage_scale_unit = 'V/V') = (voltage_scale_response = 'proportional')),
      CHECK ((current_scale_unit = 'A/V') = (current_scale_response = 'proportional'))
    )`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE firmware_families");
}
