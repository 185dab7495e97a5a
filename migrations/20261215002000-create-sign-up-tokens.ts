import type { QueryInterface } from "sequelize";

// Sign-ups waiting for their address to be confirmed (lib/auth/sign-up.ts, issue 12 finding 9). The
// sign-up form no longer says whether an address has an account: it always answers "check your
// mail", and the account is made only when the mailbox's owner follows the link. The row keeps what
// the form gave (name, bcrypt hash of the chosen password) until then. As with password reset links,
// only the token's SHA-256 is stored; a token works once (used_at) and for a day at most.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE sign_up_tokens (
      id             uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email          text NOT NULL CHECK (email = lower(email) AND length(email) <= 254),
      name           text NOT NULL CHECK (length(name) BETWEEN 1 AND 80),
      password_hash  text NOT NULL CHECK (password_hash ~ '^\\$2[aby]\\$[0-9]{2}\\$[./A-Za-z0-9]{53}$'),
      token_hash     text NOT NULL UNIQUE CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      expires_at     timestamptz NOT NULL,
      used_at        timestamptz,
      created_at     timestamptz NOT NULL DEFAULT now(),
      CHECK (expires_at > created_at AND expires_at <= created_at + interval '2 days'),
      CHECK (used_at IS NULL OR used_at >= created_at)
    )`);
  // token_hash is unique (the lookup on confirming); email: an address's other pending sign-ups are
  // retired when one completes, and its stale rows are deleted when it signs up again
  await queryInterface.sequelize.query("CREATE INDEX sign_up_tokens_email_idx ON sign_up_tokens (email)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE sign_up_tokens");
}
