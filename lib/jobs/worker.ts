import type PgBoss from "pg-boss";
import { AUTH_JOBS } from "@/lib/auth/jobs";
import { registerModerationJobs } from "@/lib/moderation/jobs";
import { registerSubmissionJobs } from "@/lib/submissions/jobs";
import { bossWithQueue } from "./boss";
import { jobDefinition, jobNames } from "./handlers";

// The job worker. In the app it runs inside the Next.js server process (instrumentation.ts starts
// it once per process); several app instances may each run one, since pg-boss hands every job to
// exactly one fetcher (SELECT … FOR UPDATE SKIP LOCKED). Tests call drainJobsOnce() instead.

// Every job this process works: lib/auth's sign-up and reset requests (defined by their modules,
// see defineJob) first, since they enqueue mails, so one drainJobsOnce() also sends those mails.
const workedHere = () => [...new Set([...AUTH_JOBS, ...jobNames()])];

async function runOne(name: string, data: unknown): Promise<void> {
  const def = jobDefinition(name)!;
  await def.run(def.parse(data) as never);
}

/** Starts polling every job's queue (every 2 s). Safe to call twice: the second call does nothing. */
export async function startJobWorker(): Promise<void> {
  const g = globalThis as unknown as { shuntbookWorker?: Promise<void> };
  g.shuntbookWorker ??= (async () => {
    let queue: PgBoss | undefined;
    for (const name of workedHere()) {
      queue = await bossWithQueue(name);
      // a throw fails the job; pg-boss then retries it per the queue's policy
      await queue.work(name, { pollingIntervalSeconds: 2, batchSize: 1 }, async ([job]) => runOne(name, job.data));
    }
    // scheduled jobs with their own queue policies: the moderators' daily digest, the hourly key purge
    await registerModerationJobs(queue!);
    await registerSubmissionJobs(queue!);
    console.log(`[jobs] worker polling ${workedHere().join(", ")}, the moderation digest and the idempotency-key purge`);
  })();
  try {
    await g.shuntbookWorker;
  } catch (error) {
    g.shuntbookWorker = undefined; // so that a later call tries again
    throw error;
  }
}

export type DrainResult = { completed: number; failed: number; errors: string[] };

/**
 * Fetches every job that is due right now, runs each once, and marks it completed or failed
 * (failed jobs with retries left come back after their delay). For tests and one-off scripts.
 */
export async function drainJobsOnce(): Promise<DrainResult> {
  const result: DrainResult = { completed: 0, failed: 0, errors: [] };
  for (const name of workedHere()) {
    const queue = await bossWithQueue(name);
    let jobs: PgBoss.Job<object>[];
    while ((jobs = await queue.fetch<object>(name, { batchSize: 20 })).length > 0) {
      for (const job of jobs) {
        try {
          await runOne(name, job.data);
          await queue.complete(name, job.id);
          result.completed++;
        } catch (error) {
          const message = error instanceof Error ? error.message : String(error);
          await queue.fail(name, job.id, { message });
          result.failed++;
          result.errors.push(`${name} ${job.id}: ${message}`);
        }
      }
    }
  }
  return result;
}
