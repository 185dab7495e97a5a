import path from "node:path";
import { env, resetEnvCache } from "@/lib/env";
import { NO_TELEMETRY } from "./next-build";
import { runApp } from "./run-app";
import { runLookupBenchmark } from "@/tests/benchmarks/run";
import { runStatsRebuild } from "./run-task";
import { runTests } from "./test-run";
import { runChaos } from "@/tests/chaos/run";

/** `npm run fuzz`: the fuzz test at 10,000 bad bodies per endpoint and caller, with its report (no built app). */
function runFuzz(args: string[]): Promise<number> {
  process.env.SHUNTBOOK_TEST_APP = "0";
  process.env.SHUNTBOOK_FUZZ_RUNS ??= "10000";
  process.env.SHUNTBOOK_FUZZ_REPORT = "1";
  resetEnvCache();
  return runTests(["tests/integration/fuzz-bodies.test.ts", ...args]);
}

const COMMANDS: Record<string, (args: string[]) => Promise<number>> = {
  start: () => runApp("start"),
  dev: () => runApp("dev"),
  test: (args) => runTests(args),
  "stats:rebuild": () => runStatsRebuild(),
  "benchmark:lookup": (args) => runLookupBenchmark(args),
  fuzz: (args) => runFuzz(args),
  chaos: (args) => runChaos(args),
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
