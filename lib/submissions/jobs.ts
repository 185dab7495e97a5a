import type PgBoss from "pg-boss";
import { purgeExpiredKeys } from "./idempotency";

// Idempotency keys live KEY_TTL_HOURS; an expired one is already ignored and may be reused, so the
// rows are only dead weight. This hourly job deletes them (on idempotency_keys_expires_idx).
// Registered from here, as the moderation digest is, because lib/jobs must not import
// lib/submissions (which enqueues through lib/jobs). The worker calls registerSubmissionJobs once
// it has started pg-boss; pg-boss's timekeeper turns the schedule into one job per hour, which
// exactly one instance works.

export const PURGE_KEYS_JOB = "submissions.purge-idempotency-keys";
/** At minute 17 of every hour (UTC), away from the top of the hour when other schedules fire. */
export const PURGE_KEYS_CRON = "17 * * * *";

export async function registerSubmissionJobs(boss: PgBoss): Promise<void> {
  // a purge that fails waits for the next hour; nothing depends on it
  await boss.createQueue(PURGE_KEYS_JOB, { name: PURGE_KEYS_JOB, retryLimit: 0, expireInSeconds: 120 });
  await boss.schedule(PURGE_KEYS_JOB, PURGE_KEYS_CRON, {}, { tz: "UTC" });
  await boss.work(PURGE_KEYS_JOB, { pollingIntervalSeconds: 5, batchSize: 1 }, async () => {
    const purged = await purgeExpiredKeys();
    if (purged > 0) console.log(`[jobs] purged ${purged} expired idempotency keys`);
  });
}
