import type { QueryInterface } from "sequelize";

// users.session_version: the account's sessions are good while their JWT carries this number
// (lib/auth/guard.ts). Signing out, or "sign out everywhere" on the profile page, adds one, which
// ends every session cookie issued before, on the server, instead of only deleting the cookie in
// the one browser that asked (issue 12, finding 5: a copied cookie kept working for 30 days).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("ALTER TABLE users ADD COLUMN session_version integer NOT NULL DEFAULT 0");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("ALTER TABLE users DROP COLUMN session_version");
}
