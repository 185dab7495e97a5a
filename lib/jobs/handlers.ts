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

export const JOBS = {
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

export type JobName = keyof typeof JOBS;

export function isJobName(name: string): name is JobName {
  return Object.hasOwn(JOBS, name);
}
