import { quantileType7 } from "@/lib/stats";

// The benchmark's arithmetic, kept free of I/O so that tests can check it: one run's figures
// from an autocannon result, the ratios between targets measured at the same size and connection
// count, and the verdict on each of the targets.

export const TARGETS = {
  lookup: { letter: "a", label: "values lookup", expectedStatus: 200 },
  revalidate: { letter: "b", label: "lookup with If-None-Match (304)", expectedStatus: 304 },
  framework: { letter: "c", label: "empty route handler (framework ceiling)", expectedStatus: 200 },
  machine: { letter: "d", label: "bare node:http, same JSON from memory (machine ceiling)", expectedStatus: 200 },
} as const;
export type TargetId = keyof typeof TARGETS;
/** The order runs happen in at each connection count: the ceilings bracket the lookup runs. */
export const RUN_ORDER: readonly TargetId[] = ["framework", "lookup", "revalidate", "machine"];

/** The targets. */
export const GOALS = {
  /** a/c: the lookup keeps at least this share of the framework's ceiling */
  lookupShare: 0.8,
  /** b/c: the 304 path keeps at least this share */
  revalidateShare: 0.9,
  /** p99 of (a) and (b) at P99_CONNECTIONS, in ms (strictly below) */
  p99Ms: 25,
  p99Connections: 8,
  /** "flat": req/s of (a) at the largest size is at least this share of that at the smallest (our reading) */
  flatShare: 0.8,
} as const;

export type RunFigures = {
  target: TargetId;
  /** submissions in the data set the app served */
  size: number;
  connections: number;
  /** median of the per-second response counts, pooled over the interleaved rounds */
  reqPerSec: number;
  /** first and third quartile of the same counts: how much the machine wobbled */
  reqPerSecQ1: number;
  reqPerSecQ3: number;
  p50Ms: number;
  p99Ms: number;
  requests: number;
  /** responses whose status was not the one this target should give */
  wrongStatus: number;
  /** connection errors and timeouts */
  errors: number;
};

/** Raw samples of one round of one target (drive.ts). */
export type Samples = {
  /** responses completed in each whole second */
  perSecond: number[];
  /** every response's latency, ms */
  latenciesMs: number[];
  statusCounts: Record<string, number>;
  errors: number;
};

const byNumber = (a: number, b: number) => a - b;
const tenth = (x: number) => Math.round(x * 10) / 10;

/**
 * Pools the rounds of one target at one size and connection count. Quantiles are the project's one
 * definition, Hyndman–Fan type 7 (lib/stats/quantile.ts), so the median of an even count is the
 * midpoint of the middle two.
 */
export function figuresOf(target: TargetId, size: number, connections: number, rounds: Samples[]): RunFigures {
  const perSecond = rounds.flatMap((r) => r.perSecond).sort(byNumber);
  const latencies = rounds.flatMap((r) => r.latenciesMs).sort(byNumber);
  const expected = String(TARGETS[target].expectedStatus);
  let answered = 0;
  let right = 0;
  for (const round of rounds) {
    for (const [code, count] of Object.entries(round.statusCounts)) {
      answered += count;
      if (code === expected) right += count;
    }
  }
  const q = (sorted: number[], p: number) => quantileType7(sorted, p) ?? 0;
  return {
    target,
    size,
    connections,
    reqPerSec: q(perSecond, 0.5),
    reqPerSecQ1: q(perSecond, 0.25),
    reqPerSecQ3: q(perSecond, 0.75),
    p50Ms: tenth(q(latencies, 0.5)),
    p99Ms: tenth(q(latencies, 0.99)),
    requests: latencies.length,
    wrongStatus: answered - right,
    // autocannon counts a timeout as an error too
    errors: rounds.reduce((sum, r) => sum + r.errors, 0),
  };
}

/** x / y, or null when either is missing or y is not positive (no ratio can be claimed). */
export function ratio(x: number | undefined, y: number | undefined): number | null {
  if (x === undefined || y === undefined || !Number.isFinite(x) || !Number.isFinite(y) || y <= 0) return null;
  return x / y;
}

export type Ratios = {
  size: number;
  connections: number;
  lookupOverFramework: number | null;
  revalidateOverFramework: number | null;
  lookupOverMachine: number | null;
};

/** A run counts only when every response had the status its target should give. */
export function isValid(run: RunFigures): boolean {
  return run.requests > 0 && run.wrongStatus === 0 && run.errors === 0;
}

function find(runs: RunFigures[], target: TargetId, size: number, connections: number): RunFigures | undefined {
  return runs.find((r) => r.target === target && r.size === size && r.connections === connections && isValid(r));
}

/** a/c, b/c and a/d for every size and connection count, each from runs of the same size, connections and app process. */
export function ratiosOf(runs: RunFigures[]): Ratios[] {
  const keys = [...new Map(runs.map((r) => [`${r.size}:${r.connections}`, { size: r.size, connections: r.connections }])).values()];
  return keys.map(({ size, connections }) => {
    const rps = (t: TargetId) => find(runs, t, size, connections)?.reqPerSec;
    return {
      size,
      connections,
      lookupOverFramework: ratio(rps("lookup"), rps("framework")),
      revalidateOverFramework: ratio(rps("revalidate"), rps("framework")),
      lookupOverMachine: ratio(rps("lookup"), rps("machine")),
    };
  });
}

/** The figure docs/benchmarks.md leads with: the lowest a/c over every size and connection count. */
export function headlineRatio(ratios: Ratios[]): number | null {
  const values = ratios.map((r) => r.lookupOverFramework).filter((v): v is number => v !== null);
  return values.length === ratios.length && values.length > 0 ? Math.min(...values) : null;
}

export function ratioLine(value: number | null): string {
  return `lookup/framework-ceiling ratio: ${value === null ? "not measured" : value.toFixed(2)}`;
}

export type Verdict = { goal: string; met: boolean | null; detail: string };

const fmt = (x: number | null, digits = 2) => (x === null ? "n/a" : x.toFixed(digits));

/** Not met as soon as one measured value falls short; unknown when the rest were not all measured. */
function atLeast(values: Array<number | null>, floor: number): boolean | null {
  if (values.some((v) => v !== null && v < floor)) return false;
  return values.length > 0 && values.every((v) => v !== null) ? true : null;
}

function shareVerdict(goal: string, ratios: Ratios[], pick: (r: Ratios) => number | null, floor: number): Verdict {
  const values = ratios.map(pick);
  const detail = ratios.map((r, i) => `${r.size.toLocaleString("en")} subs @${r.connections}: ${fmt(values[i])}`).join("; ");
  return { goal, met: atLeast(values, floor), detail: detail || "not measured" };
}

export function verdicts(runs: RunFigures[]): Verdict[] {
  const ratios = ratiosOf(runs);
  const out: Verdict[] = [
    shareVerdict(`a/c ≥ ${GOALS.lookupShare}`, ratios, (r) => r.lookupOverFramework, GOALS.lookupShare),
    shareVerdict(`b/c ≥ ${GOALS.revalidateShare}`, ratios, (r) => r.revalidateOverFramework, GOALS.revalidateShare),
  ];

  const p99Runs = runs.filter((r) => (r.target === "lookup" || r.target === "revalidate") && r.connections === GOALS.p99Connections);
  out.push({
    goal: `p99 of (a) and (b) < ${GOALS.p99Ms} ms at ${GOALS.p99Connections} connections`,
    met: p99Runs.some((r) => isValid(r) && r.p99Ms >= GOALS.p99Ms) ? false : p99Runs.length > 0 && p99Runs.every(isValid) ? true : null,
    detail: p99Runs.length ? p99Runs.map((r) => `${TARGETS[r.target].letter} ${r.size.toLocaleString("en")} subs: ${r.p99Ms} ms`).join("; ") : "not measured",
  });

  const sizes = [...new Set(runs.map((r) => r.size))].sort((x, y) => x - y);
  const connections = [...new Set(runs.map((r) => r.connections))].sort((x, y) => x - y);
  if (sizes.length < 2) {
    out.push({ goal: "lookup cost flat across sizes", met: null, detail: "needs at least two sizes (--sizes)" });
  } else {
    const [small, large] = [sizes[0], sizes[sizes.length - 1]];
    const shares = connections.map((c) => ({ c, share: ratio(find(runs, "lookup", large, c)?.reqPerSec, find(runs, "lookup", small, c)?.reqPerSec) }));
    out.push({
      goal: `lookup flat: req/s at ${large.toLocaleString("en")} ≥ ${GOALS.flatShare} × req/s at ${small.toLocaleString("en")} submissions`,
      met: atLeast(
        shares.map((s) => s.share),
        GOALS.flatShare,
      ),
      detail: shares.map((s) => `@${s.c}: ${fmt(s.share)}`).join("; "),
    });
  }
  return out;
}
