import { z } from "zod";

// Every environment variable Shuntbook reads is declared and checked here, once: the app, the
// launcher (lib/platform) and the test support all go through env(). A bad value stops the process
// with the variable named, instead of failing later somewhere less obvious.
const port = z.coerce.number().int().min(1).max(65535);
const postgresUrl = z.string().regex(/^postgres(ql)?:\/\/\S+$/, "must be a postgres:// connection URL");

const EnvSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  /** Use this PostgreSQL server instead of the embedded cluster. */
  DATABASE_URL: postgresUrl.optional(),
  /** Port of the embedded cluster that `npm start` runs on 127.0.0.1. */
  SHUNTBOOK_PG_PORT: port.default(54329),
  /** Folder for the embedded cluster and other local state, relative to the project. */
  SHUNTBOOK_DATA_DIR: z.string().min(1).default(".data"),
  /** Folder holding initdb and pg_ctl, when they are not in Debian's place. */
  SHUNTBOOK_PG_BIN: z.string().min(1).optional(),
  /** Port the web app listens on. */
  PORT: port.default(3000),
  /** Log every SQL statement (1) or not (0). */
  SHUNTBOOK_SQL_LOG: z.enum(["0", "1"]).default("0").transform((v) => v === "1"),
  /** Set by `npm test` for the test files: the throwaway cluster and the app under test. */
  SHUNTBOOK_TEST_PG_URL: postgresUrl.optional(),
  SHUNTBOOK_TEST_APP_URL: z.url().optional(),
  /** `0` makes npm test skip building and serving the app (quick local runs; browser tests then fail). */
  SHUNTBOOK_TEST_APP: z.enum(["0", "1"]).default("1"),
});

export type Env = z.infer<typeof EnvSchema>;

let cached: Env | undefined;

export function parseEnv(source: Record<string, string | undefined>): Env {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment configuration:\n${lines.join("\n")}`);
  }
  return parsed.data;
}

export function env(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}

/** For code (tests, the launcher) that changes process.env after the first read. */
export function resetEnvCache(): void {
  cached = undefined;
}

/** The database the app talks to: DATABASE_URL, or the embedded cluster's database. */
export function databaseUrl(e: Env = env()): string {
  return e.DATABASE_URL ?? `postgres://shuntbook@127.0.0.1:${e.SHUNTBOOK_PG_PORT}/shuntbook`;
}
