import { NextRequest } from "next/server";
import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { GET, POST } from "@/app/api/auth/[...nextauth]/route";
import { currentUser } from "@/lib/auth/guard";
import { LIMITS } from "@/lib/auth/rate-limit";
import { sessionCookieName } from "@/lib/auth/session-cookie";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { env } from "@/lib/env";
import { stopBoss } from "@/lib/jobs";
import { db, User, VerificationToken } from "@/models";
import { callRoute, inRequest, linkIn, waitForMails, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

// next-auth's own route handler, called in-process the way Next.js would call it: a CSRF token
// first (double-submit cookie), then the sign-in POST, then the session cookie it sets is the
// one the guard reads.

setupTestDatabase("seeded");
afterAll(() => stopBoss());

const base = () => env().NEXTAUTH_URL!;
const ctx = (...segments: string[]) => ({ params: Promise.resolve({ nextauth: segments }) });

/** Cookie jar of one "browser": name → value, from Set-Cookie headers. */
class Jar {
  private cookies = new Map<string, string>();
  take(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      const value = pair.slice(eq + 1);
      if (value === "" || /Max-Age=0|expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(pair.slice(0, eq));
      else this.cookies.set(pair.slice(0, eq), value);
    }
  }
  header() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }
  session() {
    return this.cookies.get(sessionCookieName());
  }
}

async function call(jar: Jar, method: "GET" | "POST", path: string, form?: Record<string, string>, headers: Record<string, string> = {}) {
  const segments = path.split("?")[0].split("/").filter(Boolean);
  const request = new NextRequest(`${base()}/api/auth/${path}`, {
    method,
    headers: { cookie: jar.header(), ...(form ? { "content-type": "application/x-www-form-urlencoded" } : {}), ...headers },
    body: form ? new URLSearchParams(form).toString() : undefined,
  });
  const res = await callRoute(method === "GET" ? GET : POST, request, ctx(...segments));
  jar.take(res);
  return res;
}

async function csrf(jar: Jar): Promise<string> {
  const res = await call(jar, "GET", "csrf");
  return ((await res.json()) as { csrfToken: string }).csrfToken;
}

const signInWithPassword = async (jar: Jar, email: string, password: string, headers: Record<string, string> = {}) =>
  call(jar, "POST", "callback/credentials", { csrfToken: await csrf(jar), email, password, json: "true", callbackUrl: `${base()}/profile` }, headers);

const guardSees = (jar: Jar) => inRequest(withCookie(new Request(`${base()}/profile`), jar.header()), currentUser);

describe("next-auth route: e-mail and password", () => {
  it("the demo contributor signs in; the session cookie is an HttpOnly, SameSite=Lax JWT the guard accepts", async () => {
    const jar = new Jar();
    const res = await signInWithPassword(jar, DEMO_ACCOUNTS.contributor.email, DEMO_ACCOUNTS.contributor.password);
    expect(res.status).toBe(200);
    expect((await res.json()).url).toBe(`${base()}/profile`);
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith(sessionCookieName()))!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(jar.session()!.split(".")).toHaveLength(5); // compact JWE: header.key.iv.ciphertext.tag
    expect(await guardSees(jar)).toMatchObject({ email: DEMO_ACCOUNTS.contributor.email, role: "contributor" });

    const session = await (await call(jar, "GET", "session")).json();
    expect(session.user).toMatchObject({ email: DEMO_ACCOUNTS.contributor.email, role: "contributor" });
    expect(session.user.id).toMatch(/^[0-9a-f-]{36}$/);
  });

  it("a wrong password gets next-auth's CredentialsSignin error and no session", async () => {
    const jar = new Jar();
    const res = await signInWithPassword(jar, DEMO_ACCOUNTS.admin.email, "not the admin password");
    expect(res.status).toBe(401);
    expect(new URL((await res.json()).url).searchParams.get("error")).toBe("CredentialsSignin");
    expect(jar.session()).toBeUndefined();
  });

  it(`attempt ${LIMITS.signIn.points + 1} from one IP for one address gets a 429 JSON before next-auth sees it`, async () => {
    const jar = new Jar();
    const ip = { "x-forwarded-for": "192.0.2.44" }; // RFC 5737 documentation address
    for (let i = 0; i < LIMITS.signIn.points; i++) {
      const res = await signInWithPassword(jar, DEMO_ACCOUNTS.moderator.email, `wrong ${i}`, ip);
      expect(res.status).toBe(401); // next-auth's answer to a wrong password
    }
    const limited = await signInWithPassword(jar, DEMO_ACCOUNTS.moderator.email, DEMO_ACCOUNTS.moderator.password, ip);
    expect(limited.status).toBe(429);
    expect(limited.headers.get("retry-after")).toMatch(/^\d+$/);
    expect((await limited.json()).error).toMatchObject({ code: "too_many_requests" });
    expect(jar.session()).toBeUndefined();
    // the account is now locked for a while from anywhere, the right password included (issue 12, finding 1)
    expect(
      (await signInWithPassword(new Jar(), DEMO_ACCOUNTS.moderator.email, DEMO_ACCOUNTS.moderator.password, { "x-forwarded-for": "192.0.2.45" })).status,
    ).toBe(429);
  });

  it("a successful sign-in clears the count, so earlier typos do not add up", async () => {
    const ip = { "x-forwarded-for": "192.0.2.60" };
    for (let round = 0; round < 2; round++) {
      // the contributor, whose last sign-in succeeded: the admin already has a wrong password above, which counts against the account
      for (let i = 0; i < LIMITS.signIn.points - 1; i++) await signInWithPassword(new Jar(), DEMO_ACCOUNTS.contributor.email, "typo", ip);
      const ok = await signInWithPassword(new Jar(), DEMO_ACCOUNTS.contributor.email, DEMO_ACCOUNTS.contributor.password, ip);
      expect(ok.status).toBe(200);
    }
  });

  it("sign-out clears the session cookie", async () => {
    const jar = new Jar();
    await signInWithPassword(jar, DEMO_ACCOUNTS.contributor.email, DEMO_ACCOUNTS.contributor.password);
    expect(jar.session()).toBeDefined();
    await call(jar, "POST", "signout", { csrfToken: await csrf(jar), json: "true", callbackUrl: `${base()}/` });
    expect(jar.session()).toBeUndefined();
  });
});

describe("next-auth route: magic link", () => {
  it("mails a link; following it signs in (and creates a contributor for a new address); the link works once", async () => {
    const email = "first.visit@example.test";
    const jar = new Jar();
    const res = await call(jar, "POST", "signin/email", {
      csrfToken: await csrf(jar),
      email: "First.Visit@Example.test",
      json: "true",
      callbackUrl: `${base()}/profile`,
    });
    // next-auth's verify-request step, which sends the browser on to our /signin/check-email page
    expect(new URL((await res.json()).url).pathname).toBe("/api/auth/verify-request");
    db();
    const stored = await VerificationToken.findOne({ where: { identifier: email } });
    expect(stored).not.toBeNull();

    const [mail] = await waitForMails(email);
    expect(mail.subject).toBe("Sign in to Shuntbook");
    const link = new URL(linkIn(mail, "/api/auth/callback/email"));
    const token = link.searchParams.get("token")!;
    expect(stored!.token).not.toBe(token); // next-auth keeps only a hash

    const path = `callback/email${link.search}`;
    const back = await call(jar, "GET", path);
    expect(back.status).toBe(302);
    expect(back.headers.get("location")).toBe(`${base()}/profile`);
    const user = await guardSees(jar);
    expect(user).toMatchObject({ email, role: "contributor", name: "first visit" });
    expect((await User.findByPk(user!.id))!.emailVerified).toBeInstanceOf(Date);

    const again = await call(new Jar(), "GET", path);
    expect(again.headers.get("location")).toMatch(/error=Verification/);
  });

  it("magic-link requests share the sign-in limit", async () => {
    const ip = { "x-forwarded-for": "192.0.2.77" };
    const ask = async () => {
      const jar = new Jar();
      return call(jar, "POST", "signin/email", { csrfToken: await csrf(jar), email: "flood@example.test", json: "true" }, ip);
    };
    for (let i = 0; i < LIMITS.signIn.points; i++) expect((await ask()).status).toBe(200);
    expect((await ask()).status).toBe(429);
  });
});
