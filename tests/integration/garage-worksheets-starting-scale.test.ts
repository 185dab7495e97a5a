import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as postQuad } from "@/app/api/v1/garage/quads/route";
import { POST as startSheet } from "@/app/api/v1/garage/worksheets/route";
import { stopBoss } from "@/lib/jobs";
import { refreshGroups } from "@/lib/published/refresh";
import { db } from "@/models";
import { callRoute, sessionCookieFor, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { insertFixture, insertSubmissions, type Fixture } from "@/tests/support/fixtures";

// A fly-and-recharge worksheet starts from the scale the builder gives; the board's published value
// is only offered (the daily-paths issue: "a published value is offered, never substituted").

setupTestDatabase("migrated");
afterAll(() => stopBoss());

const post = (url: string, cookie: string, body: unknown) =>
  withCookie(new Request(`http://test${url}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), cookie);

let fx: Fixture;
let cookie: string;
let quadId: number;
const PUBLISHED = 420;

beforeAll(async () => {
  fx = await insertFixture(db());
  await insertSubmissions(
    db(),
    fx,
    fx.revisionIds[0],
    Array.from({ length: 6 }, () => ({ currentScale: PUBLISHED })),
  );
  await refreshGroups(db(), [{ boardRevisionId: fx.revisionIds[0], firmwareFamilyId: fx.familyId }]);
  cookie = await sessionCookieFor("contributor", { email: "starter@garage.test" });
  const body = { name: "Field quad", boardRevisionId: fx.revisionIds[0], firmwareFamilyId: fx.familyId, firmwareVersion: "avocet" };
  quadId = (await (await callRoute(postQuad, post("/api/v1/garage/quads", cookie, body))).json()).quad.id;
});

const start = (extra: Record<string, unknown>) =>
  callRoute(startSheet, post("/api/v1/garage/worksheets", cookie, { quadId, ratedMah: 1500, cells: 4, ...extra }));

describe("fly-and-recharge starting scale", () => {
  it("keeps the builder's own scale although a value is published", async () => {
    const res = await start({ startingScale: 380 });
    expect(res.status).toBe(201);
    expect((await res.json()).worksheet).toMatchObject({ startingScale: 380, startingSource: "own" });
  });

  it("uses the published value only when the builder leaves the field empty, and says so", async () => {
    const res = await start({ startingScale: null });
    expect(res.status).toBe(201);
    expect((await res.json()).worksheet).toMatchObject({ startingScale: PUBLISHED, startingSource: "published" });
  });

  it("refuses a starting scale outside the family's range, naming the field", async () => {
    const res = await start({ startingScale: 100_001 }); // the fixture family's current scale runs 1–100000
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.startingScale).toHaveLength(1);
  });
});
