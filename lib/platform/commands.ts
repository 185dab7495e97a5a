import path from "node:path";
import { env } from "@/lib/env";
import { NO_TELEMETRY } from "./next-build";
import { runApp } from "./run-app";
import { runLookupBenchmark } from "@/tests/benchmarks/run";
import { runStatsRebuild } from "./run-task";
import { runTests } from "./test-run";

const COMMANDS: Record<string, (args: string[]) => Promise<number>> = {
  start: () => runApp("start"),
  dev: () => runApp("dev"),
  test: (args) => runTests(args),
  "stats:rebuild": () => runStatsRebuild(),
  "benchmark:lookup": (args) => runLookupBenchmark(args),
};

/** Dispatches `npm start|run dev|test` (see bootstrap.mjs) and exits with the command's status. */
export async function runCommand(name: string, args: string[]): Promise<void> {
  const command = COMMANDS[name];
  if (!command) throw new Error(`unknown command '${name}'; expected one of ${Object.keys(COMMANDS).join(", ")}`);
  env(); // fail fast, with the variable named, on a bad environment
  process.env.SHUNTBOOK_ROOT ??= path.resolve(".");
  // Nothing leaves the machine unasked: every child (next build, next start, vitest, the
  // benchmarks' servers) inherits this and Next.js sends no telemetry (nextjs.org/telemetry)
  Object.assign(process.env, NO_TELEMETRY);
  process.exit(await command(args));
}
