import { randomBytes } from "node:crypto";
import pg from "pg";
import { afterAll, beforeAll } from "vitest";
import "@/lib/db/sequelize"; // hands lib/env's database settings to the models' connection
import { env, resetEnvCache } from "@/lib/env";
import { TEMPLATE_DATABASES, type Template } from "@/lib/platform/test-templates";

// npm test (lib/platform/test-run.ts) starts one throwaway cluster and prepares two template
// databases: one migrated, one migrated and seeded with the demo scenario. Each test file clones
// its own database from a template, so files never see each other's writes and run in parallel.

function clusterUrl(database: string): string {
  const base = env().SHUNTBOOK_TEST_PG_URL;
  if (!base) throw new Error("SHUNTBOOK_TEST_PG_URL is not set: run the suite with `npm test`");
  const url = new URL(base);
  url.pathname = `/${database}`;
  return url.toString();
}

async function admin<T>(fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: clusterUrl("postgres") });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

async function createDatabaseFromTemplate(template: Template): Promise<{ name: string; url: string }> {
  const name = `t_${template}_${randomBytes(5).toString("hex")}`;
  await admin((c) => c.query(`CREATE DATABASE ${name} TEMPLATE ${TEMPLATE_DATABASES[template]}`));
  return { name, url: clusterUrl(name) };
}

async function dropDatabase(name: string): Promise<void> {
  await admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
}

/**
 * Gives the calling test file its own database and points DATABASE_URL (and so `db()` and every
 * lib function) at it. Call at the top level of the file, before anything touches the database.
 */
export function useTestDatabase(template: Template = "migrated"): { url: () => string } {
  let created: { name: string; url: string } | undefined;
  beforeAll(async () => {
    created = await createDatabaseFromTemplate(template);
    process.env.DATABASE_URL = created.url;
    resetEnvCache();
  });
  afterAll(async () => {
    const { getSequelize } = await import("@/lib/db/sequelize");
    await getSequelize()
      .close()
      .catch(() => undefined);
    if (created) await dropDatabase(created.name);
  });
  return {
    url: () => {
      if (!created) throw new Error("useTestDatabase: the database is made in beforeAll");
      return created.url;
    },
  };
}
