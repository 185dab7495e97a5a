import http from "node:http";
import { NextRequest } from "next/server";
import { DatabaseError, ForeignKeyConstraintError } from "sequelize";
import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as nextAuthPost, GET as nextAuthGet } from "@/app/api/auth/[...nextauth]/route";
import { POST as postQuad } from "@/app/api/v1/garage/quads/route";
import { PUT as putQuad } from "@/app/api/v1/garage/quads/[id]/route";
import { POST as postPack } from "@/app/api/v1/garage/packs/route";
import { POST as postCharge } from "@/app/api/v1/garage/packs/[id]/charges/route";
import { POST as postWorksheet } from "@/app/api/v1/garage/worksheets/route";
import { env } from "@/lib/env";
import { toApiError } from "@/lib/http/errors";
import { route } from "@/lib/http";
import { stopBoss } from "@/lib/jobs";
import { BoardRevision, db, FirmwareFamily, Pack, Quad } from "@/models";
import { callRoute, sessionCookieFor, jsonRequest as json, routeParams as params } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

// Finding 6 of issue 12 (hardening), one case each: every bad input answers a 4xx naming the
// field, never a 500, and changes nothing. The probe that found them sent these exact values.

setupTestDatabase("seeded");
afterAll(() => stopBoss());

async function expectFieldError(res: Response, field: string, status = 400) {
  const body = await res.json();
  expect(res.status, JSON.stringify(body)).toBe(status);
  expect(Object.keys(body.error.fieldErrors), JSON.stringify(body)).toContain(field);
}

const INT4_PAST = 2_147_483_648;

describe("garage quads: foreign keys and id ranges", () => {
  it.each([
    ["an unknown board revision", { boardRevisionId: 999_999 }, "boardRevisionId"],
    ["an unknown firmware family", { firmwareFamilyId: 999_999 }, "firmwareFamilyId"],
    ["a board revision id past int4", { boardRevisionId: INT4_PAST }, "boardRevisionId"],
    ["a firmware family id past int4", { firmwareFamilyId: 1e15 }, "firmwareFamilyId"],
  ])("%s is a 400 naming the field, on create and on update, and nothing is stored", async (_, extra, field) => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const cookie = await sessionCookieFor("contributor", { email: "fk@bad-input.test" });
    db();
    const before = await Quad.count();
    await expectFieldError(await callRoute(postQuad, json("/api/v1/garage/quads", cookie, "POST", { name: "Bent arm", ...extra })), field);
    expect(await Quad.count()).toBe(before);

    const created = await callRoute(postQuad, json("/api/v1/garage/quads", cookie, "POST", { name: "Straight arm" }));
    const { quad } = await created.json();
    const res = await callRoute(
      putQuad,
      json(`/api/v1/garage/quads/${quad.id}`, cookie, "PUT", { name: "Straight arm", ...extra }),
      params({ id: String(quad.id) }),
    );
    await expectFieldError(res, field);
    expect((await Quad.findByPk(quad.id))!.boardRevisionId).toBeNull();
  });
});

describe("worksheets: a starting scale past any setting", () => {
  it("3,000,000,000 is a 400 on startingScale", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "scale@bad-input.test" });
    db();
    const revision = (await BoardRevision.findOne())!;
    const family = (await FirmwareFamily.findOne())!;
    const created = await callRoute(
      postQuad,
      json("/api/v1/garage/quads", cookie, "POST", { name: "Scale quad", boardRevisionId: revision.id, firmwareFamilyId: family.id }),
    );
    const { quad } = await created.json();
    const res = await callRoute(
      postWorksheet,
      json("/api/v1/garage/worksheets", cookie, "POST", { quadId: quad.id, ratedMah: 1500, cells: 4, startingScale: 3_000_000_000 }),
    );
    await expectFieldError(res, "startingScale");
  });
});

describe("garage dates in a sane range", () => {
  it("a pack bought on 0000-01-01 is a 400 on purchasedOn", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "dates@bad-input.test" });
    db();
    const before = await Pack.count();
    const res = await callRoute(
      postPack,
      json("/api/v1/garage/packs", cookie, "POST", { label: "Old pack", chemistry: "lipo", cells: 4, ratedMah: 1500, purchasedOn: "0000-01-01" }),
    );
    await expectFieldError(res, "purchasedOn");
    expect(await Pack.count()).toBe(before);
  });

  it("a charge dated 0001-01-01 is a 400 on chargedOn", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "dates@bad-input.test" });
    const created = await callRoute(postPack, json("/api/v1/garage/packs", cookie, "POST", { label: "New pack", chemistry: "lipo", cells: 4, ratedMah: 1500 }));
    const { pack } = await created.json();
    const res = await callRoute(
      postCharge,
      json(`/api/v1/garage/packs/${pack.id}/charges`, cookie, "POST", { chargedOn: "0001-01-01", chargedMah: 1200 }),
      params({ id: String(pack.id) }),
    );
    await expectFieldError(res, "chargedOn");
  });
});

describe("control characters in user text", () => {
  it.each([
    ["a quad name with NUL", "/api/v1/garage/quads", { name: "Bent\u0000arm" }, "name"],
    ["a quad name with a line break", "/api/v1/garage/quads", { name: "Bent\narm" }, "name"],
    ["quad notes with a bell", "/api/v1/garage/quads", { name: "Ok", notes: "ring\u0007" }, "notes"],
    ["an ESC with an escape", "/api/v1/garage/quads", { name: "Ok", esc: "\u001b[31m" }, "esc"],
    ["a pack label with NUL", "/api/v1/garage/packs", { label: "Pack\u0000", chemistry: "lipo", cells: 4, ratedMah: 1500 }, "label"],
  ])("%s is a 400 on that field", async (_, url, body, field) => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const cookie = await sessionCookieFor("contributor", { email: "text@bad-input.test" });
    const handler = url.endsWith("quads") ? postQuad : postPack;
    await expectFieldError(await callRoute(handler, json(url, cookie, "POST", body)), field);
  });

  it("notes keep their line breaks and tabs", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "text@bad-input.test" });
    const res = await callRoute(postQuad, json("/api/v1/garage/quads", cookie, "POST", { name: "Ok", notes: "line one\r\n\tline two" }));
    expect(res.status).toBe(201);
  });
});

describe("database errors the kernel maps", () => {
  const throwing = (error: unknown) => route({ auth: "public" }, async () => Promise.reject(error));
  const pgError = (code: string, message: string) => Object.assign(new Error(message), { code });

  it.each([
    ["08006 connection failure", "08006"],
    ["57P01 admin shutdown", "57P01"],
    ["57P03 cannot connect now", "57P03"],
  ])("a database error of %s is a 503 with Retry-After in the one error shape", async (_, code) => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const error = new DatabaseError(pgError(code, "terminating connection due to administrator command") as never);
    const res = await throwing(error)(new Request("http://test/api/v1/x"));
    expect(res.status).toBe(503);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await res.json()).error).toMatchObject({ status: 503, code: "service_unavailable" });
  });

  it("a lost connection (Sequelize ConnectionError) is a 503 with Retry-After", async () => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const { ConnectionError } = await import("sequelize");
    const res = await throwing(new ConnectionError(new Error("Connection terminated unexpectedly")))(new Request("http://test/api/v1/x"));
    expect(res.status).toBe(503);
    expect(res.headers.get("retry-after")).toMatch(/^\d+$/);
  });

  it.each(["Client has encountered a connection error and is not queryable", "Connection terminated unexpectedly"])(
    "node-postgres's '%s' (no SQLSTATE, seen by npm run chaos) is a 503",
    async (message) => {
      vi.spyOn(console, "error").mockImplementation(() => undefined);
      const res = await throwing(new DatabaseError(new Error(message) as never))(new Request("http://test/api/v1/x"));
      expect(res.status).toBe(503);
      expect(res.headers.get("retry-after")).toMatch(/^\d+$/);
    },
  );

  it("a foreign-key error that reaches the kernel is a 400 naming the column, not a 500", async () => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const error = new ForeignKeyConstraintError({ fields: { board_revision_id: "999999" }, parent: pgError("23503", "fk") as never });
    const api = toApiError(error);
    expect(api.status).toBe(400);
    expect(Object.keys(api.fieldErrors)).toEqual(["boardRevisionId"]);
  });

  it("a value out of range (22003) or a bad date (22008) is a 400, not a 500", async () => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    for (const code of ["22003", "22008", "22007", "22P02", "22021", "22P05"]) {
      expect(toApiError(new DatabaseError(pgError(code, "out of range") as never)).status, code).toBe(400);
    }
  });
});

describe("next-auth's routes refuse odd input with a 400 naming the field", () => {
  const base = () => env().NEXTAUTH_URL!;
  const ctx = (...segments: string[]) => ({ params: Promise.resolve({ nextauth: segments }) });
  const call = (method: "GET" | "POST", path: string, body?: string, type = "application/x-www-form-urlencoded") => {
    const segments = path.split("?")[0].split("/").filter(Boolean);
    const request = new NextRequest(`${base()}/api/auth/${path}`, { method, headers: body === undefined ? {} : { "content-type": type }, body });
    return callRoute(method === "GET" ? nextAuthGet : nextAuthPost, request, ctx(...segments));
  };

  it("an e-mail containing NUL", async () => {
    const res = await call("POST", "callback/credentials", new URLSearchParams({ email: "a\u0000@b.test", password: "x", csrfToken: "t" }).toString());
    await expectFieldError(res, "email");
  });

  it.each(["signout", "_log"])("an unexpected content type on %s", async (path) => {
    await expectFieldError(await call("POST", path, "{}", "application/json"), "Content-Type");
    await expectFieldError(await call("POST", path, "x", "text/plain"), "Content-Type");
  });

  it.each([
    [
      "the sign-in form",
      () =>
        call("POST", "signin/email", new URLSearchParams({ email: "a@b.test", csrfToken: "t", callbackUrl: "http://127.0.0.1:3000.evil.example/" }).toString()),
    ],
    ["the address", () => call("GET", `signin?callbackUrl=${encodeURIComponent("http://127.0.0.1:3000.evil.example/")}`)],
    ["a look-alike host", () => call("GET", `signin?callbackUrl=${encodeURIComponent(new URL(base()).origin + ".evil.example/")}`)],
  ])("a callback URL on another host in %s", async (_, send) => {
    await expectFieldError(await send(), "callbackUrl");
  });
});

// Over HTTP only: Next.js itself parses the raw request target (npm test with the built app).
const appUrl = env().SHUNTBOOK_TEST_APP_URL;
describe.skipIf(!appUrl)("addresses Next.js would misread (built app)", () => {
  // node:http sends the path as written; fetch would resolve the encoded dots before sending
  const get = (path: string) =>
    new Promise<{ status: number; type: string; body: string }>((resolve, reject) => {
      const { hostname, port } = new URL(appUrl!);
      http
        .get({ hostname, port, path }, (res) => {
          let body = "";
          res.setEncoding("utf8").on("data", (chunk: string) => (body += chunk));
          res.on("end", () => resolve({ status: res.statusCode ?? 0, type: String(res.headers["content-type"]), body }));
        })
        .on("error", reject);
    });

  it("/boards/%ZZ renders the not-found page, not a bare 500", async () => {
    const res = await get("/boards/%ZZ");
    expect(res.status).toBe(404);
    expect(res.type).toMatch(/^text\/html/);
  });

  it.each(["/api/v1/%2e%2e/%2e%2e/admin", "/api/%2e%2e/boards", "/api/v1/boards/%2e%2e", "/api/v1/%ZZ"])(
    "%s is the API's JSON 404, not a redirect",
    async (path) => {
      const res = await get(path);
      expect(res.status).toBe(404);
      expect(JSON.parse(res.body).error).toMatchObject({ status: 404, code: "not_found" });
    },
  );
});
