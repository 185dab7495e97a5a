import pg from "pg";
import { Sequelize } from "sequelize";

// The app's one connection pool. The models cannot read the environment themselves (lib/env is
// above them), so whoever starts a process hands the settings in once with configureDatabase();
// lib/db does it for the app, the job worker and the tests. The settings are read lazily, on the
// first query, so a test may still point DATABASE_URL elsewhere before that.

// PostgreSQL returns bigint (count(*)) and numeric as strings by default; the values we store are
// far below 2^53, so parse them as numbers once here instead of at every call site.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

export type DatabaseSettings = { url: string; logging: boolean };

// on globalThis, so that dev-mode reloads and Next's separately bundled entry points (the
// instrumentation hook, the routes) share one pool and one configuration
const shared = globalThis as unknown as { shuntbookSequelize?: Sequelize; shuntbookDatabaseSettings?: () => DatabaseSettings };

export function createSequelize(url: string, opts: { logging?: boolean; poolMax?: number } = {}): Sequelize {
  return new Sequelize(url, {
    dialect: "postgres",
    dialectModule: pg,
    logging: opts.logging ? console.log : false,
    pool: { max: opts.poolMax ?? 10, min: 0, idle: 10_000 },
    define: { underscored: true, timestamps: true },
  });
}

/** Where getSequelize() takes its settings from, called when the first connection is made. */
export function configureDatabase(settings: () => DatabaseSettings): void {
  shared.shuntbookDatabaseSettings = settings;
}

/** The app's one Sequelize instance, made on first use from the configured settings. */
export function getSequelize(): Sequelize {
  if (!shared.shuntbookSequelize) {
    const settings = shared.shuntbookDatabaseSettings;
    if (!settings) throw new Error("The database is not configured: import lib/db (configureDatabase) before the first query");
    const { url, logging } = settings();
    shared.shuntbookSequelize = createSequelize(url, { logging });
  }
  return shared.shuntbookSequelize;
}
