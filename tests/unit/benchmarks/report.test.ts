import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { END_MARKER, START_MARKER, writeReport, type BenchmarkReport } from "@/tests/benchmarks/report";

// docs/benchmarks.md is half prose, half figures: a run must replace the figures and keep the prose.

const report: BenchmarkReport = {
  startedAt: new Date("2026-12-02T10:00:00Z"),
  totalMs: 200_000,
  machine: "2 × test CPU",
  command: "npm run benchmark:lookup --",
  method: ["a note"],
  sizes: [],
  runs: [
    {
      target: "framework",
      size: 10,
      connections: 8,
      reqPerSec: 600,
      reqPerSecQ1: 590,
      reqPerSecQ3: 610,
      p50Ms: 10,
      p99Ms: 20,
      requests: 6000,
      wrongStatus: 0,
      errors: 0,
    },
    {
      target: "lookup",
      size: 10,
      connections: 8,
      reqPerSec: 510,
      reqPerSecQ1: 500,
      reqPerSecQ3: 520,
      p50Ms: 11,
      p99Ms: 22,
      requests: 5100,
      wrongStatus: 0,
      errors: 0,
    },
  ],
};

const folders: string[] = [];
function scratchFile(): string {
  const folder = mkdtempSync(path.join(os.tmpdir(), "benchmark-report-"));
  folders.push(folder);
  return path.join(folder, "benchmarks.md");
}

describe("docs/benchmarks.md writer", () => {
  afterAll(() => folders.forEach((f) => rmSync(f, { recursive: true, force: true })));

  it("rewrites only the part between its markers", () => {
    const file = scratchFile();
    writeFileSync(file, `# Benchmarks\n\nprose before\n\n${START_MARKER}\nold figures\n${END_MARKER}\n\nprose after\n`);
    writeReport(file, report);
    const text = readFileSync(file, "utf8");
    expect(text).toContain("prose before");
    expect(text).toContain("prose after");
    expect(text).not.toContain("old figures");
    expect(text).toMatch(/^lookup\/framework-ceiling ratio: 0\.85$/m); // 510 / 600
    writeReport(file, report);
    expect(readFileSync(file, "utf8")).toBe(text);
  });

  it("appends the section to a file without markers", () => {
    const file = scratchFile();
    writeFileSync(file, "# Benchmarks\n\nnotes\n");
    writeReport(file, report);
    const text = readFileSync(file, "utf8");
    expect(text.startsWith("# Benchmarks\n\nnotes\n\n" + START_MARKER)).toBe(true);
    expect(text.trimEnd().endsWith(END_MARKER)).toBe(true);
  });
});
