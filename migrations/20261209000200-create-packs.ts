import type { QueryInterface } from "sequelize";

// A builder's flight pack. Chemistry is one of lib/calibration/chemistry.ts CHEMISTRIES;
// cells and rated mAh stay within lib/submissions/limits.ts (1–14 cells, up to 100 000 mAh).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE packs (
      id            serial PRIMARY KEY,
      owner_id      uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      label         varchar(80) NOT NULL CHECK (length(btrim(label)) > 0),
      chemistry     varchar(8) NOT NULL CHECK (chemistry IN ('lipo', 'lihv', 'liion')),
      cells         smallint NOT NULL CHECK (cells BETWEEN 1 AND 14),
      rated_mah     integer NOT NULL CHECK (rated_mah > 0 AND rated_mah <= 100000),
      purchased_on  date,
      created_at    timestamptz NOT NULL DEFAULT now(),
      updated_at    timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query("CREATE INDEX packs_owner_idx ON packs (owner_id, created_at DESC)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE packs");
}
