import { existsSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomSecret } from "./secret-files";
import { createSequelize } from "@/lib/db/sequelize";
import { env } from "@/lib/env";
import { migrateUp, seedUp } from "@/lib/db/migrate";
import { TEMPLATE_DATABASES } from "./test-templates";
import { spawnGroup, stopGroup, waitForExit } from "./child-process";
import { objectStoreKeys, startFakes } from "./fakes";
import { Lifecycle } from "./lifecycle";
import { log } from "./log";
import { NO_TELEMETRY, buildIfNeeded, nextBin, serverEnv } from "./next-build";
import { aptInstall, isRoot } from "./postgres-binaries";
import { createAppDatabase, describeCluster, initCluster, secureCluster, startCluster, stopCluster, type Cluster } from "./postgres-cluster";
import { freePort, waitForHttp } from "./wait-for-http";

const CHROMIUM = "/usr/bin/chromium";

/**
 * `npm test`: one throwaway cluster in a temporary folder on a free port (never .data), the
 * migrations run from zero into a template database (and a seeded copy), the built app served
 * on a seeded database for the browser tests, the mail catcher and the S3 fake on free ports,
 * then vitest over every test. Everything started
 * is stopped again, whatever the tests do, and the exit status is vitest's.
 */
export async function runTests(vitestArgs: string[]): Promise<number> {
  const root = process.cwd();
  const lifecycle = new Lifecycle();
  try {
    ensureChromium();
    const scratch = mkdtempSync(path.join(os.tmpdir(), "shuntbook-test-"));
    lifecycle.onStop("the test scratch folder", () => rmSync(scratch, { recursive: true, force: true }));
    const cluster = await startThrowawayCluster(scratch, lifecycle);
    await prepareTemplates(cluster);
    const services = await startFakes(root, lifecycle, {
      stateDir: scratch,
      smtpPort: await freePort(),
      webPort: await freePort(),
      s3Port: await freePort(),
      bucket: env().S3_BUCKET,
      s3Keys: objectStoreKeys(randomSecret()),
      env: {},
    });

    // one session secret for the app under test and the test files, so that tests/support/auth.ts
    // can sign session cookies the app accepts; fresh per run
    const authSecret = randomSecret();
    const appUrl =
      env().SHUNTBOOK_TEST_APP === "1" ? await startAppUnderTest(root, cluster, { ...services, NEXTAUTH_SECRET: authSecret }, lifecycle) : undefined;
    const vitest = spawnGroup(process.execPath, [path.join(root, "node_modules/vitest/vitest.mjs"), "run", ...vitestArgs], {
      cwd: root,
      stdio: "inherit",
      env: {
        ...process.env,
        ...services,
        ...NO_TELEMETRY,
        NODE_ENV: "test",
        SHUNTBOOK_TEST_PG_URL: cluster.url("postgres"),
        NEXTAUTH_SECRET: authSecret,
        NEXTAUTH_URL: appUrl ?? "http://127.0.0.1:3999",
        ...(appUrl ? { SHUNTBOOK_TEST_APP_URL: appUrl } : {}),
        DATABASE_URL: cluster.url(TEMPLATE_DATABASES.migrated),
      },
    });
    lifecycle.onStop("vitest", () => stopGroup(vitest));
    const code = await waitForExit(vitest);
    await lifecycle.stop();
    return code;
  } catch (error) {
    await lifecycle.stop();
    throw error;
  }
}

function ensureChromium(): void {
  if (existsSync(CHROMIUM)) return;
  if (!isRoot()) throw new Error(`the browser tests need Debian's Chromium at ${CHROMIUM}: sudo apt-get install chromium`);
  log("installing Debian's chromium package for the browser tests ...");
  aptInstall(["chromium"]);
}

async function startThrowawayCluster(scratch: string, lifecycle: Lifecycle): Promise<Cluster> {
  const cluster = describeCluster(scratch, await freePort());
  initCluster(cluster);
  startCluster(cluster, { durable: false });
  lifecycle.onStop("PostgreSQL", () => stopCluster(cluster));
  // the test files clone their databases from the templates as the app's role (tests/support/database.ts)
  await secureCluster(cluster, { appMayCreateDatabases: true });
  return cluster;
}

/** Migrations from zero into one template, then a copy of it with the demo scenario seeded. */
async function prepareTemplates(cluster: Cluster): Promise<void> {
  const started = Date.now();
  await createAppDatabase(cluster, TEMPLATE_DATABASES.migrated);
  await withSequelize(cluster.url(TEMPLATE_DATABASES.migrated), (s) => migrateUp(s));
  await createAppDatabase(cluster, TEMPLATE_DATABASES.seeded, TEMPLATE_DATABASES.migrated);
  await withSequelize(cluster.url(TEMPLATE_DATABASES.seeded), (s) => seedUp(s));
  log(`test templates ready in ${Date.now() - started} ms`);
}

async function withSequelize<T>(url: string, fn: (s: ReturnType<typeof createSequelize>) => Promise<T>): Promise<T> {
  const sequelize = createSequelize(url, { poolMax: 2 });
  try {
    return await fn(sequelize);
  } finally {
    await sequelize.close();
  }
}

/** The production build, served on its own seeded database, for the browser and HTTP tests. */
async function startAppUnderTest(root: string, cluster: Cluster, services: Record<string, string>, lifecycle: Lifecycle): Promise<string> {
  const database = "shuntbook_app_under_test";
  await createAppDatabase(cluster, database, TEMPLATE_DATABASES.seeded);
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const appEnv = {
    ...process.env,
    ...services,
    NODE_ENV: "production" as const,
    DATABASE_URL: cluster.url(database),
    PORT: String(port),
    NEXTAUTH_URL: url,
  };
  buildIfNeeded(root, appEnv);
  const app = spawnGroup(process.execPath, [nextBin(root), "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    stdio: ["ignore", "ignore", "inherit"],
    env: serverEnv(root, appEnv),
  });
  lifecycle.onStop("the app under test", () => stopGroup(app));
  await waitForHttp(url);
  return url;
}
