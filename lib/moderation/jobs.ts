import type PgBoss from "pg-boss";
import { sendModeratorDigest } from "./digest";

// The digest's place in the job queue. lib/jobs' worker knows only the jobs in its JOBS table; the
// digest needs lib/moderation, which itself enqueues through lib/jobs, so it is registered from
// here instead of there (no import cycle). The worker calls registerModerationJobs(boss) once it
// has started pg-boss. Cron runs only on an instance started with pg-boss's `schedule` option on
// (its timekeeper turns schedules into jobs); any instance may then work the job.

export const DIGEST_JOB = "moderation.digest";
/** Every day at 07:00 UTC (pg-boss schedules in UTC unless told otherwise). */
export const DIGEST_CRON = "0 7 * * *";

export async function registerModerationJobs(boss: PgBoss): Promise<void> {
  // a digest that fails (database away) is tried again a few times, then waits for tomorrow's
  await boss.createQueue(DIGEST_JOB, { name: DIGEST_JOB, retryLimit: 3, retryDelay: 300, retryBackoff: true, expireInSeconds: 300 });
  await boss.schedule(DIGEST_JOB, DIGEST_CRON, {}, { tz: "UTC" });
  await boss.work(DIGEST_JOB, { pollingIntervalSeconds: 5, batchSize: 1 }, async () => {
    await sendModeratorDigest();
  });
}
