import type { QueryInterface } from "sequelize";

// Trigram similarity powers the catalogue search (names, aliases, misspellings).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("CREATE EXTENSION IF NOT EXISTS pg_trgm");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP EXTENSION IF EXISTS pg_trgm");
}
