import type { QueryInterface } from "sequelize";

// A builder's quad in their garage: private to its owner. The board revision and firmware family
// are optional links into the catalogue (a quad may carry a board Shuntbook does not list yet);
// a revision that leaves the catalogue unlinks the quad rather than deleting it.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE quads (
      id                 serial PRIMARY KEY,
      owner_id           uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      name               varchar(80) NOT NULL CHECK (length(btrim(name)) > 0),
      board_revision_id  integer REFERENCES board_revisions (id) ON DELETE SET NULL,
      firmware_family_id integer REFERENCES firmware_families (id) ON DELETE SET NULL,
      firmware_version   varchar(40) CHECK (firmware_version IS NULL OR length(btrim(firmware_version)) > 0),
      esc                varchar(120) CHECK (esc IS NULL OR length(btrim(esc)) > 0),
      notes              text CHECK (notes IS NULL OR length(notes) <= 4000),
      created_at         timestamptz NOT NULL DEFAULT now(),
      updated_at         timestamptz NOT NULL DEFAULT now()
    )`);
  // the garage lists an owner's quads, newest first
  await queryInterface.sequelize.query("CREATE INDEX quads_owner_idx ON quads (owner_id, created_at DESC)");
  await queryInterface.sequelize.query("CREATE INDEX quads_board_revision_idx ON quads (board_revision_id)");
  await queryInterface.sequelize.query("CREATE INDEX quads_firmware_family_idx ON quads (firmware_family_id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE quads");
}
