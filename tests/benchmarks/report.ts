import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { TARGETS, headlineRatio, ratioLine, ratiosOf, verdicts, type RunFigures, type Verdict } from "./figures";
import type { LookupPlans } from "./query-plans";
import type { SeedCounts } from "./synthetic-data";

// The benchmark's report, twice: as text on the console while it runs, and as a Markdown section
// of docs/benchmarks.md. Only the part between the two markers is rewritten, so the prose around
// it (method, findings) is kept from run to run.

export const START_MARKER = "<!-- benchmark:lookup results: written by `npm run benchmark:lookup`, edits inside are lost -->";
export const END_MARKER = "<!-- benchmark:lookup results end -->";

export type SizeReport = {
  submissions: number;
  counts: SeedCounts;
  statsRows: number;
  seedMs: number;
  rebuildMs: number;
  /** how the rebuild was run: as npm run stats:rebuild does, or with the planner workaround */
  rebuildMode: string;
  plans: LookupPlans[];
};

export type BenchmarkReport = {
  startedAt: Date;
  totalMs: number;
  machine: string;
  command: string;
  method: string[];
  sizes: SizeReport[];
  runs: RunFigures[];
};

const n = (x: number) => x.toLocaleString("en");
const ms = (x: number) => (x >= 10_000 ? `${(x / 1000).toFixed(0)} s` : x >= 1000 ? `${(x / 1000).toFixed(1)} s` : `${Math.round(x)} ms`);
const r2 = (x: number | null) => (x === null ? "n/a" : x.toFixed(2));
const mark = (v: Verdict) => (v.met === null ? "NOT MEASURED" : v.met ? "MET" : "NOT MET");

function table(header: string[], rows: string[][]): string[] {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) => cells.map((c, i) => (i < 2 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join("  ");
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)];
}

function runRow(r: RunFigures): string[] {
  return [
    `${TARGETS[r.target].letter} ${r.target}`,
    n(r.size),
    String(r.connections),
    n(Math.round(r.reqPerSec)),
    `${n(Math.round(r.reqPerSecQ1))}–${n(Math.round(r.reqPerSecQ3))}`,
    String(r.p50Ms),
    String(r.p99Ms),
    n(r.requests),
    r.wrongStatus ? `${n(r.wrongStatus)} WRONG STATUS` : "ok",
  ];
}
const RUN_HEADER = ["target", "submissions", "conns", "req/s", "q1–q3", "p50 ms", "p99 ms", "requests", "status"];

/** One line per run, printed as soon as it finishes. */
export function runLine(r: RunFigures): string {
  const status = r.wrongStatus ? `, ${n(r.wrongStatus)} responses with the wrong status` : "";
  const errors = r.errors ? `, ${n(r.errors)} errors` : "";
  return `(${TARGETS[r.target].letter}) ${TARGETS[r.target].label} @${r.connections}: ${n(Math.round(r.reqPerSec))} req/s (q1–q3 ${n(Math.round(r.reqPerSecQ1))}–${n(Math.round(r.reqPerSecQ3))}), p50 ${r.p50Ms} ms, p99 ${r.p99Ms} ms${status}${errors}`;
}

export function consoleSummary(report: BenchmarkReport): string {
  const ratios = ratiosOf(report.runs);
  const lines = [
    "",
    "== lookup benchmark ==",
    ...table(RUN_HEADER, report.runs.map(runRow)),
    "",
    ...table(
      ["submissions", "conns", "a/c", "b/c", "a/d"],
      ratios.map((r) => [n(r.size), String(r.connections), r2(r.lookupOverFramework), r2(r.revalidateOverFramework), r2(r.lookupOverMachine)]),
    ),
    "",
    ratioLine(headlineRatio(ratios)) + "  (the lowest a/c measured)",
    "",
    "targets:",
    ...verdicts(report.runs).map((v) => `  ${mark(v).padEnd(12)} ${v.goal}   [${v.detail}]`),
  ];
  return lines.join("\n");
}

function mdTable(header: string[], rows: string[][]): string[] {
  return [`| ${header.join(" | ")} |`, `|${header.map(() => "---").join("|")}|`, ...rows.map((r) => `| ${r.join(" | ")} |`)];
}

export function markdownSection(report: BenchmarkReport): string {
  const ratios = ratiosOf(report.runs);
  const out = [
    START_MARKER,
    "",
    `## Latest run`,
    "",
    `${report.startedAt.toISOString().slice(0, 16).replace("T", " ")} UTC, ${ms(report.totalMs)} in all. ${report.machine}`,
    "",
    "```",
    report.command,
    "```",
    "",
    ...report.method.map((m) => `- ${m}`),
    "",
    ratioLine(headlineRatio(ratios)),
    "",
    "(the lowest a/c over every size and connection count below)",
    "",
    "### Targets",
    "",
    ...verdicts(report.runs).map((v) => `- **${mark(v)}** ${v.goal}: ${v.detail}`),
    "",
    "### Data sets",
    "",
    ...mdTable(
      ["submissions", "boards", "revisions", "contributors", "board_stats rows", "seed (incl. VACUUM ANALYZE)", "rebuild (refreshGroups)"],
      report.sizes.map((s) => [
        n(s.counts.submissions),
        n(s.counts.boards),
        n(s.counts.revisions),
        n(s.counts.users),
        n(s.statsRows),
        ms(s.seedMs),
        `${ms(s.rebuildMs)} (${s.rebuildMode})`,
      ]),
    ),
    "",
    "### Runs",
    "",
    ...mdTable(RUN_HEADER, report.runs.map(runRow)),
    "",
    "### Ratios (same size, same connection count, same app process)",
    "",
    ...mdTable(
      ["submissions", "conns", "a/c", "b/c", "a/d"],
      ratios.map((r) => [n(r.size), String(r.connections), r2(r.lookupOverFramework), r2(r.revalidateOverFramework), r2(r.lookupOverMachine)]),
    ),
    "",
    "### Plans of the lookup's queries (a cache miss)",
    "",
    "EXPLAIN (ANALYZE, BUFFERS) of each statement lib/published/board-values-load.ts runs for one board, recorded from",
    "the lookup's own functions, run once before (so the buffer cache is warm, as under traffic).",
  ];
  for (const size of report.sizes) {
    for (const board of size.plans) {
      const total = board.queries.reduce((sum, q) => sum + (q.executionMs ?? 0), 0);
      out.push(
        "",
        `#### ${n(size.submissions)} submissions: ${board.slug} (${board.why}, ${n(board.approvedSubmissions)} approved), ${total.toFixed(2)} ms of execution in all`,
      );
      for (const q of board.queries) {
        out.push("", "```sql", q.sql, "```", "", "```text", q.plan, "```");
      }
    }
  }
  out.push("", END_MARKER);
  return out.join("\n");
}

const NEW_FILE_HEAD = `# Benchmarks\n\n`;

/** Rewrites the results section of `file` (creating the file if needed), keeping everything outside the markers. */
export function writeReport(file: string, report: BenchmarkReport): void {
  const section = markdownSection(report);
  const current = existsSync(file) ? readFileSync(file, "utf8") : NEW_FILE_HEAD;
  const start = current.indexOf(START_MARKER);
  const end = current.indexOf(END_MARKER);
  const next =
    start >= 0 && end > start ? current.slice(0, start) + section + current.slice(end + END_MARKER.length) : `${current.replace(/\s*$/, "\n\n")}${section}\n`;
  mkdirSync(path.dirname(file), { recursive: true });
  writeFileSync(file, next);
}
