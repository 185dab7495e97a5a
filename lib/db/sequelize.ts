import { databaseUrl, env } from "@/lib/env";
import { configureDatabase, createSequelize, getSequelize } from "@/models/connection";

// Importing this file hands the environment's database settings to the models' connection
// (models/connection.ts), which cannot import lib/env itself; they are read on the first query.
// instrumentation.ts imports it for the app and the job worker, tests/support/database.ts for tests.
configureDatabase(() => {
  const e = env();
  return { url: databaseUrl(e), logging: e.SHUNTBOOK_SQL_LOG };
});

export { createSequelize, getSequelize };
