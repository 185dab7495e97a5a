import type { QueryInterface } from "sequelize";

export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE manufacturers (
      id          serial PRIMARY KEY,
      slug        text NOT NULL UNIQUE CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$' AND length(slug) <= 80),
      name        text NOT NULL UNIQUE CHECK (length(btrim(name)) BETWEEN 1 AND 120),
      website     text CHECK (website IS NULL OR website ~ '^https://'),
      created_at  timestamptz NOT NULL DEFAULT now(),
      updated_at  timestamptz NOT NULL DEFAULT now()
    )`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE manufacturers");
}
