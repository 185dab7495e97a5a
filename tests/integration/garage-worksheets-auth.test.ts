import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { POST as postQuad } from "@/app/api/v1/garage/quads/route";
import * as sheetRoute from "@/app/api/v1/garage/worksheets/[id]/route";
import * as publishRoute from "@/app/api/v1/garage/worksheets/[id]/publish/route";
import * as stepsRoute from "@/app/api/v1/garage/worksheets/[id]/steps/route";
import * as stepRoute from "@/app/api/v1/garage/worksheets/[id]/steps/[position]/route";
import * as startRoute from "@/app/api/v1/garage/worksheets/route";
import { stopBoss } from "@/lib/jobs";
import { db } from "@/models";
import { ANONYMOUS, CALLERS, callRoute, sessionCookieFor, withCookie, type Caller, type RouteHandler } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { insertFixture, type Fixture } from "@/tests/support/fixtures";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Every worksheet route × every kind of caller. The garage is private, not a role's privilege:
// anonymous 401 and nothing written; any signed-in role (contributor, moderator, admin) may work
// on their own worksheets; everyone else's — even for an admin — answers 404 and changes nothing.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

let fx: Fixture;
let cookies: Record<Caller, string>;
beforeAll(async () => {
  fx = await insertFixture(db());
  cookies = {
    anonymous: ANONYMOUS,
    contributor: await sessionCookieFor("contributor"),
    moderator: await sessionCookieFor("moderator"),
    admin: await sessionCookieFor("admin"),
  };
});

const send = (handler: RouteHandler, cookie: string, method: string, params: Record<string, string> = {}, body?: unknown) =>
  callRoute(
    handler,
    withCookie(
      new Request(
        "http://test.local/api/v1/garage/worksheets",
        body === undefined ? { method } : { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) },
      ),
      cookie,
    ),
    { params: Promise.resolve(params) },
  );

async function quadOf(cookie: string): Promise<number> {
  const res = await send(
    postQuad as RouteHandler,
    cookie,
    "POST",
    {},
    { name: "Matrix quad", boardRevisionId: fx.revisionIds[0], firmwareFamilyId: fx.familyId, firmwareVersion: "1.0.0" },
  );
  return (await res.json()).quad.id;
}
/** A voltage worksheet of the cookie's owner with one reading: ready to read, extend, take back or publish. */
async function sheetOf(cookie: string): Promise<string> {
  const { worksheet } = await (
    await send(startRoute.POST as RouteHandler, cookie, "POST", {}, { kind: "voltage", quadId: await quadOf(cookie), scaleUsed: 110 })
  ).json();
  await send(
    stepsRoute.POST as RouteHandler,
    cookie,
    "POST",
    { id: String(worksheet.id) },
    { cells: 4, reportedVolts: 16, measuredVolts: 16.4, measuredAt: "main_lead" },
  );
  return String(worksheet.id);
}

/** Counts of everything a worksheet route can write: rows, readings taken back, worksheets published. */
const STATE_SQL = `SELECT
  (SELECT count(*) FROM worksheets)::int AS worksheets,
  (SELECT count(*) FROM worksheets WHERE submission_id IS NOT NULL)::int AS published,
  (SELECT count(*) FROM worksheet_voltage_readings)::int AS readings,
  (SELECT count(*) FROM worksheet_voltage_readings WHERE removed_at IS NOT NULL)::int AS "readingsTakenBack",
  (SELECT count(*) FROM worksheet_bench_points)::int AS points,
  (SELECT count(*) FROM worksheet_steps)::int AS steps,
  (SELECT count(*) FROM submissions)::int AS submissions,
  (SELECT count(*) FROM submission_voltage_readings)::int AS evidence`;
const written = async () => (await db().query<Record<string, number>>(STATE_SQL, { type: QueryTypes.SELECT }))[0];

type Case = {
  name: string;
  handler: RouteHandler;
  method: string;
  okStatus: number;
  call: (sheetId: string) => { params: Record<string, string>; body?: unknown };
};
const CASES: Case[] = [
  { name: "GET /garage/worksheets/{id}", handler: sheetRoute.GET as RouteHandler, method: "GET", okStatus: 200, call: (id) => ({ params: { id } }) },
  {
    name: "POST /garage/worksheets/{id}/steps",
    handler: stepsRoute.POST as RouteHandler,
    method: "POST",
    okStatus: 201,
    call: (id) => ({ params: { id }, body: { cells: 4, reportedVolts: 16.1, measuredVolts: 16.5, measuredAt: "balance_outer_pins" } }),
  },
  {
    name: "DELETE /garage/worksheets/{id}/steps/{position}",
    handler: stepRoute.DELETE as RouteHandler,
    method: "DELETE",
    okStatus: 200,
    call: (id) => ({ params: { id, position: "0" } }),
  },
  {
    name: "POST /garage/worksheets/{id}/publish",
    handler: publishRoute.POST as RouteHandler,
    method: "POST",
    okStatus: 201,
    call: (id) => ({ params: { id }, body: {} }),
  },
];

describe("POST /garage/worksheets (start)", () => {
  it.each(CALLERS)("%s", async (caller) => {
    const quadId = await quadOf(cookies.contributor);
    const own = caller === "anonymous" ? quadId : await quadOf(cookies[caller]);
    const before = await written();
    const res = await send(startRoute.POST as RouteHandler, cookies[caller], "POST", {}, { kind: "bench", quadId: own, scaleUsed: 400, offsetUsed: 0 });
    if (caller === "anonymous") {
      expect(res.status).toBe(401);
      expect((await res.json()).error.code).toBe("unauthorized");
      expect(await written()).toEqual(before);
      return;
    }
    expect(res.status, await res.clone().text()).toBe(201);
    expect(res.headers.get("cache-control")).toBe("no-store");
    // someone else's quad: 404, nothing started
    const after = await written();
    const foreign = await send(
      startRoute.POST as RouteHandler,
      cookies[caller],
      "POST",
      {},
      { kind: "bench", quadId: caller === "contributor" ? await quadOf(cookies.admin) : quadId, scaleUsed: 400, offsetUsed: 0 },
    );
    expect(foreign.status).toBe(404);
    expect(await written()).toEqual(after);
  });
});

describe.each(CASES)("$name", (c) => {
  it.each(CALLERS)("%s", async (caller) => {
    if (caller === "anonymous") {
      const { params, body } = c.call(await sheetOf(cookies.contributor));
      const before = await written();
      const res = await send(c.handler, ANONYMOUS, c.method, params, body);
      expect(res.status).toBe(401);
      expect((await res.json()).error.code).toBe("unauthorized");
      expect(await written()).toEqual(before);
      return;
    }
    // someone else's worksheet, whatever the caller's role: 404 and nothing changes
    const other = caller === "contributor" ? cookies.moderator : cookies.contributor;
    const foreign = c.call(await sheetOf(other));
    const before = await written();
    const refused = await send(c.handler, cookies[caller], c.method, foreign.params, foreign.body);
    expect(refused.status).toBe(404);
    expect(await written()).toEqual(before);
    // their own: allowed, answered privately
    const own = c.call(await sheetOf(cookies[caller]));
    const res = await send(c.handler, cookies[caller], c.method, own.params, own.body);
    expect(res.status, await res.clone().text()).toBe(c.okStatus);
    expect(res.headers.get("cache-control")).toBe("no-store");
  });
});

describe("writes from another site's page", () => {
  it("a publish with a foreign Origin is a 403 and writes nothing", async () => {
    const id = await sheetOf(cookies.contributor);
    const before = await written();
    const request = withCookie(
      new Request(`http://test.local/api/v1/garage/worksheets/${id}/publish`, {
        method: "POST",
        headers: { "content-type": "application/json", origin: "https://elsewhere.example", host: "test.local" },
        body: "{}",
      }),
      cookies.contributor,
    );
    expect((await callRoute(publishRoute.POST as RouteHandler, request, { params: Promise.resolve({ id }) })).status).toBe(403);
    expect(await written()).toEqual(before);
  });
});
