import type { QueryInterface } from "sequelize";

// ended_sessions: the session ids (the `sid` claim of the session JWT) that a sign-out ended. The
// guard refuses a cookie whose sid is listed, so a copy of a signed-out cookie stops working on
// the server, while the account's other devices stay signed in ("sign out everywhere" still moves
// users.session_version). Rows are useless once the session would have expired anyway; the
// expires_at index lets each sign-out clear them cheaply.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE ended_sessions (
      sid uuid PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      expires_at timestamptz NOT NULL
    );
    CREATE INDEX ended_sessions_expires_idx ON ended_sessions (expires_at);
    CREATE INDEX ended_sessions_user_idx ON ended_sessions (user_id);
  `);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE ended_sessions");
}
