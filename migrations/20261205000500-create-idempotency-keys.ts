import type { QueryInterface } from "sequelize";

// Idempotency-Key headers seen on POST /api/v1/submissions, per user. The primary key is what makes
// two identical requests at the same instant create one submission: the second INSERT of the same
// (user, key) waits for the first transaction and then finds its row (lib/submissions/idempotency.ts).
// A row holds the first response so that a retry gets it back; rows live at least 24 hours.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE idempotency_keys (
      user_id          uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      key              text NOT NULL CHECK (length(key) BETWEEN 1 AND 255),
      -- SHA-256 of the request body in canonical JSON: the same key with another body is refused
      request_hash     text NOT NULL CHECK (request_hash ~ '^[0-9a-f]{64}$'),
      response_status  smallint NOT NULL CHECK (response_status BETWEEN 200 AND 299),
      response_body    jsonb NOT NULL,
      submission_id    integer REFERENCES submissions(id) ON DELETE SET NULL,
      created_at       timestamptz NOT NULL DEFAULT now(),
      expires_at       timestamptz NOT NULL,
      PRIMARY KEY (user_id, key),
      CHECK (expires_at >= created_at + interval '24 hours')
    )`);
  await queryInterface.sequelize.query(`
    CREATE INDEX idempotency_keys_expires_idx ON idempotency_keys (expires_at);
    CREATE INDEX idempotency_keys_submission_idx ON idempotency_keys (submission_id);`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE idempotency_keys");
}
