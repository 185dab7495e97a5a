import { QueryTypes, type Transaction } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { POST as revertRoute } from "@/app/api/v1/admin/events/[id]/revert/route";
import { GET } from "@/app/api/v1/boards/[slug]/values/route";
import { stopBoss } from "@/lib/jobs";
import { checkBoardValuesFeed, invalidateBoardValues, loadBoardValues } from "@/lib/published/board-values";
import { refreshGroups } from "@/lib/published/refresh";
import { db } from "@/models";
import { callRoute, sessionCookieFor, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { decideAs, insertSubmission, setupGroup, type Setup } from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// The values' change stamp (board_models.values_version, migrations/20261212001000-…) and what
// the cache and the endpoint do with it: bumped in the same transaction as the refresh, by every
// moderation action that moves an approved value and by catalogue edits; a point-free view never
// reads the points; the bytes kept per view are the JSON every request gets.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

const SLUG = "fixture-board"; // tests/support/fixtures.ts

let setup: Setup;
let moderator: string;
let admin: string;
beforeAll(async () => {
  setup = await setupGroup([397, 398, 399, 400, 401, 402, 403]);
  moderator = await sessionCookieFor("moderator");
  admin = await sessionCookieFor("admin");
});

const call = (query = "", headers: Record<string, string> = {}) =>
  GET(new Request(`http://test.local/api/v1/boards/${SLUG}/values${query}`, { headers }), { params: Promise.resolve({ slug: SLUG }) });

const versionOf = async (boardId: number, transaction?: Transaction) => {
  const [row] = await db().query<{ v: string }>("SELECT values_version::text AS v FROM board_models WHERE id = $id", {
    bind: { id: boardId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return row.v;
};

const currentScaleN = async (res: Response) => (await res.json()).revisions[0].families[0].currentScale.n as number;

describe("the values' change stamp", () => {
  it("a refresh bumps it to its own transaction, visible to others only on commit, and a rollback leaves it", async () => {
    const { boardId } = setup.fx;
    const before = await versionOf(boardId);
    let inside = "";
    let xact = "";
    let seenOutside = "";
    await db().transaction(async (transaction) => {
      await refreshGroups(db(), [setup.group], transaction);
      inside = await versionOf(boardId, transaction);
      [{ xact }] = await db().query<{ xact: string }>("SELECT pg_current_xact_id()::text AS xact", { type: QueryTypes.SELECT, transaction });
      seenOutside = await versionOf(boardId); // another pooled connection: the old stamp until commit
    });
    expect(inside).toBe(xact);
    expect(seenOutside).toBe(before);
    expect(await versionOf(boardId)).toBe(xact);

    await db()
      .transaction(async (transaction) => {
        await refreshGroups(db(), [setup.group], transaction);
        throw new Error("roll back");
      })
      .catch(() => undefined);
    expect(await versionOf(boardId)).toBe(xact);
  });

  it("the whole-table refresh (npm run stats:rebuild) bumps every board", async () => {
    const [{ n }] = await db().query<{ n: number }>("SELECT count(*)::int AS n FROM board_models", { type: QueryTypes.SELECT });
    await db().transaction(async (transaction) => {
      await refreshGroups(db(), null, transaction);
      const [{ bumped }] = await db().query<{ bumped: number }>(
        "SELECT count(*)::int AS bumped FROM board_models WHERE values_version = pg_current_xact_id()",
        { type: QueryTypes.SELECT, transaction },
      );
      expect(bumped).toBe(n);
    });
  });

  it("catalogue edits shown in the response bump it; a maker's other details do not", async () => {
    const { boardId, revisionIds, familyId } = setup.fx;
    const s = db();
    const bumps = async (sql: string, bind: Record<string, unknown>) => {
      const before = await versionOf(boardId);
      await s.query(sql, { bind });
      return (await versionOf(boardId)) !== before;
    };
    expect(await bumps("UPDATE board_models SET name = name || '' WHERE id = $id", { id: boardId })).toBe(true);
    expect(await bumps("UPDATE board_revisions SET label = label WHERE id = $id", { id: revisionIds[0] })).toBe(true);
    expect(
      await bumps("UPDATE manufacturers SET name = name || ' Co' WHERE id = (SELECT manufacturer_id FROM board_models WHERE id = $id)", { id: boardId }),
    ).toBe(true);
    expect(
      await bumps("UPDATE manufacturers SET website = 'https://maker.example.test' WHERE id = (SELECT manufacturer_id FROM board_models WHERE id = $id)", {
        id: boardId,
      }),
    ).toBe(false);
    expect(await bumps("UPDATE firmware_families SET description = 'units changed' WHERE id = $id", { id: familyId })).toBe(true);
  });
});

describe("the cache follows moderation", () => {
  it("an approval and its revert each give a new body and a new tag at once", async () => {
    const first = await call();
    const etag = first.headers.get("etag")!;
    const n = await currentScaleN(first);

    const id = await insertSubmission(setup.fx, { currentScale: 460 });
    const approved = await decideAs("approve", id, { version: 0, reason: "Checked against the photo." }, moderator);
    expect(approved.status).toBe(200);
    const eventId = (await approved.json()).event.id as number;

    const afterApproval = await call("", { "if-none-match": etag });
    expect(afterApproval.status).toBe(200);
    const approvedTag = afterApproval.headers.get("etag")!;
    expect(approvedTag).not.toBe(etag);
    expect(await currentScaleN(afterApproval)).toBe(n + 1);

    const reverted = await callRoute(
      revertRoute,
      withCookie(
        new Request(`http://test.local/api/v1/admin/events/${eventId}/revert`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ reason: "Approved by mistake: wrong board in the photo." }),
        }),
        admin,
      ),
      { params: Promise.resolve({ id: String(eventId) }) },
    );
    expect(reverted.status).toBe(200);
    const afterRevert = await call("", { "if-none-match": approvedTag });
    expect(afterRevert.status).toBe(200);
    expect(afterRevert.headers.get("etag")).not.toBe(approvedTag);
    expect(await currentScaleN(afterRevert)).toBe(n);
  });

  it("a change committed elsewhere (no invalidation in this process) shows after a look at the change feed", async () => {
    const before = await call();
    const etag = before.headers.get("etag")!;
    const n = await currentScaleN(before);
    // what another process does: approve and refresh, without this process's invalidateBoardValues
    const id = await insertSubmission(setup.fx, { currentScale: 401 });
    await db().transaction(async (transaction) => {
      await db().query("UPDATE submissions SET status = 'approved', updated_at = now() WHERE id = $id", { bind: { id }, transaction });
      await refreshGroups(db(), [setup.group], transaction);
    });
    await checkBoardValuesFeed();
    const after = await call("", { "if-none-match": etag });
    expect(after.status).toBe(200);
    expect(await currentScaleN(after)).toBe(n + 1);
  });
});

describe("points are read only when asked for", () => {
  it("a point-free miss runs no points query and carries no points; points=1 reads and flags them", async () => {
    invalidateBoardValues(null);
    const spy = vi.spyOn(db(), "query");
    try {
      const plain = await loadBoardValues(SLUG);
      const pointQueries = () => spy.mock.calls.filter(([sql]) => typeof sql === "string" && /FROM submissions/.test(sql)).length;
      expect(pointQueries()).toBe(0);
      expect(JSON.stringify(plain!.values)).not.toContain('"points"');

      const withPoints = await loadBoardValues(SLUG, { points: true });
      expect(pointQueries()).toBe(1);
      const q = withPoints!.values.revisions[0].families[0].currentScale!;
      expect(q.points).toHaveLength(q.n);
      expect(q.points![0]).toHaveProperty("modifiedZ");
    } finally {
      spy.mockRestore();
    }
  });

  it("the API's point-free view is the points view without its points", async () => {
    const plain = await (await call()).json();
    const full = await (await call("?points=1")).json();
    for (const r of full.revisions) for (const g of r.families) for (const k of ["voltageScale", "currentScale", "currentOffset"]) if (g[k]) delete g[k].points;
    expect(plain).toEqual(full);
  });
});

describe("the bytes kept per view", () => {
  it("are the same JSON on every request and for every Accept-Encoding (Next compresses on the way out), with Vary on 200 and 304", async () => {
    for (const query of ["", "?points=1"]) {
      const first = await call(query);
      const text = await first.text();
      const etag = first.headers.get("etag")!;
      for (const header of ["", "gzip, deflate, br", "gzip"]) {
        const res = await call(query, header ? { "accept-encoding": header } : {});
        expect(res.status).toBe(200);
        // a handler's Content-Encoding would be dropped by Next 16 (see lib/published/api-response.ts)
        expect(res.headers.get("content-encoding")).toBeNull();
        expect(res.headers.get("vary")).toBe("Accept-Encoding");
        expect(res.headers.get("etag")).toBe(etag);
        expect(res.headers.get("cache-control")).toMatch(/max-age=60/);
        expect(await res.text()).toBe(text);
      }
      const revalidated = await call(query, { "accept-encoding": "gzip, br", "if-none-match": etag });
      expect(revalidated.status).toBe(304);
      expect(revalidated.headers.get("vary")).toBe("Accept-Encoding");
    }
  });
});
