import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { stopBoss } from "@/lib/jobs";
import { ANONYMOUS, CALLERS, callRoute, sessionCookieFor, withCookie, type Caller } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { fillTemplate, listRoutes, type ListedRoute } from "@/tests/support/route-list";

// The authorisation matrix, generated from the route list (tests/support/route-list.ts): every
// route × method × caller (visitor, contributor, moderator, admin) answers the status class its
// declared auth implies. Refused: exactly 401 for a visitor and 403 for a role too low. Allowed:
// anything but 401/403 and never a 5xx (the ids name nothing, so most answer 404 or 400).

setupTestDatabase("seeded");
afterAll(() => stopBoss());

const RANK: Record<Caller, number> = { anonymous: 0, contributor: 1, moderator: 2, admin: 3 };
const NEEDS: Record<ListedRoute["spec"]["auth"], number> = { public: 0, optional: 0, user: 1, moderator: 2, admin: 3 };

/** The status a caller must get, or "allowed" for any answer that is not a refusal. */
function expected(route: ListedRoute, caller: Caller): 401 | 403 | "allowed" {
  if (RANK[caller] >= NEEDS[route.spec.auth]) return "allowed";
  return caller === "anonymous" ? 401 : 403;
}

// ids no row has: the top of int4, a slug and a user id that name nothing
const PARAMS: Record<string, string> = { id: "2147483647", chargeId: "2147483647", position: "1", slug: "no-such-board" };

const routes = await listRoutes();
const cookies: Record<Caller, string> = { anonymous: ANONYMOUS, contributor: "", moderator: "", admin: "" };
beforeAll(async () => {
  for (const role of ["contributor", "moderator", "admin"] as const) cookies[role] = await sessionCookieFor(role);
});

describe("authorisation matrix", () => {
  it("lists the API's routes", () => {
    expect(routes.length).toBeGreaterThan(30);
  });

  const cells = routes.flatMap((route) => CALLERS.map((caller) => [`${route.method} ${route.template} as ${caller}`, route, caller] as const));
  it.each(cells)("%s", async (_, route, caller) => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const params = Object.fromEntries(route.paramNames.map((name) => [name, PARAMS[name] ?? "no-such-thing"]));
    const write = route.method !== "GET";
    const request = withCookie(
      new Request(`http://test${fillTemplate(route.template, params)}`, {
        method: route.method,
        headers: write ? { "content-type": "application/json" } : {},
        body: write ? "{}" : undefined,
      }),
      cookies[caller],
    );
    const res = await callRoute(route.handler, request, { params: Promise.resolve(params) });
    const want = expected(route, caller);
    if (want === "allowed") {
      expect([401, 403], `${res.status} ${await res.clone().text()}`).not.toContain(res.status);
      expect(res.status).toBeLessThan(500);
    } else {
      expect(res.status).toBe(want);
      expect((await res.json()).error).toMatchObject({ status: want });
    }
  });
});
