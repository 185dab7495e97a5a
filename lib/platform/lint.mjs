// Entry point of `npm run lint`: runs every check, even after one fails, so a single run shows all
// that needs fixing, then prints one line per check and exits non-zero if any failed. Each check is
// its own script in package.json (`npm run lint:eslint` and so on), runnable alone.
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

const CHECKS = [
  { name: "lint:eslint", what: "ESLint, Next's rules" },
  { name: "lint:format", what: "Prettier formatting" },
  { name: "lint:unused", what: "knip: unused files, exports and dependencies" },
  { name: "lint:layers", what: "dependency-cruiser: layers and cycles" },
];

const npm = process.platform === "win32" ? "npm.cmd" : "npm";
const results = CHECKS.map(({ name, what }) => {
  console.log(`\n[lint] ${name} (${what})`);
  const started = Date.now();
  const run = spawnSync(npm, ["run", "--silent", name], { cwd: root, stdio: "inherit" });
  return { name, ok: run.status === 0, seconds: Math.round((Date.now() - started) / 1000) };
});

console.log("\n[lint] summary");
for (const { name, ok, seconds } of results) console.log(`  ${ok ? "pass" : "FAIL"}  ${name} (${seconds} s)`);
process.exit(results.every((r) => r.ok) ? 0 : 1);
