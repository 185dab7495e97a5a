import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { POST as revertRoute } from "@/app/api/v1/admin/events/[id]/revert/route";
import { GET as usersRoute } from "@/app/api/v1/admin/users/route";
import { POST as bulkRoute } from "@/app/api/v1/moderation/bulk-approve/route";
import { GET as eventsRoute } from "@/app/api/v1/moderation/events/route";
import { stopBoss } from "@/lib/jobs";
import { listAuditEvents, listQueue, nextInQueue } from "@/lib/moderation";
import { db } from "@/models";
import { callRoute, sessionCookieFor, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import * as helpers from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Issue 13's server rules for moderators and admins: a flagged value is approved only with a
// reason; unverified values never go in one bulk batch with measured ones; queue rows carry the
// group's median and the evidence counts; the log's `revertable` is true exactly when the revert
// succeeds; the people list is searched and paged. The flag cut-off |M| > 3.5 is NIST/SEMATECH
// e-Handbook §1.3.5.17 (median 400, MAD 2 for the approved set below: |x − 400| > 10.38 is far).
setupTestDatabase("migrated");
afterAll(() => stopBoss());

let setup: helpers.Setup;
let moderator: string;
let admin: string;
beforeAll(async () => {
  setup = await helpers.setupGroup([397, 398, 399, 400, 401, 402, 403]);
  moderator = await sessionCookieFor("moderator");
  admin = await sessionCookieFor("admin");
});

const post = (handler: unknown, url: string, body: unknown, cookie: string, params: Record<string, string> = {}) =>
  callRoute(
    handler as (r: Request, c: unknown) => Promise<Response>,
    withCookie(new Request(`http://test.local${url}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), cookie),
    { params: Promise.resolve(params) },
  );
const get = (handler: unknown, url: string, cookie: string) =>
  callRoute(handler as (r: Request, c: unknown) => Promise<Response>, withCookie(new Request(`http://test.local${url}`), cookie), {
    params: Promise.resolve({}),
  });
const revert = (eventId: number, cookie = admin) =>
  post(revertRoute, `/api/v1/admin/events/${eventId}/revert`, { reason: "Checking the rule." }, cookie, { id: String(eventId) });

describe("approving a flagged value", () => {
  it("without a reason is a 400 on reason and writes nothing; with one it is approved and the reason is logged", async () => {
    const id = await helpers.insertSubmission(setup.fx, { currentScale: 470 }); // far off
    const before = await helpers.writtenState();
    await helpers.expectError(await helpers.decideAs("approve", id, { version: 0 }, moderator), 400, "reason");
    await helpers.expectError(await helpers.decideAs("approve", id, { version: 0, note: "Fine by me." }, moderator), 400, "reason");
    await helpers.expectError(await helpers.decideAs("approve", id, { version: 0, reason: "   " }, moderator), 400, "reason");
    expect(await helpers.writtenState()).toEqual(before);

    const res = await helpers.decideAs("approve", id, { version: 0, reason: "This revision has a different shunt; the photo shows it." }, moderator);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.event).toMatchObject({ action: "approve", reason: "This revision has a different shunt; the photo shows it." });
    expect(body.submission).toMatchObject({ status: "approved", moderatorNote: null });
  });

  it("evidence that disagrees needs a reason too; an unflagged value needs none", async () => {
    const mismatch = await helpers.insertSubmission(setup.fx, { currentScale: 400, mismatch: true });
    await helpers.expectError(await helpers.decideAs("approve", mismatch, { version: 0 }, moderator), 400, "reason");
    const plain = await helpers.insertSubmission(setup.fx, { currentScale: 401 });
    expect((await helpers.decideAs("approve", plain, { version: 0 }, moderator)).status).toBe(200);
  });
});

describe("bulk approval", () => {
  it("refuses a batch mixing unverified and measured values with a 400 on items, writing nothing", async () => {
    const measured = await helpers.insertSubmission(setup.fx, { currentScale: 400 });
    const unverified = await helpers.insertSubmission(setup.fx, { currentScale: 399, method: "unverified" });
    const before = await helpers.writtenState();
    const items = [
      { id: measured, version: 0 },
      { id: unverified, version: 0 },
    ];
    await helpers.expectError(await post(bulkRoute, "/api/v1/moderation/bulk-approve", { items }, moderator), 400, "items");
    expect(await helpers.writtenState()).toEqual(before);
    // each kind on its own goes through
    for (const item of items) {
      const res = await post(bulkRoute, "/api/v1/moderation/bulk-approve", { items: [item] }, moderator);
      expect((await res.json()).approved).toEqual([item.id]);
    }
  });
});

describe("the queue", () => {
  it("rows carry the method, the evidence and photo counts and each value's group median; next skips the one on screen", async () => {
    const a = await helpers.insertSubmission(setup.fx, { currentScale: 480, method: "unverified" });
    await db().query(
      "INSERT INTO submission_cycles (submission_id, position, scale_used, reported_mah, charged_mah, rated_mah, cells) VALUES (:a, 0, 400, 1000, 1010, 1500, 4)",
      {
        replacements: { a },
      },
    );
    const page = await listQueue();
    const row = page.rows.find((r) => r.id === a)!;
    const [stats] = await db().query<{ median: number; n: number }>(
      "SELECT median, n FROM board_stats WHERE board_revision_id = :r AND firmware_family_id = :f AND quantity = 'current_scale'",
      { replacements: { r: setup.group.boardRevisionId, f: setup.group.firmwareFamilyId }, type: QueryTypes.SELECT },
    );
    expect(row.method).toBe("unverified");
    expect(row.evidence).toEqual({ readings: 0, cycles: 1, benchPoints: 0, photos: 0 });
    expect(row.group.currentScale).toEqual({ median: stats.median, n: stats.n });
    expect(row.group.voltageScale).toBeNull();
    // the most serious first; the one on screen is never its own next
    expect(page.rows[0].id).toBe(a);
    expect((await nextInQueue({}, a))?.id).toBe(page.rows[1].id);
    expect((await nextInQueue({}, page.rows[1].id))?.id).toBe(a);
  });
});

describe("revertable is true exactly when the revert succeeds", () => {
  it("for every listed event, across approvals, rejections, moved-on submissions, reverts of reverts, user changes and an admin's own submission", async () => {
    const adminAccount = await testAccount("admin");
    const decide = async (d: "approve" | "reject" | "request_changes", id: number, body: Record<string, unknown>) => {
      const res = await helpers.decideAs(d, id, body, moderator);
      expect(res.status, await res.clone().text()).toBe(200);
      return (await res.json()).event.id as number;
    };
    const approved = await helpers.insertSubmission(setup.fx, { currentScale: 402 });
    await decide("approve", approved, { version: 0 });
    const rejected = await helpers.insertSubmission(setup.fx, { currentScale: 398 });
    await decide("reject", rejected, { version: 0, reason: "Copied." });
    const movedOn = await helpers.insertSubmission(setup.fx, { currentScale: 401 });
    await decide("request_changes", movedOn, { version: 0, message: "Add a photo." }); // then approved: this one has moved on
    await decide("approve", movedOn, { version: 1 });
    const redo = await helpers.insertSubmission(setup.fx, { currentScale: 400 });
    const redoEvent = await decide("approve", redo, { version: 0 });
    expect((await revert(redoEvent)).status).toBe(200); // the approval is now reverted; the revert itself can be reverted
    const own = await helpers.insertSubmission(setup.fx, { currentScale: 399, contributorId: adminAccount.id });
    await decide("approve", own, { version: 0 });
    const person = await helpers.insertPerson("trusted-later@example.test", "Trusted Later");
    const patch = await import("@/app/api/v1/admin/users/[id]/route");
    const patched = await callRoute(
      patch.PATCH as (r: Request, c: unknown) => Promise<Response>,
      withCookie(
        new Request(`http://test.local/api/v1/admin/users/${person}`, {
          method: "PATCH",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ trusted: true }),
        }),
        admin,
      ),
      { params: Promise.resolve({ id: person }) },
    );
    expect(patched.status).toBe(200);

    const listedAs = async (eventId: number) => {
      const res = await get(eventsRoute, "/api/v1/moderation/events?pageSize=100", admin);
      return ((await res.json()).events as { id: number; revertable: boolean }[]).find((e) => e.id === eventId)!.revertable;
    };
    const ids = (await listAuditEvents({ pageSize: 100 })).events.map((e) => e.id);
    const seen = { revertable: 0, not: 0 };
    for (const id of ids) {
      const revertable = await listedAs(id); // read fresh: each revert below changes what can be undone
      const before = await helpers.writtenState();
      const res = await revert(id);
      expect(res.status === 200, `event ${id} listed as revertable=${revertable}, revert answered ${res.status}`).toBe(revertable);
      if (revertable) seen.revertable++;
      else {
        seen.not++;
        expect([403, 409]).toContain(res.status);
        expect(await helpers.writtenState()).toEqual(before);
      }
    }
    expect(seen.revertable).toBeGreaterThan(3);
    expect(seen.not).toBeGreaterThan(3);
  });

  it("a moderator reads nothing as revertable (only admins revert)", async () => {
    const res = await get(eventsRoute, "/api/v1/moderation/events", moderator);
    expect(((await res.json()).events as { revertable: boolean }[]).every((e) => !e.revertable)).toBe(true);
  });
});

describe("the admin's people list", () => {
  it("finds any part of a name or e-mail, case-insensitively, 20 a page, wildcards taken literally", async () => {
    for (let i = 1; i <= 25; i++) await helpers.insertPerson(`pilot${String(i).padStart(2, "0")}@findme.test`, `Search Pilot ${i}`);
    const list = async (qs: string) => {
      const res = await get(usersRoute, `/api/v1/admin/users?${qs}`, admin);
      expect(res.status).toBe(200);
      return res.json() as Promise<{ users: { email: string; name: string }[]; total: number; page: number; pageCount: number; pageSize: number }>;
    };
    const first = await list("q=FINDME");
    expect(first).toMatchObject({ total: 25, page: 1, pageCount: 2, pageSize: 20 });
    expect(first.users).toHaveLength(20);
    const second = await list("q=findme&page=2");
    expect(second.users).toHaveLength(5);
    expect(new Set([...first.users, ...second.users].map((u) => u.email)).size).toBe(25);
    expect((await list("q=search%20pilot%2017")).users.map((u) => u.name)).toEqual(["Search Pilot 17"]);
    expect((await list("q=%25")).total).toBe(0); // a literal "%": nobody's name or address has one
    expect((await list("q=_")).total).toBe(0);
    expect((await list("q=")).total).toBeGreaterThan(25); // empty: everyone
    await helpers.expectError(await get(usersRoute, `/api/v1/admin/users?q=${"x".repeat(101)}`, admin), 400, "q");
  });
});
