import { recipientDelaySeconds } from "@/lib/mail/recipient-throttle";
import { MailMessageSchema, sendMail } from "@/lib/mail/send";
import { SMTP_CONNECTIONS } from "@/lib/mail/transport";

// Every kind of job the queue knows: its name, how its data is checked, what it does, and how
// it is retried. A name that is not here cannot be enqueued (it would sit in the queue forever).
// A handler that throws fails the job, and pg-boss runs it again after the delay, with backoff,
// until retryLimit is used up; the job then stays in pgboss.job / pgboss.archive as 'failed'.

export type JobDefinition = {
  /** Parses the job's data; a job whose data no longer parses fails without retry value, so it is checked at enqueue time too. */
  parse: (data: unknown) => unknown;
  run: (data: never) => Promise<void>;
  retryLimit: number;
  /** Seconds before the first retry; doubled each time with retryBackoff. */
  retryDelay: number;
  retryBackoff: boolean;
  /** How long one attempt may run before pg-boss counts it as failed. */
  expireInSeconds: number;
  /** How the worker drains the queue: see DrainSettings. */
  drain: DrainSettings;
  /**
   * Seconds to hold a job back before running it (0: run now); the worker puts a held-back job
   * back on the queue for later, with its priority, instead of running or failing it.
   */
  holdBack?: (data: never) => Promise<number>;
};

/**
 * Each of `workers` pollers takes up to `batchSize` due jobs at a time (highest priority first,
 * then oldest), runs `concurrency` of them at once, and polls again straight away while jobs are
 * waiting, else after `pollingIntervalSeconds`. So a backlog drains at up to
 * workers × batchSize jobs per round, a round lasting the polling interval or the batch's run time.
 */
type DrainSettings = { workers: number; batchSize: number; concurrency: number; pollingIntervalSeconds: number };

function job<T>(
  def: { parse: (data: unknown) => T; run: (data: T) => Promise<void>; holdBack?: (data: T) => Promise<number> } & Omit<
    JobDefinition,
    "parse" | "run" | "holdBack"
  >,
): JobDefinition {
  return def as unknown as JobDefinition;
}

const JOBS = {
  /**
   * One mail: { to, subject, text, html? }. Retried for about an hour of relay trouble (30 s · 2^n,
   * 7 tries). Drained 2 × 25 at a time over SMTP_CONNECTIONS pooled connections: a backlog of
   * 3,600 mails takes about 72 rounds, a minute or two against a local relay (one mail every 2 s
   * before: two hours). Sign-in and reset mails are enqueued with JOB_PRIORITY.urgent and so
   * are taken first; one address gets at most RECIPIENT_THROTTLE mails a minute, the rest held back.
   */
  "mail.send": job({
    parse: (data) => MailMessageSchema.parse(data),
    run: (message) => sendMail(message),
    holdBack: (message) => recipientDelaySeconds(message.to),
    retryLimit: 7,
    retryDelay: 30,
    retryBackoff: true,
    expireInSeconds: 120,
    drain: { workers: 2, batchSize: 25, concurrency: SMTP_CONNECTIONS, pollingIntervalSeconds: 1 },
  }),
} as const satisfies Record<string, JobDefinition>;

type JobName = keyof typeof JOBS;

function isJobName(name: string): name is JobName {
  return Object.hasOwn(JOBS, name);
}

// A concept's own jobs. A job that needs a concept which itself enqueues through lib/jobs (the
// sign-up and reset requests of lib/auth) cannot sit in JOBS without an import cycle, so the
// concept defines it here when its module loads; enqueue() and the worker then treat it as one of
// JOBS. The worker imports the defining modules, so every process that works jobs knows them.
const defined = new Map<string, JobDefinition>();

/** A concept's job unless it says otherwise: someone is usually waiting for it (a sign-up, a reset), so poll every second, a few at once. */
const CONCEPT_JOB_DRAIN: DrainSettings = { workers: 1, batchSize: 10, concurrency: 5, pollingIntervalSeconds: 1 };

/** Adds a concept's job and returns its name (for enqueue). A reload of the concept's module replaces it. */
export function defineJob<T>(
  name: string,
  def: { parse: (data: unknown) => T; run: (data: T) => Promise<void>; drain?: DrainSettings } & Omit<JobDefinition, "parse" | "run" | "drain" | "holdBack">,
): string {
  if (isJobName(name)) throw new Error(`job '${name}' is already in JOBS`);
  defined.set(name, job({ ...def, drain: def.drain ?? CONCEPT_JOB_DRAIN }));
  return name;
}

/** The definition of a job in JOBS or defined by a concept, or undefined. */
export function jobDefinition(name: string): JobDefinition | undefined {
  return isJobName(name) ? JOBS[name] : defined.get(name);
}

/** Every job name the queue knows in this process: JOBS, then the concepts' own. */
export function jobNames(): string[] {
  return [...Object.keys(JOBS), ...defined.keys()];
}
