import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { log } from "./log";

// Debian installs each major version's server binaries here; PATH usually has only the client.
const DEBIAN_BIN_DIR = "/usr/lib/postgresql/15/bin";

export function isRoot(): boolean {
  return typeof process.getuid === "function" && process.getuid() === 0;
}

function hasServerBinaries(dir: string): boolean {
  return ["initdb", "pg_ctl", "postgres"].every((b) => existsSync(path.join(dir, b)));
}

/**
 * Finds PostgreSQL 15's server binaries. As root on a machine without them, installs Debian's
 * `postgresql` package (which brings postgresql-contrib, and so pg_trgm); otherwise explains what to install.
 */
export function findPostgresBinaries(): string {
  const fromEnv = process.env.SHUNTBOOK_PG_BIN;
  if (fromEnv) {
    if (!hasServerBinaries(fromEnv)) throw new Error(`SHUNTBOOK_PG_BIN=${fromEnv} does not hold initdb, pg_ctl and postgres`);
    return fromEnv;
  }
  if (hasServerBinaries(DEBIAN_BIN_DIR)) return DEBIAN_BIN_DIR;
  if (!isRoot()) {
    throw new Error(
      `PostgreSQL 15's server binaries were not found in ${DEBIAN_BIN_DIR}.\n` +
        "  Install them with:  sudo apt-get install postgresql   (Debian's package, version 15)\n" +
        "  or point SHUNTBOOK_PG_BIN at a folder holding initdb and pg_ctl, or set DATABASE_URL to use a server you run.",
    );
  }
  log("PostgreSQL 15 is missing; installing Debian's postgresql package ...");
  aptInstall(["postgresql"]);
  if (!hasServerBinaries(DEBIAN_BIN_DIR)) throw new Error(`apt-get installed postgresql but ${DEBIAN_BIN_DIR} is still missing`);
  return DEBIAN_BIN_DIR;
}

/** Installs Debian packages as root, non-interactively. */
export function aptInstall(packages: string[]): void {
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  const update = spawnSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  if (update.status !== 0) throw new Error("apt-get update failed");
  const install = spawnSync("apt-get", ["install", "-y", "-qq", "--no-install-recommends", ...packages], { stdio: "inherit", env });
  if (install.status !== 0) throw new Error(`apt-get install ${packages.join(" ")} failed`);
}
