import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { QueryTypes, type Sequelize } from "sequelize";
import { migrateUp } from "@/lib/db/migrate";
import { createSequelize } from "@/lib/db/sequelize";
import { Lifecycle } from "@/lib/platform/lifecycle";
import { log } from "@/lib/platform/log";
import { buildIfNeeded } from "@/lib/platform/next-build";
import { createAppDatabase, describeCluster, initCluster, secureCluster, startCluster, stopCluster, type Cluster } from "@/lib/platform/postgres-cluster";
import { freePort } from "@/lib/platform/wait-for-http";
import { refreshGroups } from "@/lib/published/refresh";
import { sample, uniformPicker, warmUp, type Pick } from "./drive";
import { RUN_ORDER, figuresOf, type RunFigures, type Samples, type TargetId } from "./figures";
import { BenchmarkArgsError, USAGE, parseBenchmarkArgs, type BenchmarkOptions } from "./options";
import { explainLookups } from "./query-plans";
import { recordResponses } from "./record-responses";
import { consoleSummary, runLine, writeReport, type SizeReport } from "./report";
import { startBareServerProcess, startNextApp } from "./servers";
import { seedSyntheticData } from "./synthetic-data";

// `npm run benchmark:lookup`: the published-values lookup under load, against its framework's and
// its machine's ceilings, at each data-set size asked for. Everything runs on a throwaway
// PostgreSQL cluster in a temporary folder on a free port (never .data), and everything started is
// stopped again on success, failure or Ctrl-C. Not part of npm test.

const HEALTH_PATH = "/api/v1/health";
const valuesPath = (slug: string) => `/api/v1/boards/${slug}/values`;

type PreparedSize = { report: SizeReport; database: string; slugs: string[] };

/** Counts and reports the rebuild; by default with nested loops off (see the note in docs/benchmarks.md). */
async function rebuildStats(sequelize: Sequelize, stock: boolean): Promise<number> {
  if (stock) return (await refreshGroups(sequelize, null)).length;
  return sequelize.transaction(async (transaction) => {
    // The aggregate query joins its CTEs on (revision, family, quantity); PostgreSQL estimates
    // such a join at one row and picks a nested loop that is quadratic in the number of groups
    // (about 55 s for 7 000 groups, hours at a million submissions). Hash joins are linear.
    await sequelize.query("SET LOCAL enable_nestloop = off", { transaction });
    return (await refreshGroups(sequelize, null, transaction)).length;
  });
}

async function prepareSize(root: string, cluster: Cluster, options: BenchmarkOptions, submissions: number): Promise<PreparedSize> {
  const database = `benchmark_lookup_${submissions}`;
  await createAppDatabase(cluster, database);
  const sequelize = createSequelize(cluster.url(database), { poolMax: 2 });
  try {
    await migrateUp(sequelize, root);
    log(`seeding ${submissions.toLocaleString("en")} submissions over ${options.boards.toLocaleString("en")} boards ...`);
    let started = Date.now();
    const counts = await seedSyntheticData(sequelize, { boards: options.boards, submissions });
    const seedMs = Date.now() - started;
    log(`seeded in ${seedMs} ms: ${JSON.stringify(counts)}`);
    started = Date.now();
    const statsRows = await rebuildStats(sequelize, options.stockRebuild);
    await sequelize.query("VACUUM ANALYZE board_stats");
    const rebuildMs = Date.now() - started;
    log(`board_stats rebuilt in ${rebuildMs} ms (${statsRows.toLocaleString("en")} rows)`);
    const plans = await explainLookups(sequelize);
    const slugs = (await sequelize.query<{ slug: string }>("SELECT slug FROM board_models ORDER BY slug", { type: QueryTypes.SELECT })).map((r) => r.slug);
    return {
      database,
      slugs,
      report: {
        submissions,
        counts,
        statsRows,
        seedMs,
        rebuildMs,
        rebuildMode: options.stockRebuild ? "stock" : "nested loops off",
        plans,
      },
    };
  } finally {
    await sequelize.close();
  }
}

/** Whole seconds per round, adding up to --duration. */
function roundSeconds(options: BenchmarkOptions): number[] {
  const base = Math.floor(options.duration / options.rounds);
  return Array.from({ length: options.rounds }, (_, i) => base + (i < options.duration % options.rounds ? 1 : 0));
}

async function measureSize(
  root: string,
  url: string,
  prepared: PreparedSize,
  options: BenchmarkOptions,
  scratch: string,
  lifecycle: Lifecycle,
): Promise<RunFigures[]> {
  const app = await startNextApp(root, url, lifecycle);
  const paths = prepared.slugs.map(valuesPath);
  log(`warming up: every board's values once (${paths.length.toLocaleString("en")} lookups) ...`);
  const started = Date.now();
  const recorded = await recordResponses(app.url, paths);
  log(`warmed in ${Date.now() - started} ms`);
  const bare = await startBareServerProcess(
    root,
    Object.fromEntries([...recorded].map(([p, r]) => [p, { headers: r.headers, body: r.body }])),
    scratch,
    lifecycle,
  );

  const drawPath = uniformPicker(paths);
  const drawRecorded = uniformPicker([...recorded]);
  // what a browser adds; the bare server (d) answers the same bytes whatever is asked
  const encoding: Record<string, string> | undefined = options.acceptEncoding ? { "accept-encoding": options.acceptEncoding } : undefined;
  const picks: Record<TargetId, Pick> = {
    framework: () => ({ path: HEALTH_PATH, headers: encoding }),
    lookup: () => ({ path: drawPath(), headers: encoding }),
    revalidate: () => {
      const [path, r] = drawRecorded();
      return { path, headers: { ...encoding, "if-none-match": r.etag } };
    },
    machine: () => ({ path: drawPath() }),
  };
  const runs: RunFigures[] = [];
  const urlOf = (target: TargetId) => (target === "machine" ? bare.url : app.url);
  const seconds = roundSeconds(options);
  try {
    for (const connections of options.connections) {
      for (const target of RUN_ORDER) await warmUp(urlOf(target), picks[target], connections, options.warmup);
      const rounds = new Map<TargetId, Samples[]>(RUN_ORDER.map((t) => [t, []]));
      // the targets take turns, so that a burst of other work on the machine is shared among them
      for (let round = 0; round < options.rounds; round++) {
        for (const target of RUN_ORDER) rounds.get(target)!.push(await sample(urlOf(target), picks[target], connections, seconds[round]));
      }
      for (const target of RUN_ORDER) {
        const figures = figuresOf(target, prepared.report.submissions, connections, rounds.get(target)!);
        log(`${prepared.report.submissions.toLocaleString("en")} submissions ${runLine(figures)}`);
        runs.push(figures);
      }
    }
  } finally {
    await Promise.all([app.stop(), bare.stop()]);
  }
  return runs;
}

async function machineLine(cluster: Cluster, root: string, loadAtStart: number[]): Promise<string> {
  const sequelize = createSequelize(cluster.url("postgres"), { poolMax: 1 });
  try {
    const [{ server_version }] = await sequelize.query<{ server_version: string }>("SHOW server_version", { type: QueryTypes.SELECT });
    const next = JSON.parse(readFileSync(path.join(root, "node_modules/next/package.json"), "utf8")).version;
    const cannon = JSON.parse(readFileSync(path.join(root, "node_modules/autocannon/package.json"), "utf8")).version;
    const cpus = os.cpus();
    const load = loadAtStart.map((x) => x.toFixed(2)).join(" / ");
    return (
      `${cpus.length} × ${cpus[0]?.model.trim() ?? "unknown CPU"}, ${Math.round(os.totalmem() / 2 ** 30)} GiB; Node ${process.version}, ` +
      `PostgreSQL ${server_version}, Next.js ${next}, autocannon ${cannon}. Load average before the run: ${load} (1 / 5 / 15 min; other work on the machine lowers every figure).`
    );
  } finally {
    await sequelize.close();
  }
}

function methodNotes(options: BenchmarkOptions): string[] {
  return [
    "Each size is seeded into its own database on a throwaway PostgreSQL cluster (temporary folder, free port, fsync off), migrated from zero; the app runs `next start` on the production build against it, one process, restarted per size.",
    `Requests for (a), (b) and (d) each draw a board uniformly at random from all ${options.boards.toLocaleString("en")} boards (autocannon setupRequest); (b) sends back the ETag recorded for the board drawn. The default view is asked for (no filters, no points).`,
    options.acceptEncoding
      ? `(a), (b) and (c) send \`Accept-Encoding: ${options.acceptEncoding}\`, as a browser does; (d) answers uncompressed bytes.`
      : "No request sends Accept-Encoding, so every body goes out uncompressed (the issue's comparison).",
    `Before a size is measured every board's values are fetched once (the cache as traffic would leave it, and the ETags and bytes for (b) and (d)). At each connection count every target first gets ${options.warmup} s of unrecorded load; then each is measured for ${options.duration} s in all, in ${options.rounds} round(s) that take the targets in turn (c, a, b, d), so that other work on the machine falls on all of them.`,
    "req/s is the median of the per-second response counts pooled over the rounds (q1–q3 beside it shows the wobble); p50 and p99 are over every response's latency; both are Hyndman–Fan type 7 quantiles (lib/stats). A run with any response of the wrong status (not 200, or not 304 for b) or any connection error is left out of the ratios.",
    "autocannon runs in the benchmark's process, the app and the bare server in their own, all on this machine: on few cores they share the CPU, so the ceilings are this machine's, not the framework's in general.",
  ];
}

export async function runLookupBenchmark(args: string[]): Promise<number> {
  let options: BenchmarkOptions;
  try {
    options = parseBenchmarkArgs(args);
  } catch (error) {
    if (!(error instanceof BenchmarkArgsError)) throw error;
    console.error(`${error.message}\n\n${USAGE}`);
    return 2;
  }
  if (options.help) {
    console.log(USAGE);
    return 0;
  }
  const root = process.cwd();
  const startedAt = new Date();
  const loadAtStart = os.loadavg();
  if (loadAtStart[0] > 0.5 * os.cpus().length) log(`the machine is busy (load average ${loadAtStart[0].toFixed(2)}): expect noisy figures`);
  const perSize = options.connections.length * RUN_ORDER.length * (options.warmup + options.duration);
  log(
    `lookup benchmark: sizes ${options.sizes.map((s) => s.toLocaleString("en")).join(", ")} submissions over ${options.boards.toLocaleString("en")} boards; ` +
      `load runs take ${perSize} s per size (${options.sizes.length * perSize} s), plus seeding, rebuild and a build if the sources changed`,
  );
  const lifecycle = new Lifecycle();
  try {
    const scratch = mkdtempSync(path.join(os.tmpdir(), "shuntbook-benchmark-"));
    lifecycle.onStop("the benchmark's scratch folder", () => rmSync(scratch, { recursive: true, force: true }));
    const cluster = describeCluster(scratch, await freePort());
    initCluster(cluster);
    startCluster(cluster, { durable: false });
    lifecycle.onStop("PostgreSQL", () => stopCluster(cluster));
    await secureCluster(cluster);
    // built with a database that has no tables: a page that wrongly read data at build time fails here
    buildIfNeeded(root, { ...process.env, NODE_ENV: "production", DATABASE_URL: cluster.url("postgres") });

    const sizes: SizeReport[] = [];
    const runs: RunFigures[] = [];
    for (const submissions of options.sizes) {
      const prepared = await prepareSize(root, cluster, options, submissions);
      sizes.push(prepared.report);
      runs.push(...(await measureSize(root, cluster.url(prepared.database), prepared, options, scratch, lifecycle)));
    }
    const report = {
      startedAt,
      totalMs: Date.now() - startedAt.getTime(),
      machine: await machineLine(cluster, root, loadAtStart),
      command: `npm run benchmark:lookup -- ${args.join(" ")}`.trim(),
      method: methodNotes(options),
      sizes,
      runs,
    };
    console.log(consoleSummary(report));
    if (options.docs) {
      writeReport(path.resolve(root, options.docs), report);
      log(`report written to ${options.docs}`);
    }
    return 0;
  } finally {
    await lifecycle.stop();
  }
}
