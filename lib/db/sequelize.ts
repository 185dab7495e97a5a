import { databaseUrl, env } from "@/lib/env";
import { configureDatabase, createSequelize, getSequelize } from "@/models/connection";

/** Hands the environment's database settings to the models' connection; safe to call again. */
export function configureDatabaseFromEnv(): void {
  configureDatabase(() => {
    const e = env();
    return { url: databaseUrl(e), logging: e.SHUNTBOOK_SQL_LOG };
  });
}

configureDatabaseFromEnv();

export { createSequelize, getSequelize };
