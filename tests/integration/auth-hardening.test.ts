import { NextRequest } from "next/server";
import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { GET, POST } from "@/app/api/auth/[...nextauth]/route";
import { POST as resetRequest } from "@/app/api/auth/password-reset/route";
import { POST as signOutEverywhere } from "@/app/api/auth/profile/sign-out-everywhere/route";
import { POST as signUpRoute } from "@/app/api/auth/sign-up/route";
import { currentUser } from "@/lib/auth/guard";
import { LIMITS } from "@/lib/auth/rate-limit";
import { sessionCookieName } from "@/lib/auth/session-cookie";
import { route } from "@/lib/http";
import { env } from "@/lib/env";
import { stopBoss } from "@/lib/jobs";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { db, User } from "@/models";
import { callRoute, inRequest, sessionCookieForAccount, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

// Issue 12, findings 1, 5, 6 (next-auth's routes), 7 (last sentence) and 9: each case failed
// before the change. In-process there is no server to stamp the socket's address, so a request's
// last X-Forwarded-For entry stands for the one lib/platform/peer-address.cjs appends; entries
// before it are what a client wrote. Addresses are RFC 5737 documentation addresses.

setupTestDatabase("seeded");
afterAll(() => stopBoss());

const base = () => env().NEXTAUTH_URL!;

async function nextAuth(method: "GET" | "POST", path: string, body?: string, headers: Record<string, string> = {}) {
  const segments = path.split("?")[0].split("/").filter(Boolean);
  const request = new NextRequest(`${base()}/api/auth/${path}`, {
    method,
    headers: { ...(body !== undefined ? { "content-type": "application/x-www-form-urlencoded" } : {}), ...headers },
    body,
  });
  return callRoute(method === "GET" ? GET : POST, request, { params: Promise.resolve({ nextauth: segments }) });
}

/** A fresh CSRF pair: the token for the form and the cookie that must come with it. */
async function csrf(): Promise<{ token: string; cookie: string }> {
  const res = await nextAuth("GET", "csrf");
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return { token: ((await res.json()) as { csrfToken: string }).csrfToken, cookie };
}

async function passwordAttempt(email: string, password: string, forwardedFor: string, extra = "") {
  const { token, cookie } = await csrf();
  const form = new URLSearchParams({ csrfToken: token, email, password, json: "true" }).toString() + extra;
  return nextAuth("POST", "callback/credentials", form, { cookie, "x-forwarded-for": forwardedFor });
}

const fieldsOf = async (res: Response) => Object.keys((await res.json()).error.fieldErrors);

describe("finding 1: limits that a client cannot step around", () => {
  it("30 wrong passwords with a rotating client-written X-Forwarded-For are limited, and the lock holds for the right password", async () => {
    const account = DEMO_ACCOUNTS.moderator;
    const statuses: number[] = [];
    for (let i = 0; i < 30; i++) statuses.push((await passwordAttempt(account.email, `wrong ${i}`, `10.9.${i}.1, 192.0.2.90`)).status);
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThan(0);
    expect(statuses.slice(0, LIMITS.signIn.points)).toEqual(Array(LIMITS.signIn.points).fill(401));
    // from a different network altogether, the right password waits out the account's lock
    const right = await passwordAttempt(account.email, account.password, "198.51.100.23");
    expect(right.status).toBe(429);
    expect(Number(right.headers.get("retry-after"))).toBeGreaterThan(0);
  });

  it("an e-mail field sent twice is refused with a field error before next-auth or the limiter sees it", async () => {
    const res = await passwordAttempt(
      DEMO_ACCOUNTS.admin.email,
      DEMO_ACCOUNTS.admin.password,
      "192.0.2.91",
      `&email=${encodeURIComponent(DEMO_ACCOUNTS.contributor.email)}`,
    );
    expect(res.status).toBe(400);
    expect(await fieldsOf(res)).toEqual(["email"]);
  });

  // sign-up now answers 202 "check your mail" instead of 201 (issue 12 deliver 8, tests/integration/auth-enumeration.test.ts)
  it(`sign-up is limited per network: the ${LIMITS.signUp.points + 1}th new account from one address gets 429, whatever the e-mail`, async () => {
    const signUp = (i: number) =>
      callRoute(
        signUpRoute,
        new Request("http://127.0.0.1:3999/api/auth/sign-up", {
          method: "POST",
          headers: { "content-type": "application/json", "x-forwarded-for": "192.0.2.92" },
          body: JSON.stringify({ name: `Many ${i}`, email: `many-${i}@example.test`, password: "long enough pw", confirm: "long enough pw" }),
        }),
      );
    for (let i = 0; i < LIMITS.signUp.points; i++) expect((await signUp(i)).status).toBe(202);
    expect((await signUp(99)).status).toBe(429);
  });

  it("password reset requests are limited per network even when the client rotates its own X-Forwarded-For", async () => {
    const ask = (i: number) =>
      callRoute(
        resetRequest,
        new Request("http://127.0.0.1:3999/api/auth/password-reset", {
          method: "POST",
          headers: { "content-type": "application/json", "x-forwarded-for": `10.8.${i}.1, 192.0.2.93` },
          body: JSON.stringify({ email: `reset-${i}@example.test` }),
        }),
      );
    const statuses: number[] = [];
    for (let i = 0; i <= LIMITS.resetAddress.points; i++) statuses.push((await ask(i)).status);
    expect(statuses.at(-1)).toBe(429);
  });
});

describe("finding 5: sign-out ends the session on the server", () => {
  it("a copy of the cookie stops working after sign-out, for the guard and for next-auth's session endpoint", async () => {
    const account = DEMO_ACCOUNTS.contributor;
    const signedIn = await passwordAttempt(account.email, account.password, "192.0.2.94");
    expect(signedIn.status).toBe(200);
    const session = signedIn.headers
      .getSetCookie()
      .find((c) => c.startsWith(`${sessionCookieName()}=`))!
      .split(";")[0];
    const page = withCookie(new Request(`${base()}/profile`), session);
    expect(await inRequest(page, currentUser)).toMatchObject({ email: account.email });

    const { token, cookie } = await csrf();
    const out = await nextAuth("POST", "signout", new URLSearchParams({ csrfToken: token, json: "true" }).toString(), { cookie: `${cookie}; ${session}` });
    expect(out.status).toBe(200);

    expect(await inRequest(withCookie(new Request(`${base()}/profile`), session), currentUser)).toBeNull();
    const read = await nextAuth("GET", "session", undefined, { cookie: session });
    expect(await read.json()).toEqual({});
  });

  it("signing out on one device leaves the account's other sessions signed in (only 'sign out everywhere' ends them all)", async () => {
    const account = DEMO_ACCOUNTS.admin;
    const cookieOf = (res: Response) =>
      res.headers
        .getSetCookie()
        .find((c) => c.startsWith(`${sessionCookieName()}=`))!
        .split(";")[0];
    const phone = cookieOf(await passwordAttempt(account.email, account.password, "192.0.2.95"));
    const laptop = cookieOf(await passwordAttempt(account.email, account.password, "192.0.2.96"));
    const { token, cookie } = await csrf();
    const out = await nextAuth("POST", "signout", new URLSearchParams({ csrfToken: token, json: "true" }).toString(), { cookie: `${cookie}; ${phone}` });
    expect(out.status).toBe(200);
    expect(await inRequest(withCookie(new Request(`${base()}/profile`), phone), currentUser)).toBeNull();
    expect(await inRequest(withCookie(new Request(`${base()}/profile`), laptop), currentUser)).toMatchObject({ email: account.email });
  });

  it("sign out everywhere ends every device's session", async () => {
    const account = await testAccount("contributor", { email: "everywhere@example.test" });
    const phone = await sessionCookieForAccount(account);
    const laptop = await sessionCookieForAccount(account);
    const res = await callRoute(
      signOutEverywhere,
      withCookie(
        new Request(`${base()}/api/auth/profile/sign-out-everywhere`, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" }),
        laptop,
      ),
    );
    expect(res.status).toBe(200);
    expect(res.headers.get("set-cookie")).toMatch(/Max-Age=0/);
    for (const cookie of [phone, laptop]) expect(await inRequest(withCookie(new Request(`${base()}/profile`), cookie), currentUser)).toBeNull();
    db();
    expect((await User.findByPk(account.id))!.sessionVersion).toBe(1);
  });
});

describe("finding 6, next-auth's routes: bad input is a 400 naming the field", () => {
  it("an e-mail with NUL, on the password and the sign-in-link routes", async () => {
    const res = await passwordAttempt("a\u0000b@example.test", "whatever it is", "192.0.2.95");
    expect(res.status).toBe(400);
    expect(await fieldsOf(res)).toEqual(["email"]);
    const { token, cookie } = await csrf();
    const link = await nextAuth("POST", "signin/email", new URLSearchParams({ csrfToken: token, email: "a\u0000b@example.test" }).toString(), { cookie });
    expect(link.status).toBe(400);
  });

  it("a body that is not an HTML form, on sign-out, the log route and the password route", async () => {
    for (const path of ["signout", "_log", "callback/credentials"]) {
      for (const type of ["application/json", "text/plain"]) {
        const res = await nextAuth("POST", path, "{bad", { "content-type": type });
        expect(res.status, `${path} ${type}`).toBe(400);
        expect(await fieldsOf(res)).toEqual(["Content-Type"]);
      }
    }
  });

  it("a callback URL on another host, or one that does not parse", async () => {
    const evil = "http://127.0.0.1:3000.evil.example/";
    const page = await nextAuth("GET", `signin?callbackUrl=${encodeURIComponent(evil)}`);
    expect(page.status).toBe(400);
    expect(await fieldsOf(page)).toEqual(["callbackUrl"]);
    const post = await passwordAttempt(DEMO_ACCOUNTS.admin.email, "wrong", "192.0.2.96", `&callbackUrl=${encodeURIComponent(evil)}`);
    expect(post.status).toBe(400);
    expect(await fieldsOf(post)).toEqual(["callbackUrl"]);
  });
});

describe("finding 7, last sentence: the same-origin check ignores X-Forwarded-Host without a trusted proxy", () => {
  it("a write whose Origin matches only a client-written X-Forwarded-Host is refused", async () => {
    const whoAmI = route({ auth: "public" }, async () => Response.json({ ok: true }));
    const res = await callRoute(
      whoAmI,
      new Request("http://127.0.0.1:3999/x", {
        method: "POST",
        headers: { host: "127.0.0.1:3999", origin: "https://evil.test", "x-forwarded-host": "evil.test" },
      }),
    );
    expect(res.status).toBe(403);
  });
});
