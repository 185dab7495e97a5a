import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { stopBoss } from "@/lib/jobs";
import { createSubmission } from "@/lib/submissions/create";
import { db } from "@/models";
import { testAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { queuedMails } from "./moderation-helpers";
import { pickTarget, validBody, type Target } from "./submissions-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Creation calls the moderation's trust rule in its own transaction: a trusted contributor's
// unflagged submission is approved at once (and audited); anyone else's waits for a moderator.
setupTestDatabase("seeded");
afterAll(() => stopBoss());

let target: Target;
let median: number;
beforeAll(async () => {
  target = await pickTarget();
  const [row] = await db().query<{ v: number }>(
    "SELECT recommended_value AS v FROM board_stats WHERE board_revision_id = :r AND firmware_family_id = :f AND quantity = 'current_scale'",
    { type: QueryTypes.SELECT, replacements: { r: target.revisionId, f: target.familyId } },
  );
  median = row?.v ?? 250;
});

const unverifiedAtMedian = () => validBody(target, { method: "unverified", currentScale: median, cycles: [] });

async function statusOf(id: number) {
  const [row] = await db().query<{ status: string }>("SELECT status FROM submissions WHERE id = :id", { type: QueryTypes.SELECT, replacements: { id } });
  return row?.status;
}

describe("trusted contributors on create (applyTrustOnCreate wired into createSubmission)", () => {
  it("a new contributor's submission stays pending", async () => {
    const user = await testAccount("contributor", { email: "newcomer@trust.test" });
    const result = await createSubmission(user, unverifiedAtMedian());
    expect(result.status).toBe(201);
    expect(await statusOf(result.body.submission.id)).toBe("pending");
  });

  it("a contributor trusted by an admin gets an unflagged submission approved at once, logged as auto_approve", async () => {
    const user = await testAccount("contributor", { email: "trusted@trust.test" });
    await db().query("UPDATE users SET trusted = true WHERE id = :id", { replacements: { id: user.id } });
    const result = await createSubmission(user, unverifiedAtMedian());
    expect(result.status).toBe(201);
    const id = result.body.submission.id;
    expect(await statusOf(id)).toBe("approved");
    const [event] = await db().query<{ n: number }>("SELECT count(*)::int AS n FROM audit_events WHERE action = 'auto_approve' AND submission_id = :id", {
      type: QueryTypes.SELECT,
      replacements: { id },
    });
    expect(event?.n).toBe(1);
  });

  it("an auto-approved submission gets exactly one mail, saying it was published automatically, and no 'pending review' mail", async () => {
    const user = await testAccount("contributor", { email: "one-mail@trust.test" });
    await db().query("UPDATE users SET trusted = true WHERE id = :id", { replacements: { id: user.id } });
    const result = await createSubmission(user, unverifiedAtMedian());
    const id = result.body.submission.id;
    expect(await statusOf(id)).toBe("approved");
    const mails = (await queuedMails("one-mail@trust.test")).filter((m) => m.subject.includes(`#${id} `));
    expect(mails.map((m) => m.subject)).toEqual([`Shuntbook: Submission #${id} published automatically`]);
    expect(mails[0].text).toMatch(/was published automatically/);
    expect(mails[0].text).not.toMatch(/pending review|A moderator approved/);
  });

  it("a submission that waits gets the one 'received: pending review' mail", async () => {
    const user = await testAccount("contributor", { email: "waits@trust.test" });
    const id = (await createSubmission(user, unverifiedAtMedian())).body.submission.id;
    const mails = (await queuedMails("waits@trust.test")).filter((m) => m.subject.includes(`#${id} `));
    expect(mails.map((m) => m.subject)).toEqual([`Shuntbook: Submission #${id} received: pending review`]);
  });

  it("even a trusted contributor's far-off value waits for a moderator", async () => {
    const user = await testAccount("contributor", { email: "trusted@trust.test" });
    const result = await createSubmission(user, validBody(target, { method: "unverified", currentScale: Math.round(median * 3), cycles: [] }));
    expect(result.status).toBe(201);
    expect(await statusOf(result.body.submission.id)).toBe("pending");
  });
});
