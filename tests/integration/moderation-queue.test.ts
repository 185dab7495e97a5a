import { QueryTypes } from "sequelize";
import { median, medianAbsoluteDeviation } from "simple-statistics";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as queueRoute } from "@/app/api/v1/moderation/queue/route";
import { GET as reviewRoute } from "@/app/api/v1/moderation/submissions/[id]/route";
import { stopBoss } from "@/lib/jobs";
import { approveSubmission, getReview, listQueue, type QueueRow } from "@/lib/moderation";
import { refreshGroups } from "@/lib/published/refresh";
import { db } from "@/models";
import { callRoute, sessionCookieFor, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { expectError, insertPerson, insertSubmission, setupGroup, storedStats, type Setup } from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// The queue and the review on a group whose figures are known. Outside references: the modified
// z-score M = 0.6745 (x − median) / MAD (NIST/SEMATECH e-Handbook §1.3.5.17, after Iglewicz &
// Hoaglin, 1993) with the median and the unscaled MAD from simple-statistics; the sign-test
// interval for the median is (x(1), x(n)) for n = 7 and 8 because P(B < 2) = 8/128 and 9/256 for
// B ~ Bin(n, 1/2) both exceed 2.5 % (binomial arithmetic; Conover, Practical Nonparametric
// Statistics, from memory).
setupTestDatabase("migrated");
afterAll(() => stopBoss());

const APPROVED = [397, 398, 399, 400, 401, 402, 403];
const nist = (x: number) => (0.6745 * (x - median(APPROVED))) / medianAbsoluteDeviation(APPROVED);

let setup: Setup;
let moderator: string;
const ids: Record<string, number> = {};
beforeAll(async () => {
  setup = await setupGroup(APPROVED);
  moderator = await sessionCookieFor("moderator");
  const newcomer = await insertPerson("newcomer@example.test", "New Pilot");
  // median 400, MAD 2: |M| > 3.5 from |x − 400| > 10.38
  ids.farthest = await insertSubmission(setup.fx, { currentScale: 470, mismatch: true, ageHours: 1 });
  ids.far = await insertSubmission(setup.fx, { currentScale: 460, ageHours: 2 });
  ids.justOut = await insertSubmission(setup.fx, { currentScale: 415, ageHours: 30 });
  ids.mismatch = await insertSubmission(setup.fx, { currentScale: 401, mismatch: true, ageHours: 50 });
  ids.newcomer = await insertSubmission(setup.fx, { currentScale: 400, contributorId: newcomer, ageHours: 5 });
  ids.old = await insertSubmission(setup.fx, { currentScale: 402, ageHours: 240 });
  ids.tooFew = await insertSubmission(setup.fx, { currentScale: null, voltageScale: 110, ageHours: 4 }); // no approved voltage values: not judged
  ids.recent = await insertSubmission(setup.fx, { currentScale: 410, ageHours: 3 }); // M = 3.37: inside the cut-off
});

const order = (rows: QueueRow[]) => rows.map((r) => Object.entries(ids).find(([, id]) => id === r.id)![0]);

describe("listQueue", () => {
  it("orders by severity: outliers by |z|, then evidence mismatches, then first-time contributors, then the rest oldest first", async () => {
    const page = await listQueue();
    expect(order(page.rows)).toEqual(["farthest", "far", "justOut", "mismatch", "newcomer", "old", "tooFew", "recent"]);
    expect(page.counts).toEqual({ all: 8, outlier: 3, mismatch: 2, new: 1, none: 3 });
    expect(page).toMatchObject({ total: 8, page: 1, pageSize: 20, pageCount: 1 });
    expect(page.boards).toEqual([{ slug: "fixture-board", name: "Fixture Board", pending: 8 }]);
  });

  it("scores each value with the NIST modified z against the approved values (simple-statistics median and MAD)", async () => {
    const rows = (await listQueue()).rows;
    for (const [name, x] of [
      ["far", 460],
      ["justOut", 415],
      ["recent", 410],
      ["old", 402],
    ] as const) {
      const row = rows.find((r) => r.id === ids[name])!;
      expect(row.flags.modifiedZ.currentScale).toBeCloseTo(nist(x), 9);
      expect(row.flags.outlier).toBe(Math.abs(nist(x)) > 3.5);
    }
    const tooFew = rows.find((r) => r.id === ids.tooFew)!;
    expect(tooFew.flags).toMatchObject({ modifiedZ: { voltageScale: null, currentScale: null }, maxAbsZ: null, outlier: false, raised: [] });
    expect(rows.find((r) => r.id === ids.farthest)!.flags.raised).toEqual(["outlier", "mismatch"]);
    expect(rows.find((r) => r.id === ids.newcomer)!.flags.raised).toEqual(["new"]);
  });

  it("filters by flag and age; badge counts follow the age filter but not the flag", async () => {
    expect(order((await listQueue({ flag: "none" })).rows)).toEqual(["old", "tooFew", "recent"]);
    expect(order((await listQueue({ flag: "mismatch" })).rows)).toEqual(["farthest", "mismatch"]);
    const day = await listQueue({ age: "day", flag: "outlier" });
    expect(order(day.rows)).toEqual(["farthest", "far"]);
    expect(day.counts).toEqual({ all: 5, outlier: 2, mismatch: 1, new: 1, none: 2 });
    expect(day.total).toBe(2);
    expect((await listQueue({ age: "week" })).total).toBe(7);
    expect(order((await listQueue({ age: "older" })).rows)).toEqual(["old"]);
    expect((await listQueue({ board: "fixture-board" })).total).toBe(8);
  });

  it("sorts by age and pages on the server without overlap", async () => {
    expect(order((await listQueue({ sort: "oldest" })).rows)).toEqual(["old", "mismatch", "justOut", "newcomer", "tooFew", "recent", "far", "farthest"]);
    expect(order((await listQueue({ sort: "newest" })).rows)).toEqual(["farthest", "far", "recent", "tooFew", "newcomer", "justOut", "mismatch", "old"]);
    const pages = await Promise.all([1, 2, 3, 4].map((page) => listQueue({ page, pageSize: 3 })));
    expect(pages.map((p) => p.rows.length)).toEqual([3, 3, 2, 0]);
    expect(pages[0].pageCount).toBe(3);
    expect(pages.flatMap((p) => order(p.rows))).toEqual(order((await listQueue()).rows));
  });

  it("with no spread at all among the approved values, any value off the median is an outlier (lib/stats' rule), shown first", async () => {
    // three approved voltage settings that tie exactly: MAD = mean absolute deviation = 0
    for (let i = 0; i < 3; i++) await insertSubmission(setup.fx, { currentScale: null, voltageScale: 110, status: "approved" });
    await refreshGroups(db(), [setup.group]);
    const onTheMedian = (await listQueue()).rows.find((r) => r.id === ids.tooFew)!;
    expect(onTheMedian.flags).toMatchObject({ outlier: false, modifiedZ: { voltageScale: 0 } });
    const off = await insertSubmission(setup.fx, { currentScale: null, voltageScale: 111, ageHours: 6 });
    const after = await listQueue();
    expect(after.rows[0]).toMatchObject({ id: off, flags: { outlier: true, maxAbsZ: null, raised: ["outlier"] } });
  });
});

describe("GET /api/v1/moderation/queue", () => {
  const get = (query: string) => callRoute(queueRoute, withCookie(new Request(`http://test.local/api/v1/moderation/queue${query}`), moderator));

  it("answers the same page as listQueue, privately", async () => {
    const res = await get("?flag=outlier&pageSize=2");
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const body = await res.json();
    expect(body.rows).toHaveLength(2);
    expect(body.params).toMatchObject({ flag: "outlier", pageSize: 2, page: 1, sort: "severity" });
  });

  it.each([
    ["?flag=urgent", "flag"],
    ["?age=month", "age"],
    ["?sort=random", "sort"],
    ["?page=0", "page"],
    ["?page=two", "page"],
    ["?pageSize=101", "pageSize"],
    ["?board=Not%20A%20Slug", "board"],
    ["?board=no-such-board", "board"],
    ["?flag=outlier&flag=new", "flag"],
  ])("%s: 400 naming %s", async (query, field) => {
    await expectError(await get(query), 400, field);
  });
});

describe("getReview", () => {
  it("shows where the value falls and how the published figures would move; approving publishes exactly that", async () => {
    const id = ids.justOut;
    const review = (await getReview(id))!;
    expect(review.submission).toMatchObject({ id, status: "pending", version: 0, currentScale: 415 });
    expect(review.flags.raised).toEqual(["outlier"]);
    const q = review.quantities.find((x) => x.quantity === "currentScale")!;
    expect(q.value).toBe(415);
    expect(q.approved.map((p) => p.value)).toEqual(APPROVED);
    expect(q.placement!.modifiedZ).toBeCloseTo(nist(415), 9);
    expect(q.placement).toMatchObject({ outlier: true, rule: "mad", belowShare: 1 });
    expect(q.now).toMatchObject({ n: 7, median: median(APPROVED), ciLow: 397, ciHigh: 403, mad: medianAbsoluteDeviation(APPROVED) });
    expect(q.ifApproved).toMatchObject({ n: 8, median: median([...APPROVED, 415]), ciLow: 397, ciHigh: 415 });
    expect(q.moves).toMatchObject({ n: 1, median: median([...APPROVED, 415]) - median(APPROVED), ciLow: 0, ciHigh: 12 });
    // a quantity the submission leaves out moves nothing
    expect(review.quantities.find((x) => x.quantity === "currentOffset")).toMatchObject({ value: null, moves: null, placement: null });

    // the contributor's record: everything approved in the group is theirs (the fixture has one contributor)
    const [{ approved }] = await db().query<{ approved: number }>("SELECT count(*)::int AS approved FROM submissions WHERE status = 'approved'", {
      type: QueryTypes.SELECT,
    });
    expect(review.contributor.record.approved).toBe(approved);
    expect(review.contributor.trust).toMatchObject({ trusted: true, reason: "record" });
    expect(review.contributor.otherForBoard.map((o) => o.id)).toContain(ids.far);
    expect(review.contributor.otherForBoard.map((o) => o.id)).not.toContain(id);
    expect(review.events).toEqual([]);

    const moderatorAccount = await testAccount("moderator");
    // far off, so (issue 13) approving it needs a reason
    await approveSubmission(moderatorAccount, id, { version: 0, reason: "The photo shows this revision's other shunt." });
    const [published] = (await storedStats(setup.group)).filter((r) => r.quantity === "current_scale");
    expect(published).toMatchObject({
      n: q.ifApproved!.n,
      median: q.ifApproved!.median,
      ciLow: q.ifApproved!.ciLow,
      ciHigh: q.ifApproved!.ciHigh,
      recommendedValue: q.ifApproved!.recommendedValue,
      confidence: q.ifApproved!.confidence,
      outlierCount: q.ifApproved!.outlierCount,
    });
    const after = (await getReview(id))!;
    expect(after.events.map((e) => e.action)).toEqual(["approve"]);
  });

  it("lists the evidence rows and photos, removed photos marked", async () => {
    const id = ids.mismatch;
    const sequelize = db();
    await sequelize.query(
      `INSERT INTO submission_cycles (submission_id, position, scale_used, reported_mah, charged_mah, rated_mah, cells) VALUES (:id, 0, 400, 1200, 1300, 1500, 4)`,
      { replacements: { id } },
    );
    await sequelize.query(
      `INSERT INTO evidence_photos (uploader_id, submission_id, object_key, content_type, byte_size, width, height, sha256, created_at, deleted_at) VALUES
         (:u, :id, 'evidence/00000000-0000-4000-8000-000000000001.jpg', 'image/jpeg', 1000, 640, 480, repeat('a', 64), now() - interval '1 hour', NULL),
         (:u, :id, 'evidence/00000000-0000-4000-8000-000000000002.jpg', 'image/jpeg', 1000, 640, 480, repeat('b', 64), now() - interval '1 hour', now())`,
      { replacements: { id, u: setup.fx.userId } },
    );
    const review = (await getReview(id))!;
    expect(review.submission.cycles).toEqual([{ scaleUsed: 400, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 4 }]);
    expect(review.photos).toHaveLength(2);
    expect(review.photos.map((p) => p.removedAt === null)).toEqual([true, false]);
    expect(review.photos[0].url).toMatch(/^\/api\/v1\/photos\/[0-9a-f-]{36}$/);
    expect(review.flags.raised).toEqual(["mismatch"]);
  });

  it("the route: 404 for an unknown or impossible id", async () => {
    for (const raw of ["999999", "x1"]) {
      const res = await callRoute(reviewRoute, withCookie(new Request(`http://test.local/api/v1/moderation/submissions/${raw}`), moderator), {
        params: Promise.resolve({ id: raw }),
      });
      await expectError(res, 404, "id");
    }
  });
});
