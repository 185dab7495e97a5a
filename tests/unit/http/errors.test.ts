import { ConnectionRefusedError } from "sequelize";
import { afterEach, describe, expect, it, vi } from "vitest";
import { badRequest, notFound, toApiError } from "@/lib/http/errors";
import { route, routes } from "@/lib/http/route";

// route()'s promise: whatever a handler throws leaves as the one JSON error body, never a bare 500.
const req = (method = "GET") => new Request("http://test.local/api/v1/x?secret=1", { method });

afterEach(() => vi.restoreAllMocks());

async function bodyOf(res: Response) {
  expect(res.headers.get("content-type")).toMatch(/^application\/json/);
  expect(res.headers.get("cache-control")).toBe("no-store");
  return (await res.json()).error;
}

describe("route", () => {
  it("passes a handler's response through", async () => {
    const res = await route({ auth: "public" }, async () => new Response("ok"))(req(), undefined);
    expect(await res.text()).toBe("ok");
  });

  it("turns a thrown ApiError into its status and body", async () => {
    const res = await route({ auth: "public" }, async () => {
      throw badRequest({ page: ["page must be 1 or more"] });
    })(req(), undefined);
    expect(res.status).toBe(400);
    expect(await bodyOf(res)).toEqual({
      status: 400,
      code: "bad_request",
      message: "Bad parameter: page. See fieldErrors.",
      fieldErrors: { page: ["page must be 1 or more"] },
    });
  });

  it("maps an unexpected error to a logged 500 that shows nothing of it", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const res = await route({ auth: "public" }, async () => {
      throw new TypeError("cannot read x of undefined at /srv/secret.ts");
    })(req(), undefined);
    expect(res.status).toBe(500);
    const error = await bodyOf(res);
    expect(error.code).toBe("internal_error");
    expect(error.message).not.toContain("secret");
    expect(log).toHaveBeenCalledOnce();
    expect(String(log.mock.calls[0][0])).toContain("GET /api/v1/x");
    expect(String(log.mock.calls[0][0])).not.toContain("secret=1");
  });

  it("maps an unreachable database to 503", async () => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const error = toApiError(new ConnectionRefusedError(new Error("ECONNREFUSED")));
    expect([error.status, error.code]).toEqual([503, "service_unavailable"]);
  });

  it("checks the caller first; its ApiError is the answer", async () => {
    const handler = vi.fn(async () => new Response("never"));
    // a write from another site's page: refused before the session or the handler is looked at
    const crossSite = new Request("http://test.local/api/v1/x", { method: "POST", headers: { host: "test.local", origin: "https://elsewhere.test" } });
    const res = await route({ auth: "moderator" }, handler)(crossSite, undefined);
    expect(res.status).toBe(403);
    expect((await bodyOf(res)).code).toBe("forbidden");
    expect(handler).not.toHaveBeenCalled();
  });
});

describe("error helpers", () => {
  it("notFound names the field when given one", () => {
    expect(notFound('No board has the slug "x".', "slug").fieldErrors).toEqual({ slug: ['No board has the slug "x".'] });
    expect(notFound("Nothing here.").fieldErrors).toEqual({});
  });

  it("routes() answers a method the file does not implement with 405 and Allow", async () => {
    const res = await routes({ GET: route({ auth: "public" }, async () => new Response("ok")) }).DELETE(req("DELETE"), undefined);
    expect(res.status).toBe(405);
    expect(res.headers.get("allow")).toBe("GET, HEAD");
    expect((await bodyOf(res)).message).toContain("DELETE");
  });
});
