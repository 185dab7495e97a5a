import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as getOne } from "@/app/api/v1/submissions/[id]/route";
import { GET as listRoute } from "@/app/api/v1/submissions/route";
import { stopBoss } from "@/lib/jobs";
import { getOwnSubmission, listOwnSubmissions } from "@/lib/submissions";
import { db } from "@/models";
import { callRoute, sessionCookieFor, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { expectError, mailsTo, patch, pickTarget, post, rowCounts, validBody, type Target } from "./submissions-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// PATCH /api/v1/submissions/{id}: owner only, only while pending or changes requested, and
// optimistic concurrency on `version` (409 when stale). Against real PostgreSQL.
setupTestDatabase("seeded");
afterAll(() => stopBoss());

let target: Target;
let owner: string;
let ownerAccount: { id: string; email: string };
beforeAll(async () => {
  target = await pickTarget();
  owner = await sessionCookieFor("contributor");
  ownerAccount = await testAccount("contributor");
});

async function created(overrides = {}): Promise<{ id: number; version: number }> {
  const res = await post(validBody(target, overrides), owner);
  expect(res.status).toBe(201);
  return (await res.json()).submission;
}

const setStatus = (id: number, status: string, note: string | null = null) =>
  db().query("UPDATE submissions SET status = $2, moderator_note = $3 WHERE id = $1", { bind: [id, status, note] });

describe("editing one's own submission", () => {
  it("replaces the values and evidence, bumps the version and keeps it pending (no status change, no mail)", async () => {
    const s = await created();
    const mails = (await mailsTo(ownerAccount.email)).length;
    const body = {
      ...validBody(target, { currentScale: 1840, cycles: [{ scaleUsed: 2000, reportedMah: 1150, chargedMah: 1250, ratedMah: 1500, cells: 4 }] }),
      version: s.version,
    };
    const res = await patch(s.id, body, owner);
    expect(res.status).toBe(200);
    const { submission } = await res.json();
    expect(submission).toMatchObject({ id: s.id, version: s.version + 1, status: "pending", currentScale: 1840 });
    expect(submission.cycles).toHaveLength(1);
    const [{ n }] = await db().query<{ n: number }>("SELECT count(*)::int AS n FROM submission_cycles WHERE submission_id = $1", {
      bind: [s.id],
      type: QueryTypes.SELECT,
    });
    expect(n).toBe(1);
    expect((await mailsTo(ownerAccount.email)).length).toBe(mails);
  });

  it("an edit after 'changes requested' sends it back to pending review, and mails that", async () => {
    const s = await created();
    await setStatus(s.id, "changes_requested", "Please add the **charged** mAh of the third pack.");
    const res = await patch(s.id, { ...validBody(target), version: s.version }, owner);
    expect(res.status).toBe(200);
    expect((await res.json()).submission.status).toBe("pending");
    const mail = (await mailsTo(ownerAccount.email)).at(-1)!;
    expect(mail.subject).toBe(`Shuntbook: Submission #${s.id} updated: back in the review queue`);
  });

  it("a stale version is a 409 naming version, and changes nothing", async () => {
    const s = await created();
    expect((await patch(s.id, { ...validBody(target, { currentScale: 1830 }), version: s.version }, owner)).status).toBe(200);
    const before = await rowCounts();
    const error = await expectError(await patch(s.id, { ...validBody(target, { currentScale: 1825 }), version: s.version }, owner), 409, "version");
    expect(error.code).toBe("conflict");
    expect(error.message).toMatch(/changed since you loaded it/);
    expect(await rowCounts()).toEqual(before);
    expect((await getOwnSubmission(ownerAccount.id, s.id))!.currentScale).toBe(1830);
  });

  it("two edits from the same version at the same instant: one wins, the other gets 409", async () => {
    const s = await created();
    const [a, b] = await Promise.all([
      patch(s.id, { ...validBody(target, { currentScale: 1800 }), version: s.version }, owner),
      patch(s.id, { ...validBody(target, { currentScale: 1805 }), version: s.version }, owner),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect((await getOwnSubmission(ownerAccount.id, s.id))!.version).toBe(s.version + 1);
  });

  it.each(["approved", "rejected"])("a %s submission can no longer be edited (409)", async (status) => {
    const s = await created();
    await setStatus(s.id, status);
    const error = await expectError(await patch(s.id, { ...validBody(target), version: s.version }, owner), 409);
    expect(error.message).toMatch(/can no longer be edited/);
  });

  it("the edit is validated like a new submission, keyed by the same paths", async () => {
    const s = await created();
    await expectError(
      await patch(
        s.id,
        { ...validBody(target, { cycles: [{ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 99 }] }), version: s.version },
        owner,
      ),
      400,
      "cycles.0.cells",
    );
    await expectError(await patch(s.id, validBody(target), owner), 400, "version");
  });

  it("someone else's submission: 403 for the edit, 404 for reading it", async () => {
    const s = await created();
    const other = await sessionCookieFor("contributor", { email: "someone-else@auth.test" });
    await expectError(await patch(s.id, { ...validBody(target), version: s.version }, other), 403);
    await expectError(
      await callRoute(getOne, withCookie(new Request(`http://test.local/api/v1/submissions/${s.id}`), other), {
        params: Promise.resolve({ id: String(s.id) }),
      }),
      404,
      "id",
    );
    const mine = await callRoute(getOne, withCookie(new Request(`http://test.local/api/v1/submissions/${s.id}`), owner), {
      params: Promise.resolve({ id: String(s.id) }),
    });
    expect(mine.status).toBe(200);
  });

  it("an id that does not exist, or cannot be one, is a 404", async () => {
    await expectError(await patch(987_654, { ...validBody(target), version: 0 }, owner), 404, "id");
    await expectError(await patch("abc", { ...validBody(target), version: 0 }, owner), 404, "id");
  });
});

describe("My submissions", () => {
  it("lists the owner's submissions newest first with status, moderator note and whether each can be edited", async () => {
    const s = await created();
    await setStatus(s.id, "changes_requested", "Which pack was this?");
    const { submissions: list } = await listOwnSubmissions(ownerAccount.id);
    expect(list[0]).toMatchObject({
      id: s.id,
      status: "changes_requested",
      moderatorNote: "Which pack was this?",
      editable: true,
      links: { edit: `/my/submissions/${s.id}/edit` },
    });
    const times = list.map((x) => x.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(list.every((x) => x.editable === (x.status === "pending" || x.status === "changes_requested"))).toBe(true);
  });

  it("filters by status and pages newest first, with counts per status for the filter (issue 13: 25 cards were 12,800 px on a phone)", async () => {
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) ids.push((await created()).id);
    await setStatus(ids[0], "rejected", "No evidence.");
    const all = await listOwnSubmissions(ownerAccount.id, { status: null, page: 1, pageSize: 2 });
    expect(all.submissions).toHaveLength(2);
    expect(all.total).toBe(all.counts.all);
    expect(all.pageCount).toBe(Math.ceil(all.counts.all / 2));
    expect(all.counts.pending + all.counts.approved + all.counts.rejected + all.counts.changes_requested).toBe(all.counts.all);
    // newest first across pages: page 2 starts where page 1 ends
    const second = await listOwnSubmissions(ownerAccount.id, { status: null, page: 2, pageSize: 2 });
    expect(second.submissions[0].createdAt <= all.submissions[1].createdAt).toBe(true);
    expect(second.submissions.map((x) => x.id)).not.toContain(all.submissions[1].id);
    const rejected = await listOwnSubmissions(ownerAccount.id, { status: "rejected", page: 1, pageSize: 10 });
    expect(rejected.submissions.map((x) => x.id)).toContain(ids[0]);
    expect(rejected.submissions.every((x) => x.status === "rejected")).toBe(true);
    expect(rejected.total).toBe(rejected.counts.rejected);
  });

  it("GET /api/v1/submissions refuses an unknown status or page 0 with the field named, and pages with the query", async () => {
    await expectError(await callRoute(listRoute, withCookie(new Request("http://localhost/api/v1/submissions?status=lost"), owner)), 400, "status");
    await expectError(await callRoute(listRoute, withCookie(new Request("http://localhost/api/v1/submissions?page=0"), owner)), 400, "page");
    const res = await callRoute(listRoute, withCookie(new Request("http://localhost/api/v1/submissions?pageSize=1"), owner));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.submissions).toHaveLength(1);
    expect(body).toMatchObject({ page: 1, pageSize: 1, status: null });
  });
});
