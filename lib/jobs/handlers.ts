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

const JOBS = {
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

type JobName = keyof typeof JOBS;

function isJobName(name: string): name is JobName {
  return Object.hasOwn(JOBS, name);
}

// A concept's own jobs. A job that needs a concept which itself enqueues through lib/jobs (the
// sign-up and reset requests of lib/auth) cannot sit in JOBS without an import cycle, so the
// concept defines it here when its module loads; enqueue() and the worker then treat it as one of
// JOBS. The worker imports the defining modules, so every process that works jobs knows them.
const defined = new Map<string, JobDefinition>();

/** Adds a concept's job and returns its name (for enqueue). A reload of the concept's module replaces it. */
export function defineJob<T>(
  name: string,
  def: { parse: (data: unknown) => T; run: (data: T) => Promise<void> } & Omit<JobDefinition, "parse" | "run">,
): string {
  if (isJobName(name)) throw new Error(`job '${name}' is already in JOBS`);
  defined.set(name, job(def));
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
