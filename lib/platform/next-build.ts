import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { env } from "@/lib/env";
import { log } from "./log";

// What a production build depends on; a newer file in any of these means the build is stale.
const BUILD_INPUTS = [
  "app",
  "components",
  "lib",
  "models",
  "public",
  "proxy.ts",
  "next.config.mjs",
  "tailwind.config.ts",
  "postcss.config.mjs",
  "tsconfig.json",
  "package-lock.json",
];

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

function buildIsStale(root: string): boolean {
  const buildId = path.join(root, env().SHUNTBOOK_NEXT_DIST_DIR, "BUILD_ID");
  if (!existsSync(buildId)) return true;
  const builtAt = statSync(buildId).mtimeMs;
  return BUILD_INPUTS.some((input) => newestMtime(path.join(root, input)) > builtAt);
}

/** Next.js's documented switch for its anonymous telemetry (nextjs.org/telemetry); set for every child the launcher starts. */
export const NO_TELEMETRY = { NEXT_TELEMETRY_DISABLED: "1" } as const;

export function nextBin(root: string): string {
  return path.join(root, "node_modules", "next", "dist", "bin", "next");
}

/** Runs `next build` only when the sources changed since the last build. */
export function buildIfNeeded(root: string, env: NodeJS.ProcessEnv): void {
  if (!buildIsStale(root)) return;
  log("building the app (next build) ...");
  const started = Date.now();
  const r = spawnSync(process.execPath, [nextBin(root), "build"], { cwd: root, stdio: "inherit", env: { ...env, ...NO_TELEMETRY } });
  if (r.status !== 0) throw new Error("next build failed; see the output above");
  log(`built in ${Math.round((Date.now() - started) / 1000)} s`);
}

/**
 * The environment for the app's server process: NODE_OPTIONS gains lib/platform/peer-address.cjs,
 * which records each request's socket address in X-Forwarded-For (lib/auth/client-address.ts),
 * and lib/platform/raw-path.cjs, which re-points malformed request paths before Next.js reads them;
 * Next.js's telemetry is off.
 */
export function serverEnv<E extends NodeJS.ProcessEnv>(root: string, env: E): E {
  // raw-path.cjs: malformed or dot-climbing request paths answer the not-found page or the API's JSON 404
  const preload = ["peer-address.cjs", "raw-path.cjs"].map((file) => `--require ${JSON.stringify(path.join(root, "lib", "platform", file))}`).join(" ");
  return { ...env, ...NO_TELEMETRY, NODE_OPTIONS: [env.NODE_OPTIONS, preload].filter(Boolean).join(" ") };
}
