import { describe, expect, it } from "vitest";
import { figuresOf, headlineRatio, ratio, ratioLine, ratiosOf, verdicts, type RunFigures, type Samples, type TargetId } from "@/tests/benchmarks/figures";

// The benchmark's arithmetic. Expected values are worked by hand from the inputs written here;
// the targets are the (a/c ≥ 0.8, b/c ≥ 0.9, p99 < 25 ms at 8 connections, flat lookup).

function samples(perSecond: number[], latenciesMs: number[], statusCounts: Record<string, number>): Samples {
  return { perSecond, latenciesMs, statusCounts, errors: 0 };
}

function run(target: TargetId, size: number, connections: number, reqPerSec: number, p99Ms = 10): RunFigures {
  return { target, size, connections, reqPerSec, reqPerSecQ1: reqPerSec, reqPerSecQ3: reqPerSec, p50Ms: 2, p99Ms, requests: 1000, wrongStatus: 0, errors: 0 };
}

describe("one target's figures, pooled over its rounds", () => {
  // two rounds of 3 s and 2 s: per-second counts 5, 7, 6 | 10, 4 → sorted 4 5 6 7 10
  const rounds = [samples([5, 7, 6], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], { 200: 10 }), samples([10, 4], [20, 30], { 200: 1, 304: 1 })];

  it("takes the median and quartiles of the per-second counts (type 7)", () => {
    const f = figuresOf("lookup", 10, 8, rounds);
    expect(f.reqPerSec).toBe(6); // middle of 4 5 6 7 10
    expect(f.reqPerSecQ1).toBe(5); // h = 0.25 · 4 = 1 → 5
    expect(f.reqPerSecQ3).toBe(7); // h = 3 → 7
  });

  it("takes p50 and p99 over every response of every round (type 7)", () => {
    // latencies 1..10, 20, 30 (n = 12): p50 at h = 5.5 → 6.5; p99 at h = 10.89 → 20 + 0.89 · 10 = 28.9
    const f = figuresOf("lookup", 10, 8, rounds);
    expect(f.p50Ms).toBe(6.5);
    expect(f.p99Ms).toBe(28.9);
    expect(f.requests).toBe(12);
  });

  it("counts responses whose status is not the target's", () => {
    expect(figuresOf("lookup", 10, 8, rounds).wrongStatus).toBe(1); // the 304
    expect(figuresOf("revalidate", 10, 8, rounds).wrongStatus).toBe(11); // every 200
    expect(figuresOf("lookup", 10, 8, [samples([1], [1], { 200: 4000, 500: 7 })]).wrongStatus).toBe(7);
  });
});

describe("ratios", () => {
  it("refuses a ratio without a positive denominator", () => {
    expect(ratio(400, 500)).toBe(0.8);
    expect(ratio(400, 0)).toBeNull();
    expect(ratio(undefined, 500)).toBeNull();
  });

  const runs = [
    run("framework", 10_000, 8, 600),
    run("lookup", 10_000, 8, 540),
    run("revalidate", 10_000, 8, 570),
    run("machine", 10_000, 8, 18_000),
    run("framework", 10_000, 64, 650),
    run("lookup", 10_000, 64, 455),
    run("revalidate", 10_000, 64, 650),
    run("machine", 10_000, 64, 17_000),
    run("framework", 1_000_000, 8, 600),
    run("lookup", 1_000_000, 8, 420, 30),
    run("revalidate", 1_000_000, 8, 560),
    run("machine", 1_000_000, 8, 18_000),
  ];

  it("divides runs of the same size and connection count only", () => {
    const r = ratiosOf(runs);
    expect(r).toHaveLength(3);
    expect(r[0]).toEqual({ size: 10_000, connections: 8, lookupOverFramework: 0.9, revalidateOverFramework: 0.95, lookupOverMachine: 0.03 });
    expect(r[1].lookupOverFramework).toBeCloseTo(0.7, 12); // 455 / 650
    expect(r[2].lookupOverFramework).toBeCloseTo(0.7, 12); // 420 / 600
  });

  it("leads with the lowest a/c, written the way docs/benchmarks.md must hold it", () => {
    expect(ratioLine(headlineRatio(ratiosOf(runs)))).toBe("lookup/framework-ceiling ratio: 0.70");
    expect(ratioLine(0.8049)).toMatch(/^lookup\/framework-ceiling ratio: 0\.\d\d$/);
  });

  it("does not count a run that got wrong statuses", () => {
    const bad = runs.map((r) => (r.target === "revalidate" && r.connections === 8 && r.size === 10_000 ? { ...r, wrongStatus: 3 } : r));
    expect(ratiosOf(bad)[0].revalidateOverFramework).toBeNull();
  });

  it("judges each target", () => {
    const v = verdicts(runs);
    expect(v.map((x) => x.met)).toEqual([
      false, // a/c is 0.70 at 64 connections and at 1 M
      true, // b/c: 0.95, 1.00, 0.93
      false, // p99 of (a) at 1 M and 8 connections is 30 ms
      false, // 420 / 540 = 0.78 < 0.8 at 8 connections (and 64 has no 1 M run: see below)
    ]);
    expect(v[3].detail).toContain("@8: 0.78");
    // a connection count measured at one size only cannot show flatness
    expect(v[3].detail).toContain("@64: n/a");
  });
});
