import type { QueryInterface } from "sequelize";

// One contributor's calibrated values for one board revision under one firmware family.
// A submission may calibrate only part of the set (a voltage-only check is common), so each value
// is nullable, but at least one must be present.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE submissions (
      id                  serial PRIMARY KEY,
      board_revision_id   integer NOT NULL REFERENCES board_revisions(id) ON DELETE RESTRICT,
      firmware_family_id  integer NOT NULL REFERENCES firmware_families(id) ON DELETE RESTRICT,
      firmware_version    text NOT NULL CHECK (firmware_version ~ '^[0-9A-Za-z][0-9A-Za-z.+-]{0,31}$'),
      contributor_id      uuid NOT NULL REFERENCES users(id) ON DELETE RESTRICT,
      sensing_source      text NOT NULL CHECK (sensing_source IN ('board_adc', 'esc_telemetry', 'power_module', 'estimate')),
      method              text NOT NULL CHECK (method IN ('multimeter', 'bench_clamp', 'fly_recharge', 'unverified')),
      -- bounded away from 0 as well as above: no firmware setting is smaller than 1e-6, and tiny
      -- magnitudes would make the statistics' float arithmetic underflow
      voltage_scale       double precision CHECK (voltage_scale >= 0.000001 AND voltage_scale < 1000000),
      current_scale       double precision CHECK (current_scale >= 0.000001 AND current_scale < 1000000),
      current_offset      double precision CHECK (current_offset = 0 OR abs(current_offset) BETWEEN 0.000001 AND 1000000),
      status              text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'approved', 'rejected', 'changes_requested')),
      notes               text CHECK (notes IS NULL OR length(notes) <= 10000),
      version             integer NOT NULL DEFAULT 0 CHECK (version >= 0),
      created_at          timestamptz NOT NULL DEFAULT now(),
      updated_at          timestamptz NOT NULL DEFAULT now(),
      CHECK (num_nonnulls(voltage_scale, current_scale, current_offset) >= 1)
    )`);
  await queryInterface.sequelize.query(`
    CREATE INDEX submissions_group_status_idx ON submissions (board_revision_id, firmware_family_id, status);
    CREATE INDEX submissions_contributor_created_idx ON submissions (contributor_id, created_at DESC);
    CREATE INDEX submissions_status_created_idx ON submissions (status, created_at);
    CREATE INDEX submissions_family_idx ON submissions (firmware_family_id);`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE submissions");
}
