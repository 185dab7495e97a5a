import type { QueryInterface } from "sequelize";

// The admin's people list is searched by any part of a name or e-mail address ("ada", "@example",
// "lovel"): ILIKE '%…%' over name and address together, which a trigram GIN index answers (pg_trgm
// is enabled by the first migration; PostgreSQL manual, "pg_trgm", index support for LIKE/ILIKE).
// lib/moderation/users.ts writes the very same expression, so the planner can match it.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("CREATE INDEX users_name_email_trgm_idx ON users USING gin ((name || ' ' || email) gin_trgm_ops)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP INDEX users_name_email_trgm_idx");
}
