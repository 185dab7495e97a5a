import type { QueryInterface } from "sequelize";

// A calibration worksheet a builder runs on one of their quads, saved as they go. Only the
// fly-and-recharge kind is stored so far. The firmware family is fixed when the worksheet starts
// (its rules judge every step); starting_scale is the board's published recommended current
// scale at that moment, or the builder's own when nothing is published. Publishing it links the
// pending submission it became, once.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE worksheets (
      id                 serial PRIMARY KEY,
      owner_id           uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      quad_id            integer NOT NULL REFERENCES quads (id) ON DELETE CASCADE,
      kind               varchar(16) NOT NULL CHECK (kind IN ('fly_recharge')),
      firmware_family_id integer NOT NULL REFERENCES firmware_families (id) ON DELETE RESTRICT,
      rated_mah          integer NOT NULL CHECK (rated_mah > 0 AND rated_mah <= 100000),
      cells              smallint NOT NULL CHECK (cells BETWEEN 1 AND 14),
      starting_scale     integer NOT NULL CHECK (starting_scale > 0),
      starting_source    varchar(16) NOT NULL CHECK (starting_source IN ('published', 'own')),
      submission_id      integer UNIQUE REFERENCES submissions (id) ON DELETE SET NULL,
      created_at         timestamptz NOT NULL DEFAULT now(),
      updated_at         timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query("CREATE INDEX worksheets_owner_idx ON worksheets (owner_id, created_at DESC)");
  await queryInterface.sequelize.query("CREATE INDEX worksheets_quad_idx ON worksheets (quad_id)");
  await queryInterface.sequelize.query("CREATE INDEX worksheets_firmware_family_idx ON worksheets (firmware_family_id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE worksheets");
}
