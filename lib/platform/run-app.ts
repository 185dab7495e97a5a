import path from "node:path";
import { persistentAuthSecret, persistentSecret } from "./secret-files";
import { env } from "@/lib/env";
import { spawnGroup, stopGroup, waitForExit } from "./child-process";
import { prepareDatabase } from "./database";
import { objectStoreKeys, startFakes } from "./fakes";
import { Lifecycle } from "./lifecycle";
import { log } from "./log";
import { buildIfNeeded, nextBin, serverEnv } from "./next-build";
import { createAppDatabase, describeCluster, initCluster, isClusterRunning, secureCluster, startCluster, stopCluster } from "./postgres-cluster";

/** The app's database in the embedded cluster. */
const EMBEDDED_DATABASE = "shuntbook";

/**
 * `npm start` / `npm run dev`: bring up PostgreSQL (the embedded cluster in .data unless
 * DATABASE_URL names another server), migrate, seed an empty database, then serve the app on
 * 127.0.0.1:PORT until Ctrl-C, and stop everything cleanly.
 */
export async function runApp(mode: "start" | "dev"): Promise<number> {
  const root = process.cwd();
  const e = env();
  const lifecycle = new Lifecycle();
  try {
    const url = await bringUpDatabase(root, lifecycle);
    await prepareDatabase(url, { seedWhenEmpty: true });

    const services = await startFakes(root, lifecycle, {
      stateDir: path.resolve(root, e.SHUNTBOOK_DATA_DIR),
      smtpPort: e.SHUNTBOOK_MAIL_SMTP_PORT,
      webPort: e.SHUNTBOOK_MAIL_WEB_PORT,
      s3Port: e.SHUNTBOOK_S3_PORT,
      bucket: e.S3_BUCKET,
      s3Keys: objectStoreKeys(persistentSecret(path.resolve(root, e.SHUNTBOOK_DATA_DIR), "s3-fake-secret-key")),
      env: { SMTP_URL: e.SMTP_URL, S3_ENDPOINT: e.S3_ENDPOINT },
    });
    const appEnv = { ...process.env, ...services, ...authEnv(root), DATABASE_URL: url, PORT: String(e.PORT) };
    if (mode === "start") buildIfNeeded(root, { ...appEnv, NODE_ENV: "production" });
    const app = spawnGroup(process.execPath, [nextBin(root), mode, "-H", "127.0.0.1", "-p", String(e.PORT)], {
      cwd: root,
      stdio: "inherit",
      env: serverEnv(root, { ...appEnv, NODE_ENV: mode === "start" ? "production" : "development" }),
    });
    lifecycle.onStop("the app", () => stopGroup(app));
    log(`Shuntbook: http://127.0.0.1:${e.PORT}  (Ctrl-C stops the app and the database)`);
    if (services.MAIL_INBOX_URL) log(`mail sent by the app lands in the inbox at ${services.MAIL_INBOX_URL}`);
    const code = await waitForExit(app);
    await lifecycle.stop();
    return code;
  } catch (error) {
    await lifecycle.stop();
    throw error;
  }
}

/**
 * next-auth's base URL (links in mails point there) and the secret its session JWTs are encrypted
 * with: the environment's, else the address we serve on and a secret kept in the data folder.
 */
function authEnv(root: string): { NEXTAUTH_URL: string; NEXTAUTH_SECRET: string } {
  const e = env();
  return {
    NEXTAUTH_URL: e.NEXTAUTH_URL ?? `http://127.0.0.1:${e.PORT}`,
    NEXTAUTH_SECRET: e.NEXTAUTH_SECRET ?? persistentAuthSecret(path.resolve(root, e.SHUNTBOOK_DATA_DIR)),
  };
}

/**
 * The app's database: DATABASE_URL, or the embedded cluster (started here and stopped by the
 * lifecycle, unless a running `npm start` already has it up, in which case it is shared).
 */
export async function bringUpDatabase(root: string, lifecycle: Lifecycle): Promise<string> {
  const e = env();
  if (e.DATABASE_URL) {
    log("DATABASE_URL is set: using that server, not the embedded cluster");
    return e.DATABASE_URL;
  }
  const cluster = describeCluster(path.resolve(root, e.SHUNTBOOK_DATA_DIR), e.SHUNTBOOK_PG_PORT, { allowReplication: e.SHUNTBOOK_PG_REPLICATION });
  initCluster(cluster);
  if (isClusterRunning(cluster) && lifecycle.mayShareRunningCluster) {
    log("PostgreSQL is already running for this project; using it");
  } else {
    startCluster(cluster);
    lifecycle.onStop("PostgreSQL", () => stopCluster(cluster));
  }
  await secureCluster(cluster);
  await createAppDatabase(cluster, EMBEDDED_DATABASE);
  return cluster.url(EMBEDDED_DATABASE);
}
