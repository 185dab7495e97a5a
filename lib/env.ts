import { z } from "zod";

// Every environment variable the app reads is declared and checked here, once. The launcher
// (lib/platform) fills in DATABASE_URL for the embedded cluster, so the app itself never guesses.
const EnvSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, "must be a postgres:// connection URL")
    .default("postgres://shuntbook@127.0.0.1:54329/shuntbook"),
  PGPORT_EMBEDDED: z.coerce.number().int().min(1024).max(65535).default(54329),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  SHUNTBOOK_DATA_DIR: z.string().min(1).default(".data"),
  SHUNTBOOK_SQL_LOG: z
    .enum(["0", "1"])
    .default("0")
    .transform((v) => v === "1"),
});

export type Env = z.infer<typeof EnvSchema>;

let cached: Env | undefined;

/** Parses process.env once; a bad value stops the process with the variable named. */
export function env(): Env {
  if (cached) return cached;
  const parsed = EnvSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment configuration:\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}

/** For tests that change process.env between cases. */
export function resetEnvCache(): void {
  cached = undefined;
}
