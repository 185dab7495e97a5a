import { z } from "zod";

// Command-line options of `npm run benchmark:lookup`. Parsed by hand into flag → text (so that a typo
// in a flag name is caught, not ignored), then checked by one zod schema that names the flag in
// every message.

/** The issue's upper bounds for the synthetic data set. */
export const MAX_BOARDS = 5_000;
export const MAX_SUBMISSIONS = 1_000_000;

export type BenchmarkOptions = {
  /** Board models in the synthetic catalogue (each with 1–3 revisions). */
  boards: number;
  /** Data-set sizes to measure the lookup at, in submissions; one database per size. */
  sizes: number[];
  /** autocannon connection counts; every target is driven at each. */
  connections: number[];
  /** Seconds each target is measured for, per size and connection count, in all. */
  duration: number;
  /** The measured seconds are split into this many rounds, run in turn over the targets. */
  rounds: number;
  /** Seconds of unrecorded load before each measured run. */
  warmup: number;
  /** Where the report goes, relative to the project; null: print only. */
  docs: string | null;
  /** Rebuild board_stats exactly as npm run stats:rebuild does, without the planner workaround. */
  stockRebuild: boolean;
  /** Accept-Encoding sent with (a), (b) and (c), as a browser would; null: none, as the issue's comparison wants. */
  acceptEncoding: string | null;
  help: boolean;
};

export const USAGE = `npm run benchmark:lookup -- [flags]

  --boards N            board models in the synthetic catalogue (1–${MAX_BOARDS}; default 500)
  --sizes A,B,...       data-set sizes in submissions, one seeded database each (1–${MAX_SUBMISSIONS.toLocaleString("en")};
                        default 10000,100000)
  --submissions N       shorthand for a single size
  --connections A,B     autocannon connection counts (default 8,64)
  --duration S          seconds each target is measured for (1–600; default 10)
  --rounds N            split them into N rounds that take the targets in turn, so that a burst
                        of other work on the machine hits every target alike (1–10; default 2)
  --warmup S            seconds of unrecorded load before each run (0–60; default 2)
  --docs PATH           write the report into this Markdown file (default docs/benchmarks.md)
  --no-docs             print the report only
  --stock-rebuild       rebuild board_stats exactly as npm run stats:rebuild does (by default nested
                        loops are switched off for it: see docs/benchmarks.md; stock, it is quadratic)
  --accept-encoding V   send Accept-Encoding: V with (a), (b) and (c), as a browser does, e.g.
                        "gzip, deflate, br" (default: none; the bare server (d) never compresses)
  --help                this text

The full run the issue asks for:  npm run benchmark:lookup -- --boards 5000 --sizes 10000,1000000`;

const FLAGS_WITH_VALUE = ["boards", "sizes", "submissions", "connections", "duration", "rounds", "warmup", "docs", "accept-encoding"] as const;
const SWITCHES = ["no-docs", "stock-rebuild", "help"] as const;

const whole = (flag: string, min: number, max: number) =>
  z.coerce
    .number<string>({ error: `--${flag} must be a whole number` })
    .int(`--${flag} must be a whole number`)
    .min(min, `--${flag} must be at least ${min.toLocaleString("en")}`)
    .max(max, `--${flag} must be at most ${max.toLocaleString("en")}`);

const list = (flag: string, min: number, max: number) =>
  z
    .string()
    .transform((text) => text.split(",").map((part) => part.trim()))
    .pipe(z.array(whole(flag, min, max)).min(1, `--${flag} needs at least one number`))
    .transform((values) => [...new Set(values)].sort((a, b) => a - b));

const Schema = z
  .object({
    boards: whole("boards", 1, MAX_BOARDS).default(500),
    sizes: list("sizes", 1, MAX_SUBMISSIONS).optional(),
    submissions: whole("submissions", 1, MAX_SUBMISSIONS).optional(),
    connections: list("connections", 1, 1_000).default([8, 64]),
    duration: whole("duration", 1, 600).default(10),
    rounds: whole("rounds", 1, 10).default(2),
    warmup: whole("warmup", 0, 60).default(2),
    docs: z.string().min(1, "--docs needs a file path").default("docs/benchmarks.md"),
    "no-docs": z.boolean().default(false),
    "stock-rebuild": z.boolean().default(false),
    "accept-encoding": z
      .string()
      .trim()
      .min(1, '--accept-encoding needs a value, e.g. "gzip, deflate, br"')
      .max(200, "--accept-encoding must be at most 200 characters")
      .optional(),
    help: z.boolean().default(false),
  })
  .refine((o) => !(o.sizes && o.submissions), { message: "give either --sizes or --submissions, not both", path: ["submissions"] })
  .refine((o) => o.duration >= o.rounds, { message: "--rounds cannot exceed --duration: each round lasts at least a second", path: ["rounds"] });

export class BenchmarkArgsError extends Error {
  constructor(readonly fieldErrors: Record<string, string[]>) {
    super(
      Object.entries(fieldErrors)
        .map(([flag, messages]) => `--${flag}: ${messages.join("; ")}`)
        .join("\n"),
    );
    this.name = "BenchmarkArgsError";
  }
}

function collect(args: string[]): Record<string, string | boolean> {
  const out: Record<string, string | boolean> = {};
  const errors: Record<string, string[]> = {};
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    const match = /^--([a-z-]+)(?:=(.*))?$/.exec(arg);
    if (!match) {
      (errors[arg] ??= []).push(`unexpected argument "${arg}"; flags start with --`);
      continue;
    }
    const [, name, inline] = match;
    if ((SWITCHES as readonly string[]).includes(name)) {
      out[name] = true;
    } else if ((FLAGS_WITH_VALUE as readonly string[]).includes(name)) {
      const value = inline ?? args[i + 1];
      if (value === undefined || (inline === undefined && value.startsWith("--"))) {
        (errors[name] ??= []).push(`--${name} needs a value`);
        continue;
      }
      if (inline === undefined) i++;
      out[name] = value;
    } else {
      (errors[name] ??= []).push(`unknown flag --${name}; see --help`);
      // its value, if it has one, is not a second mistake
      if (inline === undefined && args[i + 1] !== undefined && !args[i + 1].startsWith("--")) i++;
    }
  }
  if (Object.keys(errors).length) throw new BenchmarkArgsError(errors);
  return out;
}

/** Reads the benchmark's flags; throws BenchmarkArgsError naming each bad flag. */
export function parseBenchmarkArgs(args: string[]): BenchmarkOptions {
  const parsed = Schema.safeParse(collect(args));
  if (!parsed.success) {
    const errors: Record<string, string[]> = {};
    for (const issue of parsed.error.issues) (errors[String(issue.path[0] ?? "args")] ??= []).push(issue.message);
    throw new BenchmarkArgsError(errors);
  }
  const o = parsed.data;
  return {
    boards: o.boards,
    sizes: o.sizes ?? (o.submissions !== undefined ? [o.submissions] : [10_000, 100_000]),
    connections: o.connections,
    duration: o.duration,
    rounds: o.rounds,
    warmup: o.warmup,
    docs: o["no-docs"] ? null : o.docs,
    stockRebuild: o["stock-rebuild"],
    acceptEncoding: o["accept-encoding"] ?? null,
    help: o.help,
  };
}
