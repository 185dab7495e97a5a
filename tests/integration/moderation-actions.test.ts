import { QueryTypes } from "sequelize";
import { median } from "simple-statistics";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { POST as bulkRoute } from "@/app/api/v1/moderation/bulk-approve/route";
import { GET as eventsRoute } from "@/app/api/v1/moderation/events/route";
import { stopBoss } from "@/lib/jobs";
import { getValueHistory } from "@/lib/published/history";
import { CONFLICT_MESSAGE } from "@/lib/vocabulary";
import { db } from "@/models";
import { callRoute, sessionCookieFor, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import * as helpers from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// The three decisions through their routes: each is one transaction that changes the status and
// note, refreshes the group's published figures (approvals), writes one audit event, appends the
// history of what moved and queues the contributor's mail; a refused one writes nothing at all.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

// seven approved current scale settings around 400: enough for the median's 95 % interval (n ≥ 6)
const APPROVED = [397, 398, 399, 400, 401, 402, 403];
let setup: helpers.Setup;
let moderator: string;
beforeAll(async () => {
  setup = await helpers.setupGroup(APPROVED);
  moderator = await sessionCookieFor("moderator");
});

describe("approve", () => {
  it("publishes the value: status, one event, board_stats equal to a rebuild, history naming the event, the mail", async () => {
    const id = await helpers.insertSubmission(setup.fx, { currentScale: 410 });
    const res = await helpers.decideAs("approve", id, { version: 0, note: "Matches the bench fit." }, moderator);
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const body = await res.json();
    expect(body.submission).toEqual({ id, status: "approved", version: 1, moderatorNote: "Matches the bench fit." });
    const mod = await testAccount("moderator");
    expect(body.event).toMatchObject({
      action: "approve",
      actor: { id: mod.id },
      entity: { type: "submission", id },
      before: { status: "pending", moderatorNote: null, version: 0 },
      after: { status: "approved", moderatorNote: "Matches the bench fit.", version: 1 },
      reason: "Matches the bench fit.",
      revertable: true,
    });
    expect(body.changed).toEqual(["currentScale"]);

    // the published median moved to the median of the eight values (simple-statistics as the reference)
    const stats = await helpers.storedStats(setup.group);
    expect(stats).toEqual(await helpers.rebuiltStats(setup.group));
    expect(stats[0]).toMatchObject({ quantity: "current_scale", n: 8, median: median([...APPROVED, 410]) });

    // history: the baseline published before (no event), then the new figures with this event
    const history = await helpers.historyRows(setup.group);
    expect(history).toEqual([
      { quantity: "current_scale", recommendedValue: 400, n: 7, ciLow: 397, ciHigh: 403, eventId: null },
      { quantity: "current_scale", recommendedValue: stats[0].recommendedValue, n: 8, ciLow: 397, ciHigh: 410, eventId: body.event.id },
    ]);
    const [mail] = (await helpers.queuedMails("fixture@example.test")).filter((m) => m.subject.includes(`#${id} approved`));
    expect(mail.text).toContain("Matches the bench fit.");

    const timeline = await getValueHistory("fixture-board");
    expect(timeline!.series).toHaveLength(1);
    expect(timeline!.series[0]).toMatchObject({ revision: { label: "r1" }, family: { slug: "fixture-fw" }, quantity: "currentScale" });
    expect(timeline!.series[0].points.map((p) => [p.n, p.event?.action ?? null])).toEqual([
      [7, null],
      [8, "approve"],
    ]);
  });
});

describe("reject and request changes", () => {
  it("reject stores the reason as the contributor's note, leaves the published figures alone and mails the reason", async () => {
    const id = await helpers.insertSubmission(setup.fx, { currentScale: 420 });
    const statsBefore = await helpers.storedStats(setup.group);
    const historyBefore = await helpers.historyRows(setup.group);
    const res = await helpers.decideAs("reject", id, { version: 0, reason: "The cycles imply 369, not 420." }, moderator);
    expect(res.status).toBe(200);
    expect(await helpers.submissionRow(id)).toEqual({ status: "rejected", version: 1, moderatorNote: "The cycles imply 369, not 420." });
    expect((await res.json()).event).toMatchObject({ action: "reject", reason: "The cycles imply 369, not 420." });
    expect(await helpers.storedStats(setup.group)).toEqual(statsBefore);
    expect(await helpers.historyRows(setup.group)).toEqual(historyBefore);
    const mails = (await helpers.queuedMails("fixture@example.test")).filter((m) => m.subject.includes(`#${id} not accepted`));
    expect(mails).toHaveLength(1);
    expect(mails[0].text).toContain("The cycles imply 369, not 420.");
  });

  it("request changes stores the message in moderator_note and mails the edit link", async () => {
    const id = await helpers.insertSubmission(setup.fx, { currentScale: 401 });
    const res = await helpers.decideAs("request_changes", id, { version: 0, message: "Add the charger's mAh for the second pack." }, moderator);
    expect(res.status).toBe(200);
    expect(await helpers.submissionRow(id)).toEqual({ status: "changes_requested", version: 1, moderatorNote: "Add the charger's mAh for the second pack." });
    const [mail] = (await helpers.queuedMails("fixture@example.test")).filter((m) => m.subject.includes(`#${id}: changes requested`));
    expect(mail.text).toContain(`/my/submissions/${id}/edit`);
  });

  it("a submission sent back for changes may still be decided (with its new version)", async () => {
    const id = await helpers.insertSubmission(setup.fx, { currentScale: 401, status: "changes_requested" });
    expect((await helpers.decideAs("reject", id, { version: 0, reason: "No answer after two weeks." }, moderator)).status).toBe(200);
  });
});

describe("refused actions write nothing", () => {
  let id: number;
  beforeAll(async () => {
    id = await helpers.insertSubmission(setup.fx, { currentScale: 399 });
  });

  it.each([
    ["reject without a reason", "reject", { version: 0 }, 400, "reason"],
    ["reject with a blank reason", "reject", { version: 0, reason: "   " }, 400, "reason"],
    ["request changes without a message", "request_changes", { version: 0 }, 400, "message"],
    ["approve without a version", "approve", {}, 400, "version"],
    ["approve with a version that is not a number", "approve", { version: "0" }, 400, "version"],
    ["a reason over 4000 characters", "reject", { version: 0, reason: "x".repeat(4001) }, 400, "reason"],
  ] as const)("%s: %i naming the field", async (_name, decision, body, status, field) => {
    const before = await helpers.writtenState();
    await helpers.expectError(await helpers.decideAs(decision, id, body, moderator), status, field);
    expect(await helpers.writtenState()).toEqual(before);
  });

  it("a stale version: 409 'Someone else acted on this first'", async () => {
    const before = await helpers.writtenState();
    const error = await helpers.expectError(await helpers.decideAs("approve", id, { version: 3 }, moderator), 409, "version");
    expect(error.message.startsWith(CONFLICT_MESSAGE)).toBe(true);
    expect(await helpers.writtenState()).toEqual(before);
  });

  it.each(["999999", "0", "abc", "1e3"])("an unknown or impossible id (%s): 404", async (raw) => {
    const before = await helpers.writtenState();
    await helpers.expectError(await helpers.decideAs("approve", raw, { version: 0 }, moderator), 404, "id");
    expect(await helpers.writtenState()).toEqual(before);
  });

  it("a decided submission: 409 that says only an admin can undo it", async () => {
    const decided = await helpers.insertSubmission(setup.fx, { currentScale: 399, status: "approved" });
    const before = await helpers.writtenState();
    const error = await helpers.expectError(await helpers.decideAs("reject", decided, { version: 0, reason: "Changed my mind." }, moderator), 409);
    expect(error.message).toMatch(/approved.*only an admin can undo/i);
    expect(await helpers.writtenState()).toEqual(before);
  });

  it("a moderator's own submission: 403", async () => {
    const mod = await testAccount("moderator");
    const own = await helpers.insertSubmission(setup.fx, { currentScale: 399, contributorId: mod.id });
    const before = await helpers.writtenState();
    await helpers.expectError(await helpers.decideAs("approve", own, { version: 0 }, moderator), 403);
    expect(await helpers.writtenState()).toEqual(before);
  });

  it("a body that is not JSON: 400", async () => {
    const before = await helpers.writtenState();
    const request = new Request(`http://test.local/x`, { method: "POST", headers: { "content-type": "text/plain" }, body: "version=0" });
    const { POST } = await import("@/app/api/v1/moderation/submissions/[id]/approve/route");
    await helpers.expectError(await callRoute(POST, withCookie(request, moderator), { params: Promise.resolve({ id: String(id) }) }), 400);
    expect(await helpers.writtenState()).toEqual(before);
  });
});

describe("the audit log is append-only", () => {
  it("PostgreSQL refuses UPDATE, DELETE and TRUNCATE on audit_events and published_value_history", async () => {
    const sequelize = db();
    for (const sql of [
      "UPDATE audit_events SET reason = 'rewritten'",
      "DELETE FROM audit_events",
      "TRUNCATE audit_events CASCADE",
      "UPDATE published_value_history SET n = 0",
      "DELETE FROM published_value_history",
    ]) {
      await expect(sequelize.query(sql), sql).rejects.toThrow(/append-only/);
    }
    const [{ n }] = await sequelize.query<{ n: number }>("SELECT count(*)::int AS n FROM audit_events", { type: QueryTypes.SELECT });
    expect(n).toBeGreaterThan(0);
  });
});

describe("bulk approval", () => {
  const bulk = (body: unknown, cookie: string) =>
    callRoute(
      bulkRoute,
      withCookie(
        new Request("http://test.local/api/v1/moderation/bulk-approve", {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify(body),
        }),
        cookie,
      ),
    );

  it("approves the unflagged items one by one and reports the conflicted and the refused", async () => {
    const ok1 = await helpers.insertSubmission(setup.fx, { currentScale: 400 });
    const ok2 = await helpers.insertSubmission(setup.fx, { currentScale: 401 });
    const stale = await helpers.insertSubmission(setup.fx, { currentScale: 400 });
    const far = await helpers.insertSubmission(setup.fx, { currentScale: 900 }); // |z| far above 3.5
    const mismatch = await helpers.insertSubmission(setup.fx, { currentScale: 400, mismatch: true });
    const newcomer = await helpers.insertSubmission(setup.fx, { currentScale: 400, contributorId: await helpers.insertPerson("first-timer@example.test") });
    const eventsBefore = (await helpers.writtenState()).events as number;

    const res = await bulk(
      {
        items: [
          { id: ok1, version: 0 },
          { id: stale, version: 5 },
          { id: far, version: 0 },
          { id: mismatch, version: 0 },
          { id: newcomer, version: 0 },
          { id: 999999, version: 0 },
          { id: ok2, version: 0 },
        ],
      },
      moderator,
    );
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.approved).toEqual([ok1, ok2]);
    expect(body.conflicted).toEqual([stale]);
    expect(body.refused).toEqual([far, mismatch, newcomer, 999999]);
    expect(body.results.find((r: { id: number }) => r.id === far).message).toMatch(/flagged \(far from the approved values\)/);
    expect(body.results.find((r: { id: number }) => r.id === 999999).status).toBe(404);
    expect((await helpers.writtenState()).events).toBe(eventsBefore + 2);
    for (const id of [stale, far, mismatch, newcomer]) expect((await helpers.submissionRow(id)).status).toBe("pending");
    expect(await helpers.storedStats(setup.group)).toEqual(await helpers.rebuiltStats(setup.group));
  });

  it("refuses a bad list before writing anything, naming the item", async () => {
    const before = await helpers.writtenState();
    await helpers.expectError(await bulk({ items: [] }, moderator), 400, "items");
    await helpers.expectError(
      await bulk(
        {
          items: [
            { id: 1, version: 0 },
            { id: 1, version: 0 },
          ],
        },
        moderator,
      ),
      400,
      "items.1.id",
    );
    await helpers.expectError(await bulk({ items: Array.from({ length: 101 }, (_, i) => ({ id: i + 1, version: 0 })) }, moderator), 400, "items");
    expect(await helpers.writtenState()).toEqual(before);
  });
});

describe("GET /api/v1/moderation/events", () => {
  const get = (query: string) => callRoute(eventsRoute, withCookie(new Request(`http://test.local/api/v1/moderation/events${query}`), moderator));

  it("lists the log newest first, by submission or action", async () => {
    const id = await helpers.insertSubmission(setup.fx, { currentScale: 400 });
    await helpers.decideAs("request_changes", id, { version: 0, message: "Add the second pack." }, moderator);
    await helpers.decideAs("reject", id, { version: 1, reason: "No second pack came." }, moderator);
    const body = await (await get(`?submission=${id}`)).json();
    expect(body.events.map((e: { action: string }) => e.action)).toEqual(["reject", "request_changes"]);
    expect(body.total).toBe(2);
    const rejects = await (await get("?action=reject&pageSize=1")).json();
    expect(rejects.events).toHaveLength(1);
    expect(rejects.events[0].action).toBe("reject");
  });

  it.each([
    ["?action=delete", "action"],
    ["?submission=abc", "submission"],
    ["?user=42", "user"],
    ["?pageSize=500", "pageSize"],
  ])("%s: 400 naming %s", async (query, field) => {
    await helpers.expectError(await get(query), 400, field);
  });
});
