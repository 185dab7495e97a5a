import { MailMessageSchema, sendMail } from "@/lib/mail/send";

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
};

function job<T>(def: { parse: (data: unknown) => T; run: (data: T) => Promise<void> } & Omit<JobDefinition, "parse" | "run">): JobDefinition {
  return def as unknown as JobDefinition;
}

export const JOBS = {
  /** One mail: { to, subject, text, html? }. Retried for about an hour of relay trouble (30 s · 2^n, 7 tries). */
  "mail.send": job({
    parse: (data) => MailMessageSchema.parse(data),
    run: (message) => sendMail(message),
    retryLimit: 7,
    retryDelay: 30,
    retryBackoff: true,
    expireInSeconds: 120,
  }),
} as const satisfies Record<string, JobDefinition>;

export type JobName = keyof typeof JOBS;

export function isJobName(name: string): name is JobName {
  return Object.hasOwn(JOBS, name);
}
