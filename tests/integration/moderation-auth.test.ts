import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import * as revertRoute from "@/app/api/v1/admin/events/[id]/revert/route";
import * as userRoute from "@/app/api/v1/admin/users/[id]/route";
import * as usersRoute from "@/app/api/v1/admin/users/route";
import * as bulkRoute from "@/app/api/v1/moderation/bulk-approve/route";
import * as eventsRoute from "@/app/api/v1/moderation/events/route";
import * as queueRoute from "@/app/api/v1/moderation/queue/route";
import * as approveRoute from "@/app/api/v1/moderation/submissions/[id]/approve/route";
import * as rejectRoute from "@/app/api/v1/moderation/submissions/[id]/reject/route";
import * as requestChangesRoute from "@/app/api/v1/moderation/submissions/[id]/request-changes/route";
import * as reviewRoute from "@/app/api/v1/moderation/submissions/[id]/route";
import { stopBoss } from "@/lib/jobs";
import { approveSubmission } from "@/lib/moderation";
import { ANONYMOUS, CALLERS, callRoute, sessionCookieFor, testAccount, withCookie, type Caller, type RouteHandler } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { expectError, insertPerson, insertSubmission, setupGroup, writtenState, type Setup } from "./moderation-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Every moderation and admin route × every kind of caller: anonymous 401, contributor 403,
// moderator allowed on moderation routes and 403 on admin ones, admin allowed everywhere (an admin
// passes every moderator check). A refused call writes nothing. Each allowed call gets fresh data,
// so every one of them really does its work.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

type Case = {
  name: string;
  handler: RouteHandler;
  minimum: "moderator" | "admin";
  /** Prepares fresh data and returns the request's method, path, params and body. */
  prepare: () => Promise<{ method: string; path: string; params?: Record<string, string>; body?: unknown }>;
  okStatus: number;
};

let setup: Setup;
let cookies: Record<Caller, string>;
beforeAll(async () => {
  setup = await setupGroup([397, 398, 399, 400, 401, 402, 403]);
  cookies = {
    anonymous: ANONYMOUS,
    contributor: await sessionCookieFor("contributor"),
    moderator: await sessionCookieFor("moderator"),
    admin: await sessionCookieFor("admin"),
  };
});

const pending = () => insertSubmission(setup.fx, { currentScale: 401 });
let people = 0;

/** A route case whose allowed call answers 200 (every one here does). */
const routeCase = (name: string, handler: unknown, minimum: Case["minimum"], prepare: Case["prepare"]): Case => ({
  name,
  handler: handler as RouteHandler,
  minimum,
  okStatus: 200,
  prepare,
});
const plainGet = (path: string) => async () => ({ method: "GET", path });

const CASES: Case[] = [
  routeCase("GET /moderation/queue", queueRoute.GET, "moderator", plainGet("/api/v1/moderation/queue")),
  routeCase("GET /moderation/events", eventsRoute.GET, "moderator", plainGet("/api/v1/moderation/events")),
  routeCase("GET /moderation/submissions/{id}", reviewRoute.GET, "moderator", async () => {
    const id = String(await pending());
    return { method: "GET", path: `/api/v1/moderation/submissions/${id}`, params: { id } };
  }),
  ...(
    [
      ["approve", approveRoute.POST, { version: 0 }],
      ["reject", rejectRoute.POST, { version: 0, reason: "Too far off." }],
      ["request-changes", requestChangesRoute.POST, { version: 0, message: "Add a photo." }],
    ] as const
  ).map(([segment, handler, body]) =>
    routeCase(`POST /moderation/submissions/{id}/${segment}`, handler, "moderator", async () => {
      const id = String(await pending());
      return { method: "POST", path: `/api/v1/moderation/submissions/${id}/${segment}`, params: { id }, body };
    }),
  ),
  routeCase("POST /moderation/bulk-approve", bulkRoute.POST, "moderator", async () => ({
    method: "POST",
    path: "/api/v1/moderation/bulk-approve",
    body: { items: [{ id: await pending(), version: 0 }] },
  })),
  routeCase("POST /admin/events/{id}/revert", revertRoute.POST, "admin", async () => {
    const moderator = await testAccount("moderator");
    const { event } = await approveSubmission(moderator, await pending(), { version: 0 });
    return { method: "POST", path: `/api/v1/admin/events/${event.id}/revert`, params: { id: String(event.id) }, body: { reason: "Checking the matrix." } };
  }),
  routeCase("GET /admin/users", usersRoute.GET, "admin", plainGet("/api/v1/admin/users")),
  routeCase("GET /admin/users/{id}", userRoute.GET, "admin", async () => ({
    method: "GET",
    path: `/api/v1/admin/users/${setup.fx.userId}`,
    params: { id: setup.fx.userId },
  })),
  routeCase("PATCH /admin/users/{id}", userRoute.PATCH, "admin", async () => {
    const id = await insertPerson(`matrix-${++people}@example.test`);
    return { method: "PATCH", path: `/api/v1/admin/users/${id}`, params: { id }, body: { trusted: true } };
  }),
];

function allowed(caller: Caller, minimum: Case["minimum"]): boolean {
  if (caller === "admin") return true;
  return caller === "moderator" && minimum === "moderator";
}

const expected = (caller: Caller, c: Case) => (caller === "anonymous" ? 401 : allowed(caller, c.minimum) ? c.okStatus : 403);

describe.each(CASES)("$name", (c) => {
  it.each(CALLERS)("%s", async (caller) => {
    const { method, path, params = {}, body } = await c.prepare();
    const init: RequestInit = { method, headers: body === undefined ? {} : { "content-type": "application/json" } };
    if (body !== undefined) init.body = JSON.stringify(body);
    const request = withCookie(new Request(`http://test.local${path}`, init), cookies[caller]);
    const before = await writtenState();
    const res = await callRoute(c.handler, request, { params: Promise.resolve(params) });
    const status = expected(caller, c);
    if (status === c.okStatus) {
      expect(res.status, await res.clone().text()).toBe(status);
      expect(res.headers.get("cache-control")).toBe("no-store");
    } else {
      const error = await expectError(res, status);
      expect(error.code).toBe(status === 401 ? "unauthorized" : "forbidden");
      expect(await writtenState()).toEqual(before);
    }
  });
});

describe("writes from another site's page", () => {
  it("a moderator's approve with a foreign Origin is a 403 and writes nothing", async () => {
    const id = String(await pending());
    const request = withCookie(
      new Request(`http://test.local/api/v1/moderation/submissions/${id}/approve`, {
        method: "POST",
        headers: { "content-type": "application/json", origin: "https://elsewhere.example", host: "test.local" },
        body: JSON.stringify({ version: 0 }),
      }),
      cookies.moderator,
    );
    const before = await writtenState();
    await expectError(await callRoute(approveRoute.POST as RouteHandler, request, { params: Promise.resolve({ id }) }), 403);
    expect(await writtenState()).toEqual(before);
  });
});
