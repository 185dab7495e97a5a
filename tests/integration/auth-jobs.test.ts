import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { env, resetEnvCache } from "@/lib/env";
import { enqueue, stopBoss } from "@/lib/jobs";
import { drainJobsOnce } from "@/lib/jobs/worker";
import { db } from "@/models";
import { waitForMails } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

// The job queue (lib/jobs on pg-boss) and outgoing mail (lib/mail): a job enqueued inside a
// transaction lives and dies with it, and a mail the relay refuses is retried, never lost.

setupTestDatabase("migrated");
afterAll(() => stopBoss());

const jobsNamed = async (state?: string) => {
  const rows = await db().query<{ n: number }>(`SELECT count(*) AS n FROM pgboss.job WHERE name = 'mail.send' ${state ? "AND state = $1" : ""}`, {
    type: QueryTypes.SELECT,
    bind: state ? [state] : [],
  });
  return rows[0].n;
};

const mail = (to: string, subject: string) => ({ to, subject, text: `${subject}, in plain words.`, html: `<p>${subject}</p>` });

describe("enqueue inside a transaction", () => {
  it("a rolled-back transaction leaves no job; a committed one leaves exactly one", async () => {
    const sequelize = db();
    const before = await jobsNamed();
    await sequelize
      .transaction(async (transaction) => {
        await enqueue("mail.send", mail("rollback@example.test", "Never sent"), { transaction });
        throw new Error("the status change failed");
      })
      .catch(() => undefined);
    expect(await jobsNamed()).toBe(before);

    await sequelize.transaction(async (transaction) => {
      await enqueue("mail.send", mail("commit@example.test", "Sent after commit"), { transaction });
      // not visible outside the transaction until it commits
      expect(await jobsNamed()).toBe(before);
    });
    expect(await jobsNamed()).toBe(before + 1);

    const drained = await drainJobsOnce();
    expect(drained).toMatchObject({ completed: 1, failed: 0 });
    const [caught] = await waitForMails("commit@example.test");
    expect(caught.subject).toBe("Sent after commit");
    expect(caught.html).toContain("<p>Sent after commit</p>");
    expect(await waitForMails("rollback@example.test", 1, 500)).toEqual([]);
  });

  it("refuses an unknown job and bad mail data at enqueue time", async () => {
    await expect(enqueue("mail.sned", mail("x@example.test", "x"))).rejects.toThrow(/unknown job 'mail.sned'/);
    await expect(enqueue("mail.send", { to: "not an address", subject: "", text: "" })).rejects.toThrow();
  });
});

describe("a mail the relay refuses", () => {
  it("fails the job, keeps it for a retry with backoff, and sends it once the relay is back", async () => {
    const working = env().SMTP_URL!;
    await enqueue("mail.send", mail("retry@example.test", "Second time lucky"));
    // nothing listens on port 9 (discard) on loopback: the connection is refused
    process.env.SMTP_URL = "smtp://127.0.0.1:9";
    resetEnvCache();
    try {
      const first = await drainJobsOnce();
      expect(first.failed).toBe(1);
      expect(first.errors[0]).toMatch(/ECONNREFUSED|connect/i);
    } finally {
      process.env.SMTP_URL = working;
      resetEnvCache();
    }
    expect(await jobsNamed("retry")).toBe(1);
    const [job] = await db().query<{ id: string; start_after: Date; retry_limit: number; retry_backoff: boolean }>(
      "SELECT id, start_after, retry_limit, retry_backoff FROM pgboss.job WHERE name = 'mail.send' AND state = 'retry'",
      { type: QueryTypes.SELECT },
    );
    expect(job).toMatchObject({ retry_limit: 7, retry_backoff: true });
    expect(job.start_after.getTime()).toBeGreaterThan(Date.now()); // waits before the next try

    // time passes: make the retry due now, then the worker sends it
    await db().query("UPDATE pgboss.job SET start_after = now() WHERE name = 'mail.send' AND state = 'retry'");
    expect(await drainJobsOnce()).toMatchObject({ completed: 1, failed: 0 });
    const [caught] = await waitForMails("retry@example.test");
    expect(caught.subject).toBe("Second time lucky");
    const [done] = await db().query<{ state: string; retry_count: number }>("SELECT state, retry_count FROM pgboss.job WHERE id = $1", {
      type: QueryTypes.SELECT,
      bind: [job.id],
    });
    expect(done).toEqual({ state: "completed", retry_count: 1 }); // pg-boss counts a retry when it hands the job out again
  });
});
