// Entry point of `npm start`, `npm run dev` and `npm test`. It is plain JavaScript with no
// dependencies because it must run on a fresh clone before node_modules exists: it installs the
// locked dependencies when they are missing or stale, then hands over to the TypeScript launcher.
import { spawnSync } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const command = process.argv[2] ?? "start";

function dependenciesAreCurrent() {
  // npm writes node_modules/.package-lock.json on every install; older than the lock means stale.
  const installed = path.join(root, "node_modules/.package-lock.json");
  const lock = path.join(root, "package-lock.json");
  return existsSync(installed) && statSync(installed).mtimeMs >= statSync(lock).mtimeMs;
}

if (!dependenciesAreCurrent()) {
  console.log("[shuntbook] installing dependencies (npm ci) ...");
  const npm = process.platform === "win32" ? "npm.cmd" : "npm";
  const result = spawnSync(npm, ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (result.status !== 0) {
    console.error("[shuntbook] npm ci failed; see the output above.");
    process.exit(result.status ?? 1);
  }
}

process.chdir(root);
const require = createRequire(import.meta.url);
// tsx's CommonJS hook lets the launcher (and the migrations it loads) be TypeScript, with the
// tsconfig "@/..." paths resolved.
require("tsx/cjs/api").register();
const { runCommand } = require(path.join(root, "lib/platform/commands.ts"));
runCommand(command, process.argv.slice(3)).catch((error) => {
  console.error(`[shuntbook] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
