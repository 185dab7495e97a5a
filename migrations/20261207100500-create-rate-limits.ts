import type { QueryInterface } from "sequelize";

// Counters of rate-limiter-flexible's PostgreSQL store (lib/auth/rate-limit.ts), shared by every
// app instance. The columns are the ones the library's own CREATE TABLE uses (key, points,
// expire in epoch milliseconds); we create it here and pass tableCreated: true, so the app never
// runs DDL. Keys are "<limiter>:<ip>:<email>".
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE rate_limits (
      key     varchar(255) PRIMARY KEY CHECK (length(key) > 0),
      points  integer NOT NULL DEFAULT 0,
      expire  bigint CHECK (expire IS NULL OR expire > 0)
    )`);
  // the library deletes expired rows every five minutes: WHERE expire < $1
  await queryInterface.sequelize.query("CREATE INDEX rate_limits_expire_idx ON rate_limits (expire)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE rate_limits");
}
