import type { QueryInterface } from "sequelize";

// When a user's password last changed (set by a reset or by the profile page). Session JWTs carry
// the time their holder signed in; the guard refuses those older than this, so a reset signs out
// every other device, including one that had the old password.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    ALTER TABLE users ADD COLUMN password_changed_at timestamptz
      CHECK (password_changed_at IS NULL OR password_changed_at >= created_at)`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("ALTER TABLE users DROP COLUMN password_changed_at");
}
