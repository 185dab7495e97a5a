import pg from "pg";
import { Sequelize } from "sequelize";
import { databaseUrl, env } from "@/lib/env";

// PostgreSQL returns bigint (count(*)) and numeric as strings by default; the values we store are
// far below 2^53, so parse them as numbers once here instead of at every call site.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

const globalForDb = globalThis as unknown as { shuntbookSequelize?: Sequelize };

export function createSequelize(url: string, opts: { logging?: boolean; poolMax?: number } = {}): Sequelize {
  return new Sequelize(url, {
    dialect: "postgres",
    dialectModule: pg,
    logging: opts.logging ? console.log : false,
    pool: { max: opts.poolMax ?? 10, min: 0, idle: 10_000 },
    define: { underscored: true, timestamps: true },
  });
}

/** The app's one Sequelize instance, kept on globalThis so that dev-mode reloads reuse the pool. */
export function getSequelize(): Sequelize {
  if (!globalForDb.shuntbookSequelize) {
    const e = env();
    globalForDb.shuntbookSequelize = createSequelize(databaseUrl(e), { logging: e.SHUNTBOOK_SQL_LOG });
  }
  return globalForDb.shuntbookSequelize;
}
