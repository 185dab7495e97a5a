import { readdirSync } from "node:fs";
import { join, relative } from "node:path";
import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { stopBoss } from "@/lib/jobs";
import { setupTestDatabase } from "@/tests/support/database";

// Every route file under app/api answers a method it does not implement with the API's JSON 405
// and an Allow header naming the ones it does (RFC 9110 §15.5.6), never the framework's empty
// 405. Each method is called anonymously from another site's page: an implemented write is
// refused by the sign-in or same-origin check (401/403) before it reads anything, so only the
// unimplemented ones answer 405. Next.js serves HEAD through GET, so Allow names HEAD with GET.

setupTestDatabase("migrated");
afterAll(() => stopBoss());

const API_DIR = join(process.cwd(), "app/api");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
// next-auth's own handler answers its GET and POST itself; calling them here would test next-auth.
const FOREIGN: Record<string, readonly string[]> = { "auth/[...nextauth]/route.ts": ["GET", "POST"] };
// the catch-all answers every method with the JSON 404 (tests/integration/api-boards.test.ts)
const EVERY_METHOD = new Set(["v1/[...path]/route.ts"]);

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(path);
    return entry.name === "route.ts" ? [relative(API_DIR, path)] : [];
  });
}

const params = { id: "1", chargeId: "1", position: "0", slug: "no-such-board", path: ["nothing"], nextauth: ["nothing"] };
const crossSite = (method: string) =>
  new Request("http://127.0.0.1:3999/api/x", { method, headers: { host: "127.0.0.1:3999", origin: "https://elsewhere.test" } });

describe("unsupported methods", () => {
  const files = routeFiles(API_DIR);

  it("finds the route files", () => {
    expect(files.length).toBeGreaterThan(30);
  });

  it.each(files.filter((file) => !EVERY_METHOD.has(file)))("%s answers the JSON 405 with Allow", async (file) => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const mod = (await import(/* @vite-ignore */ `@/app/api/${file.replace(/\.ts$/, "")}`)) as Record<
      string,
      (req: Request, ctx: unknown) => Promise<Response>
    >;
    const implemented: string[] = [...(FOREIGN[file] ?? [])];
    const refusals: Response[] = [];
    for (const method of METHODS) {
      if (FOREIGN[file]?.includes(method)) continue;
      expect(mod[method], `${file} exports ${method}`).toBeTypeOf("function");
      const res = await mod[method](crossSite(method), { params: Promise.resolve(params) });
      if (res.status === 405) refusals.push(res);
      else implemented.push(method);
    }
    expect(refusals.length, `${file} has a method it does not implement`).toBeGreaterThan(0);
    const allow = METHODS.filter((m) => implemented.includes(m))
      .flatMap((m) => (m === "GET" ? ["GET", "HEAD"] : [m]))
      .join(", ");
    for (const res of refusals) {
      expect(res.headers.get("content-type")).toMatch(/^application\/json/);
      expect(res.headers.get("allow")).toBe(allow);
      expect((await res.json()).error).toMatchObject({ status: 405, code: "method_not_allowed" });
    }
  });
});
