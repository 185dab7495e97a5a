import { writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { spawnGroup, stopGroup } from "@/lib/platform/child-process";
import type { Lifecycle } from "@/lib/platform/lifecycle";
import { NO_TELEMETRY, nextBin } from "@/lib/platform/next-build";
import { freePort, waitForHttp } from "@/lib/platform/wait-for-http";
import type { StoredResponse } from "./bare-server";

// The two servers the benchmark drives, each in a process group of its own (as lib/platform runs
// the app), registered with the lifecycle so that a failure or Ctrl-C stops them too.

export type RunningServer = { url: string; stop: () => Promise<void> };

/** The production build (built beforehand) served by `next start` against `databaseUrl`. */
export async function startNextApp(root: string, databaseUrl: string, lifecycle: Lifecycle): Promise<RunningServer> {
  const port = await freePort();
  const app = spawnGroup(process.execPath, [nextBin(root), "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, ...NO_TELEMETRY, NODE_ENV: "production", DATABASE_URL: databaseUrl, PORT: String(port) },
  });
  const stop = () => stopGroup(app);
  lifecycle.onStop("the app under benchmark", stop);
  const url = `http://127.0.0.1:${port}`;
  await waitForHttp(`${url}/api/v1/health`);
  return { url, stop };
}

/** tests/benchmarks/bare-server.ts in its own process, answering the recorded responses. */
export async function startBareServerProcess(
  root: string,
  responses: Record<string, StoredResponse>,
  scratch: string,
  lifecycle: Lifecycle,
): Promise<RunningServer> {
  const file = path.join(scratch, `responses-${Date.now()}.json`);
  writeFileSync(file, JSON.stringify(responses));
  const port = await freePort();
  const tsxCjs = createRequire(path.join(root, "package.json")).resolve("tsx/cjs");
  const child = spawnGroup(process.execPath, ["--require", tsxCjs, path.join(root, "tests/benchmarks/bare-server.ts"), file, String(port)], {
    cwd: root,
    stdio: ["ignore", "ignore", "inherit"],
    env: { ...process.env, ...NO_TELEMETRY, NODE_ENV: "production" },
  });
  const stop = () => stopGroup(child);
  lifecycle.onStop("the bare node:http server", stop);
  const url = `http://127.0.0.1:${port}`;
  await waitForHttp(url, 30_000);
  return { url, stop };
}
