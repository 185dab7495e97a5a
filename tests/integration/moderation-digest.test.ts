import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { boss } from "@/lib/jobs/boss";
import { stopBoss } from "@/lib/jobs";
import { drainJobsOnce } from "@/lib/jobs/worker";
import { DIGEST_CRON, DIGEST_JOB, registerModerationJobs, sendModeratorDigest } from "@/lib/moderation";
import { db } from "@/models";
import { testAccount, waitForMails } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { insertPerson, insertSubmission, queuedMails, setupGroup, type Setup } from "./moderation-helpers";

// The daily digest: counts of what waits, by the queue's own flags, mailed to every moderator and
// admin through the job queue; scheduled by pg-boss at 07:00 UTC.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

let setup: Setup;
let staff: { email: string }[];
beforeAll(async () => {
  setup = await setupGroup([397, 398, 399, 400, 401, 402, 403]);
  staff = [await testAccount("moderator"), await testAccount("admin")];
  await testAccount("contributor");
});

describe("sendModeratorDigest", () => {
  it("sends nothing when nothing waits", async () => {
    const result = await sendModeratorDigest();
    expect(result.recipients).toEqual([]);
    expect(result.counts.all).toBe(0);
    expect(await queuedMails(staff[0].email)).toEqual([]);
  });

  it("queues one mail per moderator and admin with the counts per flag", async () => {
    await insertSubmission(setup.fx, { currentScale: 470, mismatch: true, ageHours: 80 }); // far off and disagreeing: flagged once
    await insertSubmission(setup.fx, { currentScale: 460 });
    await insertSubmission(setup.fx, { currentScale: 400, mismatch: true });
    await insertSubmission(setup.fx, { currentScale: 400, contributorId: await insertPerson("first@example.test") });
    await insertSubmission(setup.fx, { currentScale: 401 });
    const result = await sendModeratorDigest();
    expect(result.counts).toMatchObject({ all: 5, outlier: 2, mismatch: 2, new: 1, none: 1, flagged: 3 });
    expect(result.recipients.sort()).toEqual(staff.map((s) => s.email).sort());
    const [mail] = await queuedMails(staff[0].email);
    expect(mail.subject).toBe("Shuntbook: 5 waiting for review, 3 flagged");
    expect(mail.text).toContain("the oldest has waited 3 days");
    expect(mail.text).toContain("Far from the approved values: 2");
    expect(mail.text).toContain("Evidence disagrees with the values: 2");
    expect(mail.text).toContain("From a first-time contributor: 1");
    expect(mail.text).toContain("/moderation");
    expect(await queuedMails("fixture@example.test").then((m) => m.filter((x) => x.subject.includes("waiting for review")))).toEqual([]);

    // the queued mails reach the catcher
    expect((await drainJobsOnce()).failed).toBe(0);
    const delivered = await waitForMails(staff[0].email, 1);
    expect(delivered.at(-1)!.subject).toBe(mail.subject);
  });
});

describe("registerModerationJobs", () => {
  it("schedules the digest daily at 07:00 UTC and works the job", async () => {
    const queue = await boss();
    await registerModerationJobs(queue);
    const [schedule] = await db().query<{ cron: string; timezone: string }>("SELECT cron, timezone FROM pgboss.schedule WHERE name = :name", {
      replacements: { name: DIGEST_JOB },
      type: QueryTypes.SELECT,
    });
    expect(schedule).toEqual({ cron: "0 7 * * *", timezone: "UTC" });
    expect(DIGEST_CRON).toBe("0 7 * * *");

    // a digest job (as the schedule would create it) is picked up by the worker registered above
    const before = (await queuedMails(staff[0].email)).length;
    await queue.send(DIGEST_JOB, {});
    const until = Date.now() + 20_000;
    while ((await queuedMails(staff[0].email)).length === before && Date.now() < until) await new Promise((r) => setTimeout(r, 250));
    expect((await queuedMails(staff[0].email)).length).toBe(before + 1);
  });
});
