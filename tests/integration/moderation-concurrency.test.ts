import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { stopBoss } from "@/lib/jobs";
import { CONFLICT_MESSAGE, type Decision } from "@/lib/vocabulary";
import { db } from "@/models";
import { sessionCookieFor } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { decideAs, insertSubmission, queuedMails, rebuiltStats, setupGroup, storedStats, submissionRow, type Setup } from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Two moderators act on one submission at the same moment, both from the version they loaded.
// The row lock plus version check lets exactly one win; the other gets a 409 with the friendly
// message, and the log, the mails and the published figures show only the winner's action.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

let setup: Setup;
let first: string;
let second: string;
beforeAll(async () => {
  setup = await setupGroup([397, 398, 399, 400, 401, 402, 403]);
  first = await sessionCookieFor("moderator");
  second = await sessionCookieFor("moderator", { email: "second-moderator@auth.test", name: "Second Moderator" });
});

const body = (decision: Decision) =>
  decision === "approve"
    ? { version: 0, reason: "Checked: this board's shunt differs." }
    : decision === "reject"
      ? { version: 0, reason: "Too far off." }
      : { version: 0, message: "Add evidence." };

const eventsFor = (id: number) =>
  db().query<{ action: string }>("SELECT action FROM audit_events WHERE submission_id = :id", { replacements: { id }, type: QueryTypes.SELECT });

describe("two moderators at once", () => {
  const pairs: [Decision, Decision][] = [
    ["approve", "approve"],
    ["approve", "reject"],
    ["reject", "approve"],
    ["request_changes", "approve"],
    ["approve", "request_changes"],
  ];

  it.each(pairs)("%s vs %s on the same version: one 200, one 409; one event, one mail, board_stats equal to a fresh rebuild", async (a, b) => {
    // a value that moves the median when approved, so a double approval would show in the figures
    const id = await insertSubmission(setup.fx, { currentScale: 450 });
    const statsBefore = await storedStats(setup.group);
    const responses = await Promise.all([decideAs(a, id, body(a), first), decideAs(b, id, body(b), second)]);
    const statuses = responses.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409]);
    const loser = responses.find((r) => r.status === 409)!;
    expect((await loser.json()).error.message.startsWith(CONFLICT_MESSAGE)).toBe(true);
    const winner = await responses.find((r) => r.status === 200)!.json();

    const events = await eventsFor(id);
    expect(events).toHaveLength(1);
    expect(events[0].action).toBe(winner.event.action);
    expect(await submissionRow(id)).toMatchObject({ status: winner.submission.status, version: 1 });
    expect((await queuedMails("fixture@example.test")).filter((m) => m.subject.includes(`#${id} `) || m.subject.includes(`#${id}:`))).toHaveLength(1);

    const stats = await storedStats(setup.group);
    expect(stats).toEqual(await rebuiltStats(setup.group));
    if (winner.submission.status !== "approved") expect(stats).toEqual(statsBefore);
  });

  it("many at once on many submissions: every submission decided exactly once", async () => {
    const ids = await Promise.all(Array.from({ length: 6 }, (_, i) => insertSubmission(setup.fx, { currentScale: 395 + i * 3 })));
    const responses = await Promise.all(ids.flatMap((id) => [decideAs("approve", id, { version: 0 }, first), decideAs("approve", id, { version: 0 }, second)]));
    expect(responses.filter((r) => r.status === 200)).toHaveLength(ids.length);
    expect(responses.filter((r) => r.status === 409)).toHaveLength(ids.length);
    for (const id of ids) expect(await eventsFor(id)).toHaveLength(1);
    expect(await storedStats(setup.group)).toEqual(await rebuiltStats(setup.group));
    // the history's last row per quantity is what board_stats publishes
    const [last] = await db().query<{ n: number; recommendedValue: number }>(
      `SELECT n, recommended_value AS "recommendedValue" FROM published_value_history
        WHERE board_revision_id = :r AND firmware_family_id = :f AND quantity = 'current_scale' ORDER BY id DESC LIMIT 1`,
      { replacements: { r: setup.group.boardRevisionId, f: setup.group.firmwareFamilyId }, type: QueryTypes.SELECT },
    );
    const [published] = await storedStats(setup.group);
    expect(last).toEqual({ n: published.n, recommendedValue: published.recommendedValue });
  });
});
