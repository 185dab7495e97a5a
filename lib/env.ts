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
  /**
   * `1` lets the embedded cluster's superuser make replication connections from 127.0.0.1 (for a
   * standby or pg_basebackup); `0`, the default, leaves pg_hba.conf without a replication entry.
   */
  SHUNTBOOK_PG_REPLICATION: z
    .enum(["0", "1"])
    .default("0")
    .transform((v) => v === "1"),
  /** Folder holding initdb and pg_ctl, when they are not in Debian's place. */
  SHUNTBOOK_PG_BIN: z.string().min(1).optional(),
  /** Port the web app listens on. */
  PORT: port.default(3000),
  /** Build folder of the app (next.config.mjs reads it too). */
  SHUNTBOOK_NEXT_DIST_DIR: z
    .string()
    .regex(/^\.next[\w-]*$/, "must be .next or start with .next")
    .default(".next"),
  /** Log every SQL statement (1) or not (0). */
  SHUNTBOOK_SQL_LOG: z
    .enum(["0", "1"])
    .default("0")
    .transform((v) => v === "1"),
  /** Outgoing mail. Unset: `npm start` and `npm test` run a local SMTP catcher (maildev) and set it. */
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\/\S+$/, "must be an smtp:// or smtps:// URL")
    .optional(),
  /** Web inbox of the local SMTP catcher, shown in the README and used by browser tests. */
  MAIL_INBOX_URL: z.url().optional(),
  MAIL_FROM: z.string().min(3).default("Shuntbook <no-reply@shuntbook.test>"),
  /** Ports of the local SMTP catcher that the launcher starts when SMTP_URL is unset. */
  SHUNTBOOK_MAIL_SMTP_PORT: port.default(1025),
  SHUNTBOOK_MAIL_WEB_PORT: port.default(1080),
  /** S3-compatible store for evidence photos. Unset: the launcher runs a local fake (s3rver) and sets it. */
  S3_ENDPOINT: z.url().optional(),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z
    .string()
    .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, "must be a valid bucket name")
    .default("shuntbook-evidence"),
  // The launcher sets both to the key pair its private S3 fake accepts (lib/platform/fakes.ts);
  // a real store gets its own through the environment. The defaults open nothing.
  S3_ACCESS_KEY_ID: z.string().min(1).default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default("S3RVER"),
  SHUNTBOOK_S3_PORT: port.default(4569),
  /**
   * Public base URL of the app, for the links in mails (magic link, password reset) and for
   * next-auth's callbacks. `npm start` / `npm test` set it to the address they serve on.
   */
  NEXTAUTH_URL: z.url().optional(),
  /**
   * Key that next-auth derives the session JWT's encryption key from. `npm start` generates one
   * once and keeps it in <SHUNTBOOK_DATA_DIR>/nextauth-secret; `npm test` makes a random one per run.
   */
  NEXTAUTH_SECRET: z.string().min(32, "must be at least 32 characters (e.g. openssl rand -base64 32)").optional(),
  /**
   * Approved submissions (with no rejection) after which a contributor's new submissions are
   * approved without waiting for a moderator, unless they raise a flag (lib/moderation/trust.ts).
   */
  MODERATION_TRUST_THRESHOLD: z.coerce.number().int().min(1).max(1000).default(5),
  /** `0` keeps the job worker (lib/jobs) out of the app process, e.g. on web-only instances. */
  SHUNTBOOK_JOB_WORKER: z.enum(["0", "1"]).default("1"),
  /**
   * How many reverse proxies in front of the app append to X-Forwarded-For (0: none, the app is
   * reached directly). The client address is read that many entries from the right
   * (lib/auth/client-address.ts); forwarded host headers are believed only when this is above 0.
   */
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
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

/**
 * The database the app talks to: DATABASE_URL. The launcher always sets it (for the embedded
 * cluster: the app's role with its password, lib/platform/postgres-cluster.ts); the fallback
 * names the embedded cluster's database for code run without the launcher.
 */
export function databaseUrl(e: Env = env()): string {
  return e.DATABASE_URL ?? `postgres://shuntbook@127.0.0.1:${e.SHUNTBOOK_PG_PORT}/shuntbook`;
}
