import type PgBoss from "pg-boss";
import { AUTH_JOBS } from "@/lib/auth/jobs";
import { registerModerationJobs } from "@/lib/moderation/jobs";
import { registerSubmissionJobs } from "@/lib/submissions/jobs";
import { db } from "@/models";
import { bossWithQueue } from "./boss";
import { inTransaction } from "./enqueue";
import { jobDefinition, jobNames } from "./handlers";

// The job worker. In the app it runs inside the Next.js server process (instrumentation.ts starts
// it once per process); several app instances may each run one, since pg-boss hands every job to
// exactly one fetcher (SELECT … FOR UPDATE SKIP LOCKED). Tests call drainJobsOnce() instead, or
// startJobWorker() to see the worker's own draining (tests/integration/mail-queue.test.ts).

// Every job this process works: lib/auth's sign-up and reset requests (defined by their modules,
// see defineJob) first, since they enqueue mails, so one drainJobsOnce() also sends those mails.
const workedHere = () => [...new Set([...AUTH_JOBS, ...jobNames()])];

async function runOne(name: string, data: unknown): Promise<void> {
  const def = jobDefinition(name)!;
  await def.run(def.parse(data) as never);
}

/** Runs `fn` on every item, at most `limit` at a time. */
async function eachLimited<T>(items: T[], limit: number, fn: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  const lane = async () => {
    while (next < items.length) await fn(items[next++]);
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, lane));
}

/**
 * Puts a held-back job back on the queue, due in `seconds`, with its priority, and completes the
 * fetched one: both in one transaction, so the mail is neither lost nor doubled.
 */
async function holdBack(queue: PgBoss, name: string, job: PgBoss.JobWithMetadata<object>, seconds: number): Promise<void> {
  await db().transaction(async (transaction) => {
    const executor = { db: inTransaction(transaction) };
    const id = await queue.send(name, job.data, { priority: job.priority, startAfter: seconds, ...executor });
    if (!id) throw new Error(`job '${name}' could not be put back: its queue does not exist`);
    await queue.complete(name, job.id, { heldBackSeconds: seconds, requeuedAs: id }, executor);
  });
}

/**
 * One fetched batch: each job held back, run, or failed on its own, `concurrency` at a time. A
 * job that throws is failed by itself (pg-boss retries it per the queue's policy); pg-boss then
 * completes the rest of the batch, leaving the failed and held-back ones as they are.
 */
async function runBatch(queue: PgBoss, name: string, jobs: PgBoss.JobWithMetadata<object>[]): Promise<void> {
  const def = jobDefinition(name)!;
  await eachLimited(jobs, def.drain.concurrency, async (job) => {
    try {
      const data = def.parse(job.data);
      const wait = def.holdBack ? await def.holdBack(data as never) : 0;
      if (wait > 0) return await holdBack(queue, name, job, wait);
      await def.run(data as never);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      console.error(`[jobs] ${name} ${job.id} failed: ${message}`);
      await queue.fail(name, job.id, { message }).catch((e) => console.error("[jobs] could not record the failure:", e));
    }
  });
}

/** Starts the pollers of every job's queue (per its drain settings). Safe to call twice: the second call does nothing. */
export async function startJobWorker(): Promise<void> {
  const g = globalThis as unknown as { shuntbookWorker?: Promise<void> };
  g.shuntbookWorker ??= (async () => {
    let queue: PgBoss | undefined;
    for (const name of workedHere()) {
      const q = (queue = await bossWithQueue(name));
      const { workers, batchSize, pollingIntervalSeconds } = jobDefinition(name)!.drain;
      for (let i = 0; i < workers; i++) {
        await q.work<object>(name, { batchSize, pollingIntervalSeconds, includeMetadata: true }, (jobs) => runBatch(q, name, jobs));
      }
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

/** Stops the pollers startJobWorker started (tests); pg-boss itself is stopped by stopBoss. */
export async function stopJobWorker(): Promise<void> {
  const g = globalThis as unknown as { shuntbookWorker?: Promise<void> };
  if (!g.shuntbookWorker) return;
  await g.shuntbookWorker.catch(() => undefined);
  g.shuntbookWorker = undefined;
  for (const name of workedHere()) await (await bossWithQueue(name)).offWork(name);
}

export type DrainResult = { completed: number; failed: number; errors: string[] };

/**
 * Fetches every job that is due right now, runs each once, and marks it completed or failed
 * (failed jobs with retries left come back after their delay). For tests and one-off scripts:
 * unlike the worker it holds nothing back (no per-recipient throttle), so a test sees every mail.
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
