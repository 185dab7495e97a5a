import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as resetRequest } from "@/app/api/auth/password-reset/route";
import { POST as signUpConfirmRoute } from "@/app/api/auth/sign-up/confirm/route";
import { POST as signUpRoute } from "@/app/api/auth/sign-up/route";
import { authenticate } from "@/lib/auth/accounts";
import { accountKey, clearAttempts } from "@/lib/auth/rate-limit";
import { stopBoss } from "@/lib/jobs";
import { drainJobsOnce } from "@/lib/jobs/worker";
import { db, SignUpToken, User } from "@/models";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { callRoute, linkIn, waitForMails } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

// Issue 12, finding 9 and deliver 8: sign-up and password reset tell nobody which addresses have an
// account. Before, sign-up answered 409 "already exists" and a reset for a known address took about
// twice as long as for an unknown one. Now both answer the same status and body, and the request
// only validates, rate-limits and queues a job; the lookup, token and mail happen in the job. The
// mailbox's owner learns the rest by mail. The idea (answer alike, mail the owner) is the OWASP
// Authentication Cheat Sheet's advice on account enumeration, from memory.

setupTestDatabase("seeded");
afterAll(() => stopBoss());

const KNOWN = DEMO_ACCOUNTS.contributor.email; // contributor@shuntbook.test
const UNKNOWN = "contributer@shuntbook.test"; // as long as KNOWN, so even the body's length cannot differ
const PASSWORD = "a long enough pw";

let network = 0;
/** A JSON POST from a fresh documentation address (RFC 5737), so the per-network limits never interfere. */
const post = (url: string, body: unknown) =>
  new Request(`http://127.0.0.1:3999${url}`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-forwarded-for": `198.51.100.${(network++ % 250) + 1}` },
    body: JSON.stringify(body),
  });

const signUp = (email: string, password = PASSWORD) =>
  callRoute(signUpRoute, post("/api/auth/sign-up", { name: "Someone", email, password, confirm: password }));
const reset = (email: string) => callRoute(resetRequest, post("/api/auth/password-reset", { email }));
const confirm = (token: string, password = PASSWORD) => callRoute(signUpConfirmRoute, post("/api/auth/sign-up/confirm", { token, password }));

/** Status, body with the address written as <address>, and the headers a client could compare. */
async function answer(res: Response, email: string) {
  const body = await res.text();
  return { status: res.status, body: body.replaceAll(email, "<address>"), length: body.length, type: res.headers.get("content-type") };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/** Median milliseconds of `rounds` requests for each address, taken alternately so that load on the machine falls on both alike. */
async function medianTimes(send: (email: string) => Promise<Response>, limitsToClear: [Parameters<typeof clearAttempts>[0], string][], rounds: number) {
  const times: Record<string, number[]> = { [KNOWN]: [], [UNKNOWN]: [] };
  for (let i = 0; i < rounds; i++) {
    for (const email of i % 2 ? [KNOWN, UNKNOWN] : [UNKNOWN, KNOWN]) {
      for (const [name, key] of limitsToClear) await clearAttempts(name, key === "*" ? accountKey(email) : key);
      const started = performance.now();
      const res = await send(email);
      times[email].push(performance.now() - started);
      expect(res.status).toBe(202);
    }
  }
  return { known: median(times[KNOWN]), unknown: median(times[UNKNOWN]) };
}

describe("finding 9: sign-up answers alike for a known and an unknown address", () => {
  it("same status and body (202 'check your mail'), never 409; nothing is looked up before the answer", async () => {
    db();
    const known = await answer(await signUp(KNOWN), KNOWN);
    const unknown = await answer(await signUp(UNKNOWN), UNKNOWN);
    expect(known.status).toBe(202);
    expect(known).toEqual(unknown);
    expect(JSON.parse(known.body).message).toMatch(/^Check your mail/);
    // the answer came before any lookup: the pending sign-up exists only once the job ran
    expect(await SignUpToken.count({ where: { email: UNKNOWN } })).toBe(0);
  });

  it("the job mails the owner of a known address a note, and an unknown address a link; no account yet", async () => {
    expect((await drainJobsOnce()).failed).toBe(0);
    const [note] = (await waitForMails(KNOWN)).filter((m) => m.subject === "Your Shuntbook account already exists");
    expect(note.text).toMatch(/already has one/);
    expect(linkIn(note, "/reset-password")).toBeTruthy();
    const [link] = await waitForMails(UNKNOWN);
    expect(link.subject).toBe("Finish your Shuntbook account");
    expect(await User.count({ where: { email: UNKNOWN } })).toBe(0);
    // the password of the known account is untouched by someone signing up with its address
    expect(await authenticate(KNOWN, DEMO_ACCOUNTS.contributor.password)).not.toBeNull();
  });

  it("takes the same time for either address: median of 15 each, ratio within 1.5", async () => {
    await signUp("warm-up@example.test"); // first call loads modules and makes the queue
    const { known, unknown } = await medianTimes(signUp, [["signUpMailbox", "*"]], 15);
    expect(Math.max(known, unknown) / Math.min(known, unknown)).toBeLessThan(1.5);
  });
});

describe("finding 9: password reset answers alike, in the same time", () => {
  it("same status and body for a known and an unknown address", async () => {
    const known = await answer(await reset(KNOWN), KNOWN);
    const unknown = await answer(await reset(UNKNOWN), UNKNOWN);
    expect(known.status).toBe(202);
    expect(known).toEqual(unknown);
  });

  it("takes the same time for either address: median of 21 each, ratio within 1.5 (3.1 with the lookup in the request)", async () => {
    await reset("warm-up@example.test");
    const { known, unknown } = await medianTimes(reset, [["resetMailbox", "*"]], 21);
    expect(Math.max(known, unknown) / Math.min(known, unknown)).toBeLessThan(1.5);
    await drainJobsOnce(); // the queued requests' mails, so later tests start from an empty queue
  });
});

describe("the mailed sign-up link", () => {
  async function tokenFor(email: string): Promise<string> {
    expect((await signUp(email)).status).toBe(202);
    expect((await drainJobsOnce()).failed).toBe(0);
    const [mail] = await waitForMails(email);
    return new URL(linkIn(mail, "/signup/confirm?token=")).searchParams.get("token")!;
  }

  it("makes the account once, with the password chosen at sign-up; a second use fails on the token field", async () => {
    const email = "once-only@example.test";
    const token = await tokenFor(email);

    const wrong = await confirm(token, "not the chosen one");
    expect(wrong.status).toBe(400);
    expect((await wrong.json()).error.fieldErrors.password[0]).toMatch(/not the password you chose/);
    expect(await User.count({ where: { email } })).toBe(0);

    const made = await confirm(token);
    expect(made.status).toBe(201);
    expect(await made.json()).toMatchObject({ email });
    expect(await User.findOne({ where: { email } })).toMatchObject({ name: "Someone", role: "contributor" });
    expect((await User.findOne({ where: { email } }))!.emailVerified).toBeInstanceOf(Date);
    expect(await authenticate(email, PASSWORD)).not.toBeNull();

    const again = await confirm(token);
    expect(again.status).toBe(400);
    expect((await again.json()).error.fieldErrors.token[0]).toMatch(/expired or was already used/);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it("two submissions of one link at once make one account", async () => {
    const email = "at-once@example.test";
    const token = await tokenFor(email);
    const statuses = (await Promise.all([confirm(token), confirm(token)])).map((r) => r.status).sort();
    expect(statuses).toEqual([201, 400]);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it("an expired link fails on the token field and makes nothing", async () => {
    const email = "too-late@example.test";
    const token = await tokenFor(email);
    await db().query("UPDATE sign_up_tokens SET created_at = now() - interval '25 hours', expires_at = now() - interval '1 hour' WHERE email = $1", {
      bind: [email],
    });
    const res = await confirm(token);
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.token[0]).toMatch(/expired/);
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it("keeps only the token's SHA-256 and a bcrypt hash of the password", async () => {
    const email = "hashed@example.test";
    const token = await tokenFor(email);
    const row = await SignUpToken.findOne({ where: { email } });
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row!.tokenHash).not.toBe(token);
    expect(row!.passwordHash).toMatch(/^\$2[aby]\$10\$/);
    expect((row!.expiresAt.getTime() - row!.createdAt.getTime()) / 3_600_000).toBe(24);
  });

  it("a damaged token is refused by the schema, on the token field", async () => {
    const res = await confirm("short");
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fieldErrors)).toEqual(["token"]);
  });
});
