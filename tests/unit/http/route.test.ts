import { ConnectionError } from "sequelize";
import { afterEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import type { SessionUser } from "@/lib/auth/guard";

// The session user comes from the request's cookie; here a test header names who is calling, so
// the kernel's own rules (which role passes, what each refusal says) are tested without a database.
vi.mock("@/lib/auth/guard", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/auth/guard")>();
  const users: Record<string, SessionUser> = {
    contributor: { id: "u-1", email: "c@route.test", name: "C", role: "contributor" },
    moderator: { id: "u-2", email: "m@route.test", name: "M", role: "moderator" },
  };
  return { ...actual, userFromRequest: async (request: Request) => users[request.headers.get("x-test-user") ?? ""] ?? null };
});

const { idParams, route, routes } = await import("@/lib/http");

const req = (method = "GET", as?: string, body?: unknown) =>
  new Request("http://test.local/api/v1/x", {
    method,
    headers: { ...(as ? { "x-test-user": as } : {}), ...(body === undefined ? {} : { "content-type": "application/json" }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
const ok = async () => new Response("ok");
const errorOf = async (res: Response) => {
  expect(res.headers.get("content-type")).toMatch(/^application\/json/);
  return (await res.json()).error;
};

afterEach(() => vi.restoreAllMocks());

describe("routes()", () => {
  it("answers an unsupported method with the JSON 405 and an Allow header listing the implemented ones", async () => {
    const file = routes({ GET: route({ auth: "public" }, ok), PATCH: route({ auth: "user" }, ok) });
    const res = await file.POST(req("POST"), undefined);
    expect(res.status).toBe(405);
    expect(res.headers.get("allow")).toBe("GET, HEAD, PATCH");
    expect(await errorOf(res)).toMatchObject({ status: 405, code: "method_not_allowed" });
  });
});

describe("route() authorisation", () => {
  it("anonymous on auth 'user' is 401 and the handler never runs", async () => {
    const handler = vi.fn(ok);
    const res = await route({ auth: "user" }, handler)(req(), undefined);
    expect(res.status).toBe(401);
    expect((await errorOf(res)).message).toBe("Sign in first: this needs a Shuntbook account.");
    expect(handler).not.toHaveBeenCalled();
  });

  it("a contributor on auth 'moderator' is 403 naming the role; a moderator passes and gets the user", async () => {
    const res = await route({ auth: "moderator" }, ok)(req("GET", "contributor"), undefined);
    expect(res.status).toBe(403);
    expect((await errorOf(res)).message).toBe("This needs the moderator role; you are signed in as a contributor.");
    const seen = await route({ auth: "moderator" }, async ({ user }) => Response.json(user))(req("GET", "moderator"), undefined);
    expect(await seen.json()).toMatchObject({ id: "u-2", role: "moderator" });
  });

  it("'public' reads no session: the user is null even with one", async () => {
    const res = await route({ auth: "public" }, async ({ user }) => Response.json({ user }))(req("GET", "moderator"), undefined);
    expect(await res.json()).toEqual({ user: null });
  });
});

describe("route() parsing", () => {
  it("a zod body issue is a 400 with fieldErrors keyed by the field", async () => {
    const spec = { auth: "public", body: z.object({ name: z.string().min(2, "name needs 2 letters or more") }) } as const;
    const res = await route(spec, ok)(req("POST", undefined, { name: "x" }), undefined);
    expect(res.status).toBe(400);
    expect(await errorOf(res)).toMatchObject({ code: "bad_request", fieldErrors: { name: ["name needs 2 letters or more"] } });
  });

  it("a path id that is not a positive int4 is a 404 naming the param", async () => {
    const handler = route({ auth: "public", params: idParams("thing") }, async ({ params }) => Response.json(params));
    for (const raw of ["0", "-1", "1.5", "abc", "2147483648"]) {
      const res = await handler(req(), { params: Promise.resolve({ id: raw }) });
      expect(res.status).toBe(404);
      expect((await errorOf(res)).fieldErrors).toEqual({ id: [`There is no thing with id ${raw}.`] });
    }
    expect(await (await handler(req(), { params: Promise.resolve({ id: "2147483647" }) })).json()).toEqual({ id: 2147483647 });
  });
});

describe("route() errors", () => {
  it("a thrown sequelize ConnectionError is a 503", async () => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const res = await route({ auth: "public" }, async () => {
      throw new ConnectionError(new Error("ECONNREFUSED"));
    })(req(), undefined);
    expect(res.status).toBe(503);
    expect((await errorOf(res)).code).toBe("service_unavailable");
  });

  it("any other throw is a logged 500 with the generic message", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const res = await route({ auth: "public" }, async () => {
      throw new Error("secret detail");
    })(req(), undefined);
    expect(res.status).toBe(500);
    expect((await errorOf(res)).message).toBe("Something went wrong on our side. It has been logged; try again later.");
    expect(log).toHaveBeenCalledOnce();
  });
});
