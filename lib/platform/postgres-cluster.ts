import { spawnSync } from "node:child_process";
import { chmodSync, chownSync, existsSync, mkdirSync, statSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import { findPostgresBinaries, isRoot } from "./postgres-binaries";
import { log } from "./log";

const CLUSTER_SUPERUSER = "shuntbook";
// initdb refuses to run as root, so as root the cluster belongs to Debian's `postgres` system user.
const SERVICE_USER = "postgres";

export type Cluster = {
  dataDir: string;
  socketDir: string;
  port: number;
  binDir: string;
  /** postgres://shuntbook@127.0.0.1:PORT/<database> */
  url: (database: string) => string;
};

function asServiceUser(binDir: string, program: string, args: string[], opts: { quiet?: boolean } = {}) {
  const exe = path.join(binDir, program);
  const [cmd, argv] = isRoot() ? ["runuser", ["-u", SERVICE_USER, "--", exe, ...args]] : [exe, args];
  const result = spawnSync(cmd, argv, { encoding: "utf8", stdio: opts.quiet ? "pipe" : ["ignore", "pipe", "pipe"] });
  return { status: result.status ?? 1, output: `${result.stdout ?? ""}${result.stderr ?? ""}` };
}

function ownDirectory(dir: string): void {
  // the parents must stay traversable by the service user; only the leaf is private
  const parent = path.dirname(dir);
  if (!existsSync(parent)) mkdirSync(parent, { recursive: true, mode: 0o755 });
  if (isRoot()) chmodSync(parent, statSync(parent).mode | 0o711);
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (isRoot()) {
    const user = spawnSync("id", ["-u", SERVICE_USER], { encoding: "utf8" });
    const group = spawnSync("id", ["-g", SERVICE_USER], { encoding: "utf8" });
    if (user.status !== 0) throw new Error(`running as root needs the '${SERVICE_USER}' system user (Debian's postgresql package creates it)`);
    chownSync(dir, Number(user.stdout.trim()), Number(group.stdout.trim()));
  }
}

/** Describes a cluster under `baseDir` (data in baseDir/postgres, socket in baseDir/run) without touching it. */
export function describeCluster(baseDir: string, port: number): Cluster {
  return {
    dataDir: path.join(baseDir, "postgres"),
    socketDir: path.join(baseDir, "run"),
    port,
    binDir: findPostgresBinaries(),
    url: (database) => `postgres://${CLUSTER_SUPERUSER}@127.0.0.1:${port}/${database}`,
  };
}

/** Creates the cluster on first use; later calls reuse the existing data. */
export function initCluster(cluster: Cluster): void {
  ownDirectory(cluster.socketDir);
  if (existsSync(path.join(cluster.dataDir, "PG_VERSION"))) return;
  log(`creating a PostgreSQL cluster in ${cluster.dataDir}`);
  ownDirectory(cluster.dataDir);
  // trust on loopback only: the server listens on 127.0.0.1 and a socket inside the project.
  const r = asServiceUser(cluster.binDir, "initdb", ["-D", cluster.dataDir, "-U", CLUSTER_SUPERUSER, "--auth=trust", "--encoding=UTF8", "--locale=C.UTF-8"]);
  if (r.status !== 0) throw new Error(`initdb failed:\n${r.output}`);
}

export function isClusterRunning(cluster: Cluster): boolean {
  return asServiceUser(cluster.binDir, "pg_ctl", ["-D", cluster.dataDir, "status"], { quiet: true }).status === 0;
}

/** `durable: false` turns fsync off: right for a throwaway test cluster, never for real data. */
export function startCluster(cluster: Cluster, opts: { durable?: boolean } = {}): void {
  if (isClusterRunning(cluster)) {
    throw new Error(`PostgreSQL is already running on ${cluster.dataDir}; is another 'npm start' still up? Stop it first.`);
  }
  const logFile = path.join(cluster.dataDir, "server.log");
  const options = `-c listen_addresses=127.0.0.1 -p ${cluster.port} -k ${cluster.socketDir} -c fsync=${opts.durable === false ? "off" : "on"}`;
  const r = asServiceUser(cluster.binDir, "pg_ctl", ["-D", cluster.dataDir, "-w", "-t", "60", "-l", logFile, "-o", options, "start"]);
  if (r.status !== 0) throw new Error(`PostgreSQL did not start (port ${cluster.port} in use?). See ${logFile}\n${r.output}`);
  log(`PostgreSQL 15 is up on 127.0.0.1:${cluster.port}`);
}

/** Fast shutdown: ends open sessions, then writes a clean checkpoint so the next start needs no recovery. */
export function stopCluster(cluster: Cluster): void {
  if (!isClusterRunning(cluster)) return;
  const r = asServiceUser(cluster.binDir, "pg_ctl", ["-D", cluster.dataDir, "-w", "-t", "60", "-m", "fast", "stop"]);
  if (r.status !== 0) console.error(`[shuntbook] pg_ctl stop failed:\n${r.output}`);
  else log("PostgreSQL stopped");
}

export async function ensureDatabase(serverUrl: string, database: string, template?: string): Promise<boolean> {
  const adminUrl = new URL(serverUrl);
  adminUrl.pathname = "/postgres";
  const client = new pg.Client({ connectionString: adminUrl.toString() });
  await client.connect();
  try {
    const found = await client.query("SELECT 1 FROM pg_database WHERE datname = $1", [database]);
    if (found.rowCount) return false;
    const ident = (s: string) => `"${s.replace(/"/g, '""')}"`;
    await client.query(`CREATE DATABASE ${ident(database)}${template ? ` TEMPLATE ${ident(template)}` : ""}`);
    return true;
  } finally {
    await client.end();
  }
}
