import { randomUUID } from "node:crypto";
import { randomBytes } from "node:crypto";
import { env, resetEnvCache } from "@/lib/env";
import { encodeSessionToken, sessionCookieName, SESSION_MAX_AGE_SECONDS } from "@/lib/auth/session-cookie";
import { UniqueConstraintError } from "sequelize";
import { byEmail } from "@/lib/auth/accounts";
import { db, User } from "@/models";
import type { Role } from "@/lib/vocabulary";
import { runWithRequest } from "./next-headers";

// Sign-in for tests: a session cookie exactly like the one next-auth sets after a real sign-in
// (an encrypted JWT, A256GCM, keyed from NEXTAUTH_SECRET), for a user of the role you ask for in
// the current test database. npm test gives vitest and the app under test the same secret, so
// these cookies also work over HTTP against SHUNTBOOK_TEST_APP_URL.
//
// Calling guarded code directly (no HTTP):
//
//   import { vi } from "vitest";
//   vi.mock("next/headers", () => import("@/tests/support/next-headers"));   // top of the file
//   import { callRoute, inRequest, redirectTarget, sessionCookieFor, withCookie } from "@/tests/support/auth";
//   setupTestDatabase("seeded");
//
//   // a route handler (route() reads the Request's Cookie header; requireUser() inside a
//   // handler reads next/headers, which callRoute points at the same request)
//   const cookie = await sessionCookieFor("contributor");
//   const res = await callRoute(POST, withCookie(new Request("http://test/api/v1/x", { method: "POST", body }), cookie));
//   const res2 = await callRoute(PATCH, withCookie(req, cookie), { params: Promise.resolve({ id: "7" }) });
//
//   // a server action or a page: run it "inside" a request
//   await inRequest(withCookie(new Request("http://test/contribute"), cookie), () => createSubmission(formData));
//   // anonymous page access redirects; redirectTarget turns the thrown NEXT_REDIRECT into its URL
//   expect(await redirectTarget(inRequest(new Request("http://test/moderation"), () => Page()))).toBe("/signin?next=%2Fmoderation");
//
// The roles: "contributor" | "moderator" | "admin"; anonymous is simply no cookie (ANONYMOUS).
// Over HTTP (SHUNTBOOK_TEST_APP_URL) just send the value as the Cookie header. The stand-in for
// next/headers also covers packages that require() it (next-auth's route handler), so next-auth's
// own endpoints can be called in-process too (see tests/integration/auth-nextauth.test.ts).
// Mail: mailsTo / waitForMails / linkIn read the mail catcher's inbox (MAIL_INBOX_URL); jobs
// queued with lib/jobs are sent when the test calls drainJobsOnce() (call stopBoss() in afterAll).

export const ANONYMOUS = "";

/** Who may call a route in the route-by-caller tables: nobody signed in, or a person of each role. */
export type Caller = Role | "anonymous";
export const CALLERS: Caller[] = ["anonymous", "contributor", "moderator", "admin"];
/** A route file's method, as those tables call it. */
export type RouteHandler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Tests run without npm test (plain vitest) still get a secret; the app under test is then not reachable anyway. */
function ensureSecret(): void {
  if (!env().NEXTAUTH_SECRET) {
    process.env.NEXTAUTH_SECRET = randomBytes(32).toString("base64url");
    resetEnvCache();
  }
}

export type TestAccount = { id: string; email: string; name: string; role: Role };

/**
 * Creates (or reuses, by e-mail) a user with that role in the current test database. The default
 * e-mail is one per role, so repeated calls give the same person; pass `email` for a second one
 * (e.g. "another contributor" for ownership checks).
 */
export async function testAccount(role: Role, opts: { email?: string; name?: string } = {}): Promise<TestAccount> {
  db();
  const email = (opts.email ?? `test-${role}@auth.test`).toLowerCase();
  // looked up as the app does (lower(email), the unique index), not by a plain equality the index cannot serve
  const find = () => User.findOne({ where: byEmail(email) });
  const create = () => User.create({ email, name: opts.name ?? `Test ${role}`, role });
  // two callers at once: the unique index lets one create, and the other finds that one
  const user =
    (await find()) ??
    (await create().catch(async (e: unknown): Promise<User> => {
      const winner = e instanceof UniqueConstraintError ? await find() : null;
      if (!winner) throw e;
      return winner;
    }));
  if (user.role !== role) await user.update({ role });
  return { id: user.id, email: user.email, name: user.name, role };
}

/** A Cookie header value carrying a next-auth session for `account` (what the browser would send). */
export async function sessionCookieForAccount(account: TestAccount, opts: { maxAgeSeconds?: number; signedInAt?: Date } = {}): Promise<string> {
  ensureSecret();
  const token = await encodeSessionToken(
    { sub: account.id, email: account.email, name: account.name, role: account.role, authTime: (opts.signedInAt ?? new Date()).getTime(), sid: randomUUID() },
    opts.maxAgeSeconds ?? SESSION_MAX_AGE_SECONDS,
  );
  return `${sessionCookieName()}=${token}`;
}

/** `await sessionCookieFor("moderator")`: a Cookie header value signed in as a user of that role. */
export async function sessionCookieFor(role: Role, opts: { email?: string; name?: string } = {}): Promise<string> {
  return sessionCookieForAccount(await testAccount(role, opts));
}

/** A copy of `request` with the Cookie header set (or left without one for ANONYMOUS). */
export function withCookie(request: Request, cookie: string): Request {
  const copy = new Request(request);
  if (cookie) copy.headers.set("cookie", cookie);
  else copy.headers.delete("cookie");
  return copy;
}

/** A request to `url` (on http://test) as the holder of `cookie`: JSON when there is a body, bare when `body` is undefined. */
export function jsonRequest(url: string, cookie: string, method = "GET", body?: unknown): Request {
  const init: RequestInit = body === undefined ? { method } : { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) };
  return withCookie(new Request(`http://test${url}`, init), cookie);
}

/** The context Next passes a dynamic route: its params, as a promise. */
export const routeParams = <P>(params: P) => ({ params: Promise.resolve(params) });

/** Runs fn (a server action, a page component, lib code using next/headers) as if serving `request`. */
export function inRequest<T>(request: Request, fn: () => T): T {
  return runWithRequest(request, fn);
}

/** Calls a route handler with `request`, next/headers pointing at the same request. */
export function callRoute<R extends Request, C>(handler: (request: R, context: C) => Promise<Response>, request: R, context?: C): Promise<Response> {
  return runWithRequest(request, () => handler(request, (context ?? { params: Promise.resolve({}) }) as C));
}

/**
 * The URL a page or server action redirected to (next/navigation's redirect() throws an error
 * whose digest is "NEXT_REDIRECT;<type>;<url>;<status>;"), or null when it finished without one.
 */
export async function redirectTarget(work: Promise<unknown> | (() => unknown)): Promise<string | null> {
  try {
    await (typeof work === "function" ? work() : work);
    return null;
  } catch (error) {
    const digest = (error as { digest?: unknown })?.digest;
    if (typeof digest === "string" && digest.startsWith("NEXT_REDIRECT;")) return digest.split(";").slice(2, -2).join(";");
    throw error;
  }
}

/** A mail as the local mail catcher's REST API (maildev, GET /api/email) returns it. */
export type CaughtMail = { id: string; subject: string; text: string; html: string; to: { address: string }[]; date: string };

/** Mails the catcher holds for `address`, newest last (npm test sets MAIL_INBOX_URL). */
async function mailsTo(address: string): Promise<CaughtMail[]> {
  const inbox = env().MAIL_INBOX_URL;
  if (!inbox) throw new Error("MAIL_INBOX_URL is not set: run the suite with npm test");
  const res = await fetch(new URL("/api/email", inbox));
  const all = (await res.json()) as CaughtMail[];
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase())).sort((a, b) => Date.parse(a.date) - Date.parse(b.date));
}

/** Waits (up to `timeoutMs`) until the catcher holds at least `count` mails for `address`. */
export async function waitForMails(address: string, count = 1, timeoutMs = 10_000): Promise<CaughtMail[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const mails = await mailsTo(address);
    if (mails.length >= count || Date.now() > until) return mails;
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The first http(s) link in a mail's text that contains `fragment`. */
export function linkIn(mail: CaughtMail, fragment: string): string {
  const link = mail.text.match(/https?:\/\/\S+/g)?.find((u) => u.includes(fragment));
  if (!link) throw new Error(`no link with ${fragment} in mail "${mail.subject}"`);
  return link;
}
