import request from "supertest";
import { describe, expect, it } from "vitest";

// The API through the real server: `npm test` builds the app and serves it on a seeded database at
// SHUNTBOOK_TEST_APP_URL. These check what only the running app shows: routing, the headers as they
// leave Next, conditional requests end to end, the JSON 404 under /api/v1, and the docs page.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

describe.skipIf(!appUrl)("the API served by next start", () => {
  const app = () => request(appUrl!);

  it("GET /api/v1/boards: 200 JSON with ETag and Cache-Control, then 304 to If-None-Match", async () => {
    const first = await app().get("/api/v1/boards?pageSize=3").expect(200);
    expect(first.headers["content-type"]).toMatch(/^application\/json/);
    expect(first.headers["cache-control"]).toBe("public, max-age=60, stale-while-revalidate=300");
    expect(first.body.boards).toHaveLength(3);
    const etag = first.headers.etag;
    expect(etag).toMatch(/^"/);
    await app().get("/api/v1/boards?pageSize=3").set("If-None-Match", etag).expect(304);
  });

  it("GET /api/v1/boards?page=abc: 400 naming page, not cached", async () => {
    const res = await app().get("/api/v1/boards?page=abc").expect(400);
    expect(res.headers["cache-control"]).toBe("no-store");
    expect(res.body.error.fieldErrors.page).toHaveLength(1);
  });

  it("GET /api/v1/boards/{slug}/values?points=1 and its revalidation", async () => {
    const slug = (await app().get("/api/v1/boards?sort=values&pageSize=1").expect(200)).body.boards[0].slug;
    const res = await app().get(`/api/v1/boards/${slug}/values?points=1`).expect(200);
    const q = res.body.revisions.flatMap((r: { families: Record<string, unknown>[] }) => r.families)[0].voltageScale;
    expect(q).toHaveProperty("median");
    expect(q.points[0]).toHaveProperty("modifiedZ");
    await app().get(`/api/v1/boards/${slug}/values?points=1`).set("If-None-Match", res.headers.etag).expect(304);
    await app().get(`/api/v1/boards/${slug}/values?points=maybe`).expect(400);
  });

  it("unknown slugs and unknown endpoints are JSON 404s", async () => {
    const board = await app().get("/api/v1/boards/no-such-board").expect(404);
    expect(board.body.error.code).toBe("not_found");
    const values = await app().get("/api/v1/boards/no-such-board/values").expect(404);
    expect(values.body.error.fieldErrors.slug).toHaveLength(1);
    const other = await app().get("/api/v1/no/such/endpoint").expect(404);
    expect(other.headers["content-type"]).toMatch(/^application\/json/);
  });

  it("writes are 405 with Allow", async () => {
    const res = await app().post("/api/v1/boards").send({}).expect(405);
    expect(res.headers.allow).toBe("GET, HEAD");
  });

  it("serves openapi.json and the docs page that renders it", async () => {
    const doc = await app().get("/api/v1/openapi.json").expect(200);
    expect(doc.body.openapi).toMatch(/^3\./);
    const page = await app().get("/api-docs").expect(200);
    // booleans, so a failure does not print the whole page
    expect(page.text.includes("/api/v1/boards/{slug}/values"), "the values endpoint is listed").toBe(true);
    expect(page.text.includes("curl -s"), "an example curl line is shown").toBe(true);
  });
});
