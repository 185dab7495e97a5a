import type { QueryInterface } from "sequelize";

// Password reset tokens (lib/auth/password-reset.ts). The mail carries a random token; only its
// SHA-256 is stored, so a leaked table resets nobody's password. A token works once (used_at) and
// for about an hour (expires_at).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE password_reset_tokens (
      id          uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id     uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      token_hash  text NOT NULL UNIQUE CHECK (token_hash ~ '^[0-9a-f]{64}$'),
      expires_at  timestamptz NOT NULL,
      used_at     timestamptz,
      created_at  timestamptz NOT NULL DEFAULT now(),
      CHECK (expires_at > created_at AND expires_at <= created_at + interval '1 day'),
      CHECK (used_at IS NULL OR used_at >= created_at)
    )`);
  // token_hash is unique (the lookup on redeeming); user_id: a user's open tokens are retired on reset
  await queryInterface.sequelize.query("CREATE INDEX password_reset_tokens_user_idx ON password_reset_tokens (user_id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE password_reset_tokens");
}
