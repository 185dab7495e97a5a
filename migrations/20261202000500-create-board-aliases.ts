import type { QueryInterface } from "sequelize";

export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE board_aliases (
      id              serial PRIMARY KEY,
      board_model_id  integer NOT NULL REFERENCES board_models(id) ON DELETE RESTRICT,
      alias           text NOT NULL CHECK (length(btrim(alias)) BETWEEN 1 AND 160),
      created_at      timestamptz NOT NULL DEFAULT now(),
      updated_at      timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query(`
    CREATE UNIQUE INDEX board_aliases_model_alias_idx ON board_aliases (board_model_id, lower(alias));
    CREATE INDEX board_aliases_alias_trgm_idx ON board_aliases USING gin (alias gin_trgm_ops);`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE board_aliases");
}
