import { QueryTypes } from "sequelize";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as queueRoute } from "@/app/api/v1/moderation/queue/route";
import { PATCH as patchUserRoute } from "@/app/api/v1/admin/users/[id]/route";
import { resetEnvCache } from "@/lib/env";
import { stopBoss } from "@/lib/jobs";
import { applyTrustOnCreate, decideTrust, trustOf } from "@/lib/moderation";
import { db } from "@/models";
import { callRoute, sessionCookieFor, sessionCookieForAccount, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import * as helpers from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Trusted contributors (N approved, no rejection; N = MODERATION_TRUST_THRESHOLD, default 5) skip
// the queue unless their new submission raises a flag; admins can overrule the record and change
// roles, each change audited. The rule N/"no rejection" is Shuntbook's own (no outside source).
setupTestDatabase("migrated");
afterAll(() => stopBoss());
afterEach(() => {
  delete process.env.MODERATION_TRUST_THRESHOLD;
  resetEnvCache();
});

let setup: helpers.Setup;
let admin: string;
beforeAll(async () => {
  // the fixture person has seven approved values in the group: trusted by record
  setup = await helpers.setupGroup([397, 398, 399, 400, 401, 402, 403]);
  admin = await sessionCookieFor("admin");
});

/** Creates a pending submission and applies trust in one transaction, as the creation code will. */
async function create(values: Parameters<typeof helpers.insertSubmission>[1]) {
  let id = 0;
  const outcome = await db().transaction(async (t) => {
    id = await helpers.insertSubmission(setup.fx, values, t);
    return applyTrustOnCreate(id, t);
  });
  return { id, outcome };
}

const events = (id: number) =>
  db().query<{ action: string; actorId: string | null }>(`SELECT action, actor_id AS "actorId" FROM audit_events WHERE submission_id = :id`, {
    replacements: { id },
    type: QueryTypes.SELECT,
  });

/** Polls until `count` backends of this database wait on a lock (10 s deadline). */
async function waitForLockWaiters(count: number) {
  const deadline = Date.now() + 10_000;
  for (;;) {
    const [{ waiting }] = await db().query<{ waiting: number }>(
      "SELECT count(*)::int AS waiting FROM pg_stat_activity WHERE datname = current_database() AND wait_event_type = 'Lock'",
      { type: QueryTypes.SELECT },
    );
    if (waiting >= count) return;
    if (Date.now() > deadline) throw new Error(`only ${waiting} of ${count} requests reached the lock within 10 s`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

const patchUser = (id: string, body: unknown, cookie = admin) =>
  callRoute(
    patchUserRoute,
    withCookie(
      new Request(`http://test.local/api/v1/admin/users/${id}`, {
        method: "PATCH",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      }),
      cookie,
    ),
    { params: Promise.resolve({ id }) },
  );

describe("decideTrust", () => {
  it.each([
    [{ approved: 5, rejected: 0 }, null, true, "record"],
    [{ approved: 4, rejected: 0 }, null, false, "building"],
    [{ approved: 50, rejected: 1 }, null, false, "rejected"],
    [{ approved: 0, rejected: 3 }, true, true, "admin"],
    [{ approved: 50, rejected: 0 }, false, false, "revoked"],
  ] as const)("%o with the admin's %s: trusted %s (%s)", (record, override, trusted, reason) => {
    expect(decideTrust(record, override, 5)).toMatchObject({ trusted, reason });
  });
});

describe("applyTrustOnCreate", () => {
  it("a trusted contributor's unflagged submission is approved at once: event 'auto_approve' without actor, figures, history, mail", async () => {
    const { id, outcome } = await create({ currentScale: 402 });
    expect(outcome).toMatchObject({ autoApproved: true, version: 1 });
    expect(await helpers.submissionRow(id)).toMatchObject({ status: "approved", version: 1 });
    expect(await events(id)).toEqual([{ action: "auto_approve", actorId: null }]);
    const stats = await helpers.storedStats(setup.group);
    expect(stats).toEqual(await helpers.rebuiltStats(setup.group));
    expect(stats[0]).toMatchObject({ n: 8 });
    expect((await helpers.historyRows(setup.group)).at(-1)).toMatchObject({ n: 8, eventId: outcome.autoApproved ? outcome.eventId : -1 });
    expect((await helpers.queuedMails("fixture@example.test")).some((m) => m.subject.includes(`#${id} published automatically`))).toBe(true); // issue 13: its own words
  });

  it.each([
    ["far from the approved values (|z| > 3.5)", { currentScale: 470 }],
    ["evidence that disagrees", { currentScale: 400, mismatch: true }],
  ])("a flagged submission waits for a moderator: %s", async (_name, values) => {
    const { id, outcome } = await create(values);
    expect(outcome).toMatchObject({ autoApproved: false, why: "flagged" });
    expect(await helpers.submissionRow(id)).toMatchObject({ status: "pending", version: 0 });
    expect(await events(id)).toEqual([]);
  });

  it("too few approved values to judge is not a flag", async () => {
    const { id, outcome } = await create({ currentScale: null, voltageScale: 110 });
    expect(outcome.autoApproved).toBe(true);
    expect((await helpers.submissionRow(id)).status).toBe("approved");
  });

  it("the threshold comes from MODERATION_TRUST_THRESHOLD (default 5)", async () => {
    const person = await helpers.insertPerson("four-approved@example.test", "Four Approved");
    for (let i = 0; i < 4; i++) await helpers.insertSubmission(setup.fx, { currentScale: 400, status: "approved", contributorId: person });
    const mine = async () => {
      let id = 0;
      const outcome = await db().transaction(async (t) => {
        id = await helpers.insertSubmission(setup.fx, { currentScale: 400, contributorId: person }, t);
        return applyTrustOnCreate(id, t);
      });
      return outcome;
    };
    expect(await mine()).toMatchObject({ autoApproved: false, why: "not_trusted", trust: { reason: "building", approved: 4, threshold: 5 } });
    process.env.MODERATION_TRUST_THRESHOLD = "4";
    resetEnvCache();
    expect((await mine()).autoApproved).toBe(true);
  });

  it("one rejection ends trust by record", async () => {
    const person = await helpers.insertPerson("once-rejected@example.test", "Once Rejected");
    for (let i = 0; i < 6; i++) await helpers.insertSubmission(setup.fx, { currentScale: 400, status: "approved", contributorId: person });
    await helpers.insertSubmission(setup.fx, { currentScale: 400, status: "rejected", contributorId: person });
    expect(await trustOf(person)).toMatchObject({ trusted: false, reason: "rejected", approved: 6, rejected: 1 });
  });

  it("a rolled-back creation leaves nothing behind", async () => {
    const before = await helpers.writtenState();
    await expect(
      db().transaction(async (t) => {
        const id = await helpers.insertSubmission(setup.fx, { currentScale: 401 }, t);
        expect((await applyTrustOnCreate(id, t)).autoApproved).toBe(true);
        throw new Error("the photo attach failed");
      }),
    ).rejects.toThrow("the photo attach failed");
    expect(await helpers.writtenState()).toEqual(before);
  });
});

describe("PATCH /api/v1/admin/users/{id}", () => {
  it("trust: an admin's 'not trusted' stops auto-approval, 'trusted' starts it for a newcomer, null goes back to the record; each audited", async () => {
    const res = await patchUser(setup.fx.userId, { trusted: false, reason: "Values copied from another board." });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.user.trust).toMatchObject({ trusted: false, reason: "revoked", override: false });
    expect(body.event).toMatchObject({
      action: "user_update",
      entity: { type: "user", id: setup.fx.userId },
      before: { trusted: null },
      after: { trusted: false },
      reason: "Values copied from another board.",
    });
    expect((await create({ currentScale: 400 })).outcome).toMatchObject({ autoApproved: false, why: "not_trusted" });

    const newcomer = await helpers.insertPerson("trusted-newcomer@example.test", "Trusted Newcomer");
    expect((await patchUser(newcomer, { trusted: true })).status).toBe(200);
    let id = 0;
    const outcome = await db().transaction(async (t) => {
      id = await helpers.insertSubmission(setup.fx, { currentScale: 400, contributorId: newcomer }, t);
      return applyTrustOnCreate(id, t);
    });
    expect(outcome.autoApproved).toBe(true);

    expect((await (await patchUser(setup.fx.userId, { trusted: null })).json()).user.trust).toMatchObject({ trusted: true, reason: "record", override: null });
  });

  it("a role change applies on the person's very next request, and is audited", async () => {
    const person = await testAccount("contributor", { email: "promoted@auth.test", name: "Promoted" });
    const cookie = await sessionCookieForAccount(person);
    const queue = () => callRoute(queueRoute, withCookie(new Request("http://test.local/api/v1/moderation/queue"), cookie));
    expect((await queue()).status).toBe(403);
    const res = await patchUser(person.id, { role: "moderator" });
    expect((await res.json()).event).toMatchObject({ before: { role: "contributor" }, after: { role: "moderator" } });
    expect((await queue()).status).toBe(200);
    expect((await patchUser(person.id, { role: "contributor" })).status).toBe(200);
    expect((await queue()).status).toBe(403);
  });

  it("a change that changes nothing writes nothing", async () => {
    const person = await helpers.insertPerson("unchanged@example.test");
    const before = await helpers.writtenState();
    const res = await patchUser(person, { role: "contributor", trusted: null });
    expect(res.status).toBe(200);
    expect((await res.json()).event).toBeNull();
    expect(await helpers.writtenState()).toEqual(before);
  });

  it.each([
    ["nothing to change", {}, "role"],
    ["an unknown role", { role: "owner" }, "role"],
    ["trusted as text", { trusted: "yes" }, "trusted"],
    ["a blank reason", { trusted: true, reason: "  " }, "reason"],
  ])("refuses %s with a 400 naming the field, writing nothing", async (_name, body, field) => {
    const person = await helpers.insertPerson(`refused-${field}-${Math.random().toString(36).slice(2)}@example.test`);
    const before = await helpers.writtenState();
    await helpers.expectError(await patchUser(person, body), 400, field);
    expect(await helpers.writtenState()).toEqual(before);
  });

  it("an unknown or impossible user: 404", async () => {
    await helpers.expectError(await patchUser("00000000-0000-4000-8000-000000000000", { trusted: true }), 404, "id");
    await helpers.expectError(await patchUser("not-a-uuid", { trusted: true }), 404, "id");
  });

  it("keeps at least one admin, also when two admins demote each other at the same moment", async () => {
    const me = await testAccount("admin");
    const before = await helpers.writtenState();
    const error = await helpers.expectError(await patchUser(me.id, { role: "moderator" }), 409, "role");
    expect(error.message).toMatch(/only admin/);
    expect(await helpers.writtenState()).toEqual(before);

    const other = await testAccount("admin", { email: "second-admin@auth.test", name: "Second Admin" });
    const otherCookie = await sessionCookieForAccount(other);
    // "At the same moment" made certain: a transaction of the test's own holds the admin rows, so both
    // requests pass their role check and then queue on the lock; only then does it let them go. Without
    // it, on a busy machine one request could finish before the other starts, and the second admin
    // (no longer an admin) would rightly get 403 instead of meeting the last-admin rule.
    const hold = await db().transaction();
    await db().query("SELECT id FROM users WHERE role = 'admin' ORDER BY id FOR UPDATE", { transaction: hold });
    const racing = Promise.all([patchUser(other.id, { role: "moderator" }), patchUser(me.id, { role: "moderator" }, otherCookie)]);
    await waitForLockWaiters(2);
    await hold.commit();
    const results = await racing;
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const [{ admins }] = await db().query<{ admins: number }>("SELECT count(*)::int AS admins FROM users WHERE role = 'admin'", { type: QueryTypes.SELECT });
    expect(admins).toBe(1);
  });
});
