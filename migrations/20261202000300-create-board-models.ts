import type { QueryInterface } from "sequelize";

export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE board_models (
      id                serial PRIMARY KEY,
      manufacturer_id   integer NOT NULL REFERENCES manufacturers(id) ON DELETE RESTRICT,
      slug              text NOT NULL UNIQUE CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$' AND length(slug) <= 120),
      name              text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 160),
      kind              text NOT NULL CHECK (kind IN ('flight_controller', 'aio', 'esc_4in1', 'pdb', 'power_module')),
      -- hole spacing in millimetres, e.g. '20x20' or '30.5x30.5'
      mounting_pattern  text NOT NULL CHECK (mounting_pattern ~ '^[0-9]{1,2}(\\.[0-9])?x[0-9]{1,2}(\\.[0-9])?$'),
      min_cells         smallint NOT NULL DEFAULT 1 CHECK (min_cells BETWEEN 1 AND 14),
      max_cells         smallint NOT NULL CHECK (max_cells BETWEEN 1 AND 14),
      description       text CHECK (description IS NULL OR length(description) <= 4000),
      created_at        timestamptz NOT NULL DEFAULT now(),
      updated_at        timestamptz NOT NULL DEFAULT now(),
      CHECK (min_cells <= max_cells),
      UNIQUE (manufacturer_id, name)
    )`);
  await queryInterface.sequelize.query(`
    CREATE INDEX board_models_manufacturer_idx ON board_models (manufacturer_id);
    CREATE INDEX board_models_kind_mounting_idx ON board_models (kind, mounting_pattern);
    CREATE INDEX board_models_mounting_idx ON board_models (mounting_pattern);
    CREATE INDEX board_models_name_lower_idx ON board_models (lower(name));
    CREATE INDEX board_models_name_trgm_idx ON board_models USING gin (name gin_trgm_ops);`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE board_models");
}
