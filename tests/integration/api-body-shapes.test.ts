import { readdirSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { stopBoss } from "@/lib/jobs";
import { db } from "@/models";
import { callRoute, sessionCookieFor, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Every JSON endpoint that changes data, found on disk (so a new route is covered without being
// listed), called by an admin (who passes every guard) with bodies that are valid JSON but not an
// object. Each must answer a 4xx in the API's one error shape and write nothing: a TypeError deep
// in a handler would be a 500 (the contribution schema on its own once threw on `null`; its
// handler happened to refuse the body before reaching it).
setupTestDatabase("seeded");
afterAll(() => stopBoss());

const APP_DIR = path.resolve(__dirname, "../../app");
const MUTATING = ["POST", "PUT", "PATCH"] as const;
const NOT_OBJECTS: unknown[] = [null, [], "text", 7, true];
// next-auth's own endpoints take forms, not JSON; the photo upload takes multipart
const SKIP = new Set(["api/auth/[...nextauth]", "api/v1/photos"]);

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(full);
    return entry.name === "route.ts" ? [full] : [];
  });
}

const routes = routeFiles(path.join(APP_DIR, "api"))
  .map((file) => path.relative(APP_DIR, path.dirname(file)))
  .filter((route) => !SKIP.has(route))
  .sort();

/** Every table's row count, to prove a refused call wrote nothing. */
async function tableCounts(): Promise<Record<string, number>> {
  const tables = await db().query<{ t: string }>(
    "SELECT tablename AS t FROM pg_tables WHERE schemaname = 'public' AND tablename NOT IN ('SequelizeMeta', 'rate_limits') ORDER BY 1",
    { type: QueryTypes.SELECT },
  );
  const out: Record<string, number> = {};
  for (const { t } of tables) out[t] = (await db().query<{ n: number }>(`SELECT count(*)::int AS n FROM "${t}"`, { type: QueryTypes.SELECT }))[0].n;
  return out;
}

let admin: string;
beforeAll(async () => {
  admin = await sessionCookieFor("admin");
});

describe("JSON bodies that are not an object", () => {
  it("the scan finds the mutating endpoints", () => {
    expect(routes).toContain("api/v1/submissions");
    expect(routes).toContain("api/v1/garage/quads");
  });

  for (const route of routes) {
    it(`${route}: a clear 4xx for each, nothing written`, async () => {
      const mod = (await import(path.join(APP_DIR, route, "route.ts"))) as Record<string, unknown>;
      // a path segment [id] or [slug] gets a value that parses but names nothing of the caller's
      const params = Object.fromEntries([...route.matchAll(/\[(\w+)\]/g)].map(([, name]) => [name, "1"]));
      const url = `http://test/${route.replace(/\[(\w+)\]/g, "1")}`;
      const before = await tableCounts();
      for (const method of MUTATING) {
        const handler = mod[method] as ((r: Request, c: unknown) => Promise<Response>) | undefined;
        if (!handler) continue;
        for (const body of NOT_OBJECTS) {
          const request = withCookie(new Request(url, { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), admin);
          const res = await callRoute(handler, request, { params: Promise.resolve(params) });
          const what = `${method} /${route} with ${JSON.stringify(body)}`;
          expect(res.status, what).toBeGreaterThanOrEqual(400);
          expect(res.status, what).toBeLessThan(500);
          const json = (await res.json()) as { error?: { status: number; code: string; message: string } };
          expect(json.error?.status, what).toBe(res.status);
          expect(json.error?.message, what).toBeTruthy();
        }
      }
      expect(await tableCounts()).toEqual(before);
    });
  }
});
