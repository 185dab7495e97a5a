import { describe, expect, it } from "vitest";
import { BenchmarkArgsError, parseBenchmarkArgs } from "@/tests/benchmarks/options";

// The benchmark's flags (tests/benchmarks/options.ts). The bounds are the issue's: up to 5 000 boards and
// 1 000 000 submissions.

function errorsOf(args: string[]): Record<string, string[]> {
  try {
    parseBenchmarkArgs(args);
  } catch (error) {
    if (error instanceof BenchmarkArgsError) return error.fieldErrors;
    throw error;
  }
  throw new Error("expected a BenchmarkArgsError");
}

describe("benchmark:lookup flags", () => {
  it("has defaults that finish in a few minutes and still measure two sizes", () => {
    expect(parseBenchmarkArgs([])).toEqual({
      boards: 500,
      sizes: [10_000, 100_000],
      connections: [8, 64],
      duration: 10,
      rounds: 2,
      warmup: 2,
      docs: "docs/benchmarks.md",
      stockRebuild: false,
      acceptEncoding: null,
      help: false,
    });
  });

  it("sends Accept-Encoding only when asked to, and refuses an empty one", () => {
    expect(parseBenchmarkArgs(["--accept-encoding", "gzip, deflate, br"]).acceptEncoding).toBe("gzip, deflate, br");
    expect(parseBenchmarkArgs(["--accept-encoding=br"]).acceptEncoding).toBe("br");
    expect(errorsOf(["--accept-encoding", " "])["accept-encoding"]).toHaveLength(1);
  });

  it("reads the issue's full run, in either flag spelling", () => {
    const o = parseBenchmarkArgs(["--boards", "5000", "--sizes=1000000,10000"]);
    expect(o.boards).toBe(5000);
    expect(o.sizes).toEqual([10_000, 1_000_000]); // sorted: the smallest size is the baseline
    expect(parseBenchmarkArgs(["--submissions", "250000"]).sizes).toEqual([250_000]);
    expect(parseBenchmarkArgs(["--connections", "8,8,64"]).connections).toEqual([8, 64]);
    expect(parseBenchmarkArgs(["--no-docs"]).docs).toBeNull();
  });

  it("names the flag in every error", () => {
    expect(errorsOf(["--boards", "5001"])).toEqual({ boards: ["--boards must be at most 5,000"] });
    expect(errorsOf(["--sizes", "10000,2000000"])).toEqual({ sizes: ["--sizes must be at most 1,000,000"] });
    expect(errorsOf(["--duration", "ten"]).duration).toEqual(["--duration must be a whole number"]);
    expect(errorsOf(["--warmup", "1.5"]).warmup).toEqual(["--warmup must be a whole number"]);
    expect(errorsOf(["--boards"])).toEqual({ boards: ["--boards needs a value"] });
    expect(errorsOf(["--bords", "5"])).toEqual({ bords: ["unknown flag --bords; see --help"] });
    expect(errorsOf(["--sizes", "10", "--submissions", "10"])).toEqual({ submissions: ["give either --sizes or --submissions, not both"] });
    expect(errorsOf(["--duration", "3", "--rounds", "4"]).rounds).toEqual(["--rounds cannot exceed --duration: each round lasts at least a second"]);
  });
});
