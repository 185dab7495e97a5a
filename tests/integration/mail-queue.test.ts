import { randomBytes } from "node:crypto";
import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { env } from "@/lib/env";
import { JOB_PRIORITY, enqueue, stopBoss } from "@/lib/jobs";
import { jobDefinition } from "@/lib/jobs/handlers";
import { startJobWorker, stopJobWorker } from "@/lib/jobs/worker";
import { RECIPIENT_THROTTLE } from "@/lib/mail/recipient-throttle";
import { closeMailTransport } from "@/lib/mail/transport";
import { db } from "@/models";
import { setupTestDatabase } from "@/tests/support/database";

// Issue 12, finding 4 / deliver 3: the mail worker drains a backlog with batches and concurrency,
// takes urgent mail (sign-in, reset) first, and one flooded mailbox does not hold up anyone else.
// The real worker (startJobWorker) sends through the pooled transport to npm test's SMTP catcher.

setupTestDatabase("migrated");

const tag = randomBytes(4).toString("hex");
const address = (who: string) => `${who}-${tag}@mailqueue.test`;
const mail = (to: string, subject: string) => ({ to, subject, text: `${subject}\n` });

const drain = jobDefinition("mail.send")!.drain;
const BACKLOG = 300;
const URGENT = 3;
// Generous for a loaded 2-core machine: a whole second per mail in each lane of a batch.
const SEND_ALLOWANCE_SECONDS = 1;
/** Seconds one round (every poller taking a batch) may take: the polling interval plus the batch's sends, `concurrency` at a time. */
const ROUND_SECONDS = drain.pollingIntervalSeconds + Math.ceil(drain.batchSize / drain.concurrency) * SEND_ALLOWANCE_SECONDS;
const perRound = drain.workers * drain.batchSize;

async function caughtCount(to: (a: string) => boolean): Promise<number> {
  const res = await fetch(new URL("/api/email", env().MAIL_INBOX_URL));
  const all = (await res.json()) as { to: { address: string }[] }[];
  return all.filter((m) => m.to.some((t) => to(t.address.toLowerCase()))).length;
}

async function waitUntil(check: () => Promise<boolean>, timeoutMs: number): Promise<number> {
  const started = Date.now();
  while (!(await check())) {
    if (Date.now() - started > timeoutMs) throw new Error(`not done within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
  return Date.now() - started;
}

const jobsTo = (pattern: string) =>
  db().query<{ to: string; state: string; priority: number; started_on: Date | null; seconds_until_due: number }>(
    `SELECT data->>'to' AS to, state, priority, started_on, extract(epoch FROM start_after - now())::float AS seconds_until_due
     FROM pgboss.job WHERE name = 'mail.send' AND data->>'to' LIKE $1`,
    { bind: [pattern], type: QueryTypes.SELECT },
  );

afterAll(async () => {
  await stopJobWorker();
  await stopBoss();
  closeMailTransport();
});

describe("the mail queue", () => {
  it(`drains ${BACKLOG} queued mails within the bound its batch settings give, urgent mail taken first`, async () => {
    for (let i = 0; i < BACKLOG; i++) await enqueue("mail.send", mail(address(`bulk${i}`), `Bulk ${i}`));
    // enqueued last: a first-in-first-out queue would send these after all the others
    for (let i = 0; i < URGENT; i++) await enqueue("mail.send", mail(address(`urgent${i}`), `Reset ${i}`), { priority: JOB_PRIORITY.urgent });

    const total = BACKLOG + URGENT;
    const rounds = Math.ceil(total / perRound);
    const boundMs = (rounds * ROUND_SECONDS + 10) * 1000; // + 10 s for the worker to start
    const oldWorkerMs = total * 2000; // the worker this replaces: one job every 2 s
    expect(boundMs).toBeLessThan(oldWorkerMs / 5);

    await startJobWorker();
    const tookMs = await waitUntil(async () => (await caughtCount((a) => a.endsWith(`-${tag}@mailqueue.test`))) >= total, boundMs);
    console.log(`[mail-queue] ${total} mails drained in ${tookMs} ms (bound ${boundMs} ms, ${rounds} rounds of ${perRound})`);

    const jobs = await jobsTo(`%-${tag}@mailqueue.test`);
    expect(jobs.filter((j) => j.state === "completed")).toHaveLength(total);
    // every urgent mail was taken in the first round: fewer than one round's jobs started before it
    const startedAt = (j: { started_on: Date | null }) => new Date(j.started_on!).getTime();
    for (const urgent of jobs.filter((j) => j.priority === JOB_PRIORITY.urgent)) {
      const before = jobs.filter((j) => startedAt(j) < startedAt(urgent)).length;
      expect(before, urgent.to).toBeLessThan(perRound);
    }
  }, 180_000);

  it("one address flooded with mail does not hold up the others, and its mail is held back, not lost", async () => {
    const FLOOD = 120;
    const flooded = address("flooded");
    for (let i = 0; i < FLOOD; i++) await enqueue("mail.send", mail(flooded, `Notice ${i}`));
    const others = Array.from({ length: 5 }, (_, i) => address(`bystander${i}`));
    for (const to of others) await enqueue("mail.send", mail(to, "Your submission was approved"));

    // the bystanders' mail arrives within the rounds that the whole flood plus theirs would take at most
    const boundMs = (Math.ceil((FLOOD + others.length) / perRound) * ROUND_SECONDS + 5) * 1000;
    await waitUntil(async () => (await caughtCount((a) => others.includes(a))) === others.length, boundMs);

    // the flooded mailbox got one window's worth; the rest waits on the queue for later windows
    await waitUntil(async () => (await jobsTo(flooded)).filter((j) => j.state === "created").length === FLOOD - RECIPIENT_THROTTLE.mails, boundMs);
    expect(await caughtCount((a) => a === flooded)).toBe(RECIPIENT_THROTTLE.mails);
    const waiting = (await jobsTo(flooded)).filter((j) => j.state === "created");
    expect(waiting.every((j) => j.seconds_until_due > 0)).toBe(true);
    // spread over the windows after this one, a window's worth each, not all due at once
    const windowsAhead = Math.ceil((FLOOD - RECIPIENT_THROTTLE.mails) / RECIPIENT_THROTTLE.mails);
    const latest = Math.max(...waiting.map((j) => j.seconds_until_due));
    expect(latest).toBeGreaterThan((windowsAhead - 1) * RECIPIENT_THROTTLE.windowSeconds);
    expect(latest).toBeLessThanOrEqual(windowsAhead * RECIPIENT_THROTTLE.windowSeconds + 5);
  }, 120_000);
});
