import type { QueryInterface } from "sequelize";

// Magic-link tokens of next-auth's e-mail sign-in (models/VerificationToken.ts). next-auth stores
// only a SHA-256 of the token and the secret, never the token in the link; one use deletes every
// token of that address.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE verification_tokens (
      token       text PRIMARY KEY CHECK (length(token) BETWEEN 16 AND 512),
      identifier  text NOT NULL CHECK (length(identifier) BETWEEN 3 AND 254),
      expires     timestamptz NOT NULL,
      created_at  timestamptz NOT NULL DEFAULT now()
    )`);
  // the adapter deletes by identifier when a token is used
  await queryInterface.sequelize.query("CREATE INDEX verification_tokens_identifier_idx ON verification_tokens (identifier)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE verification_tokens");
}
