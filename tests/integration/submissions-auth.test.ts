import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { PATCH as patchRoute } from "@/app/api/v1/submissions/[id]/route";
import { GET as listRoute, POST as postRoute } from "@/app/api/v1/submissions/route";
import { stopBoss } from "@/lib/jobs";
import type { Role } from "@/lib/vocabulary";
import { ANONYMOUS, callRoute, sessionCookieFor, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { expectError, pickTarget, postRequest, rowCounts, validBody, type Target } from "./submissions-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Who may call the mutating submission routes: anonymous 401 (and nothing written); any signed-in
// role may contribute; only the owner may edit, whatever their role (moderators review through
// moderation, not by rewriting a contributor's values).
setupTestDatabase("seeded");
afterAll(() => stopBoss());

const ROLES: Role[] = ["contributor", "moderator", "admin"];
let target: Target;
let cookies: Record<Role | "anonymous", string>;
beforeAll(async () => {
  target = await pickTarget();
  cookies = {
    anonymous: ANONYMOUS,
    contributor: await sessionCookieFor("contributor"),
    moderator: await sessionCookieFor("moderator"),
    admin: await sessionCookieFor("admin"),
  };
});

const patchAs = (id: number, body: unknown, cookie: string) =>
  callRoute(
    patchRoute,
    withCookie(
      new Request(`http://test.local/api/v1/submissions/${id}`, {
        method: "PATCH",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      }),
      cookie,
    ),
    { params: Promise.resolve({ id: String(id) }) },
  );

describe("POST /api/v1/submissions", () => {
  it("anonymous: 401 and nothing written", async () => {
    const before = await rowCounts();
    const error = await expectError(await callRoute(postRoute, postRequest(validBody(target), cookies.anonymous)), 401);
    expect(error.code).toBe("unauthorized");
    expect(await rowCounts()).toEqual(before);
  });

  it.each(ROLES)("%s: 201, recorded as their own", async (role) => {
    const res = await callRoute(postRoute, postRequest(validBody(target), cookies[role]));
    expect(res.status).toBe(201);
    const { submission } = await res.json();
    const list = await (await callRoute(listRoute, withCookie(new Request("http://test.local/api/v1/submissions"), cookies[role]))).json();
    expect(list.submissions.map((s: { id: number }) => s.id)).toContain(submission.id);
  });
});

describe("PATCH /api/v1/submissions/{id} on a contributor's submission", () => {
  let id: number;
  let version: number;
  beforeAll(async () => {
    const { submission } = await (await callRoute(postRoute, postRequest(validBody(target), cookies.contributor))).json();
    ({ id, version } = submission);
  });

  it("anonymous: 401", async () => {
    await expectError(await patchAs(id, { ...validBody(target), version }, cookies.anonymous), 401);
  });

  it.each(["moderator", "admin"] as const)("%s (not the owner): 403", async (role) => {
    const error = await expectError(await patchAs(id, { ...validBody(target), version }, cookies[role]), 403);
    expect(error.code).toBe("forbidden");
  });

  it("contributor who owns it: 200", async () => {
    expect((await patchAs(id, { ...validBody(target), version }, cookies.contributor)).status).toBe(200);
  });

  it("GET on the list needs a session too", async () => {
    await expectError(await callRoute(listRoute, new Request("http://test.local/api/v1/submissions")), 401);
  });
});
