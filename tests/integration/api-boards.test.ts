import { QueryTypes } from "sequelize";
import { describe, expect, it } from "vitest";
import { GET as getBoard, POST as postBoard } from "@/app/api/v1/boards/[slug]/route";
import { GET as listBoardsRoute, POST as postBoards } from "@/app/api/v1/boards/route";
import { GET as unknownEndpoint } from "@/app/api/v1/[...path]/route";
import { BoardDetailResponseSchema, BoardListResponseSchema, type BoardListResponse } from "@/lib/catalogue/api-schemas";
import { getBoardBySlug } from "@/lib/catalogue/get-board";
import { listBoards } from "@/lib/catalogue/list-boards";
import { parseCatalogueParams, MAX_PAGE } from "@/lib/catalogue/search-params";
import { db } from "@/models";
import { setupTestDatabase } from "@/tests/support/database";

// GET /api/v1/boards and GET /api/v1/boards/{slug} against a clone of the seeded demo database.
setupTestDatabase("seeded");

const list = (query = "", headers: Record<string, string> = {}) =>
  listBoardsRoute(new Request(`http://test.local/api/v1/boards${query}`, { headers }), undefined);
const detail = (slug: string, headers: Record<string, string> = {}) =>
  getBoard(new Request(`http://test.local/api/v1/boards/${encodeURIComponent(slug)}`, { headers }), { params: Promise.resolve({ slug }) });

async function expectError(res: Response, status: number, field?: string) {
  expect(res.status).toBe(status);
  expect(res.headers.get("cache-control")).toBe("no-store");
  expect(res.headers.get("content-type")).toMatch(/^application\/json/);
  const body = await res.json();
  expect(Object.keys(body)).toEqual(["error"]);
  expect(Object.keys(body.error).sort()).toEqual(["code", "fieldErrors", "message", "status"]);
  expect(body.error.status).toBe(status);
  if (field) expect(body.error.fieldErrors[field]?.[0]).toEqual(expect.any(String));
  return body.error;
}

describe("GET /api/v1/boards", () => {
  it("lists the first page in name order with the documented shape", async () => {
    const res = await list();
    expect(res.status).toBe(200);
    const body: BoardListResponse = await res.json();
    expect(BoardListResponseSchema.safeParse(body).success).toBe(true);
    const [{ n }] = await db().query<{ n: number }>("SELECT count(*)::int AS n FROM board_models", { type: QueryTypes.SELECT });
    expect(body.total).toBe(n);
    expect(body.boards).toHaveLength(Math.min(20, n));
    expect(body.query).toEqual({ q: null, kind: null, mounting: null, sort: "name", page: 1, pageSize: 20 });
    expect(body.links.prev).toBeNull();
    expect(body.links.next).toBe(n > 20 ? "/api/v1/boards?page=2" : null);
    expect(body.boards[0].links.values).toBe(`/api/v1/boards/${body.boards[0].slug}/values`);
  });

  it("returns what lib/catalogue returns for the same parameters (one schema, one query)", async () => {
    const query = { q: "f7", kind: "flight_controller", sort: "values", pageSize: "5" };
    const body: BoardListResponse = await (await list(`?${new URLSearchParams(query)}`)).json();
    const parsed = parseCatalogueParams(query);
    if (!parsed.ok) throw new Error("the test's own parameters must parse");
    const direct = await listBoards(parsed.params);
    expect(body.boards.map((b) => b.slug)).toEqual(direct.rows.map((r) => r.slug));
    expect(body.total).toBe(direct.total);
    expect(body.boards.every((b) => b.kind === "flight_controller" && typeof b.score === "number")).toBe(true);
  });

  it("filters by mounting and pages on", async () => {
    const body: BoardListResponse = await (await list("?mounting=20x20&pageSize=2&page=2")).json();
    expect(body.boards.every((b) => b.mountingPattern === "20x20")).toBe(true);
    expect(body.query.page).toBe(2);
    expect(body.links.prev).toBe("/api/v1/boards?mounting=20x20&pageSize=2");
  });

  it("ignores parameters it does not know and treats empty ones as absent", async () => {
    const res = await list("?utm_source=x&kind=&q=");
    expect(res.status).toBe(200);
    expect((await res.json()).query.kind).toBeNull();
  });

  describe("400 with the parameter named", () => {
    it.each([
      ["page=abc", "page"],
      ["page=0", "page"],
      ["page=99999999999", "page"],
      ["page=-1", "page"],
      ["page=1.5", "page"],
      ["pageSize=101", "pageSize"],
      ["kind=x", "kind"],
      ["sort=x", "sort"],
      ["mounting=big", "mounting"],
      [`q=${"x".repeat(101)}`, "q"],
      ["page=1&page=2", "page"],
    ])("%s", async (query, field) => {
      const error = await expectError(await list(`?${query}`), 400, field);
      expect(error.code).toBe("bad_request");
      expect(error.message).toContain(field);
    });

    it("names every bad parameter at once", async () => {
      const error = await expectError(await list("?page=abc&kind=x&sort=x"), 400);
      expect(Object.keys(error.fieldErrors).sort()).toEqual(["kind", "page", "sort"]);
    });

    it("page=99999999999 says the limit", async () => {
      const error = await expectError(await list("?page=99999999999"), 400, "page");
      expect(error.fieldErrors.page[0]).toContain(String(MAX_PAGE));
    });
  });

  it("carries ETag and Cache-Control, and answers 304 to If-None-Match", async () => {
    const first = await list("?kind=aio");
    const etag = first.headers.get("etag");
    expect(etag).toMatch(/^".+"$/);
    expect(first.headers.get("cache-control")).toBe("public, max-age=60, stale-while-revalidate=300");
    const again = await list("?kind=aio", { "if-none-match": etag! });
    expect(again.status).toBe(304);
    expect(again.headers.get("etag")).toBe(etag);
    expect(await again.text()).toBe("");
    expect((await list("?kind=pdb", { "if-none-match": etag! })).status).toBe(200);
  });

  it("answers other methods with 405, an Allow header and the error body", async () => {
    const res = await postBoards(new Request("http://test.local/api/v1/boards", { method: "POST" }), undefined);
    expect(res.headers.get("allow")).toBe("GET, HEAD");
    expect((await expectError(res, 405)).code).toBe("method_not_allowed");
  });
});

describe("GET /api/v1/boards/{slug}", () => {
  it("returns the board with every revision's hardware, as lib/catalogue reads it", async () => {
    const [{ slug }] = await db().query<{ slug: string }>(
      "SELECT bm.slug FROM board_models bm JOIN board_revisions br ON br.board_model_id = bm.id GROUP BY bm.slug ORDER BY count(*) DESC, bm.slug LIMIT 1",
      { type: QueryTypes.SELECT },
    );
    const res = await detail(slug);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(BoardDetailResponseSchema.safeParse(body).success).toBe(true);
    const direct = (await getBoardBySlug(slug))!;
    expect(body.slug).toBe(slug);
    expect(body.revisions.map((r: { label: string }) => r.label)).toEqual(direct.revisions.map((r) => r.label));
    expect(body.revisions.map((r: { approvedCount: number }) => r.approvedCount)).toEqual(direct.revisions.map((r) => r.approvedCount));
    expect(body.revisions[0]).toHaveProperty("dividerRatio");
    expect(body.links).toEqual({ self: `/api/v1/boards/${slug}`, values: `/api/v1/boards/${slug}/values`, page: `/boards/${slug}` });
    expect(body).not.toHaveProperty("id");

    const etag = res.headers.get("etag")!;
    expect(res.headers.get("cache-control")).toMatch(/^public/);
    expect((await detail(slug, { "if-none-match": etag })).status).toBe(304);
  });

  it("404 naming slug for a board that does not exist", async () => {
    const error = await expectError(await detail("no-such-board"), 404, "slug");
    expect(error.code).toBe("not_found");
    await expectError(await detail("Not A Slug"), 404, "slug");
  });

  it("405 for writes", async () => {
    const res = await postBoard(new Request("http://test.local/api/v1/boards/x", { method: "POST" }), { params: Promise.resolve({ slug: "x" }) });
    await expectError(res, 405);
  });
});

describe("anything else under /api/v1", () => {
  it("is a JSON 404 in the one error shape", async () => {
    const res = await unknownEndpoint(new Request("http://test.local/api/v1/nothing/here"), { params: Promise.resolve({ path: ["nothing", "here"] }) });
    const error = await expectError(res, 404);
    expect(error.message).toContain("/api/v1/nothing/here");
  });
});
