import type { QueryInterface } from "sequelize";

// Column names follow next-auth's user shape (name, email, email_verified, image) so that its
// Sequelize adapter can map onto this table later; role and password hash are ours.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE users (
      id              uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name            text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 80),
      email           text NOT NULL CHECK (email ~ '^[^@[:space:]]+@[^@[:space:]]+$' AND length(email) <= 254),
      email_verified  timestamptz,
      image           text,
      password_hash   text,
      role            text NOT NULL DEFAULT 'contributor' CHECK (role IN ('contributor', 'moderator', 'admin')),
      created_at      timestamptz NOT NULL DEFAULT now(),
      updated_at      timestamptz NOT NULL DEFAULT now()
    )`);
  await queryInterface.sequelize.query(`
    CREATE UNIQUE INDEX users_email_lower_idx ON users (lower(email));
    CREATE INDEX users_role_idx ON users (role);`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE users");
}
