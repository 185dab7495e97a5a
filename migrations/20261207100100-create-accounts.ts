import type { QueryInterface } from "sequelize";

// Sign-in accounts linked to a user, in next-auth's shape (@next-auth/sequelize-adapter maps its
// Account model here through models/Account.ts). E-mail and password sign-in keep nothing here;
// the table exists so that the adapter is complete and an OAuth provider can be added later.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE accounts (
      id                   uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id              uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      type                 text NOT NULL CHECK (type IN ('oauth', 'oidc', 'email', 'credentials')),
      provider             text NOT NULL CHECK (length(provider) BETWEEN 1 AND 100),
      provider_account_id  text NOT NULL CHECK (length(provider_account_id) BETWEEN 1 AND 255),
      refresh_token        text,
      access_token         text,
      expires_at           integer,
      token_type           text,
      scope                text,
      id_token             text,
      session_state        text,
      created_at           timestamptz NOT NULL DEFAULT now(),
      UNIQUE (provider, provider_account_id)
    )`);
  // the unique constraint serves the adapter's lookup by (provider, provider_account_id)
  await queryInterface.sequelize.query("CREATE INDEX accounts_user_idx ON accounts (user_id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE accounts");
}
