import type { QueryInterface } from "sequelize";

// next-auth's database sessions (models/AuthSession.ts). Shuntbook uses JWT sessions (credentials
// sign-in requires them), so nothing writes here today; the table completes the adapter so that
// switching strategy is a configuration change, not a migration.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE sessions (
      id             uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      session_token  text NOT NULL UNIQUE CHECK (length(session_token) BETWEEN 16 AND 512),
      user_id        uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      expires        timestamptz NOT NULL,
      created_at     timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query("CREATE INDEX sessions_user_idx ON sessions (user_id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE sessions");
}
