import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as resetComplete } from "@/app/api/auth/password-reset/complete/route";
import { POST as resetRequest } from "@/app/api/auth/password-reset/route";
import { POST as changePasswordRoute } from "@/app/api/auth/profile/password/route";
import { GET as profileGet, PATCH as profilePatch } from "@/app/api/auth/profile/route";
import { POST as signUpConfirmRoute } from "@/app/api/auth/sign-up/confirm/route";
import { POST as signUpRoute } from "@/app/api/auth/sign-up/route";
import { authenticate } from "@/lib/auth/accounts";
import { currentUser } from "@/lib/auth/guard";
import { hashLinkToken } from "@/lib/auth/link-token";
import { LIMITS } from "@/lib/auth/rate-limit";
import { DEMO_ACCOUNT_LIST } from "@/seeders/demo/accounts";
import { stopBoss } from "@/lib/jobs";
import { drainJobsOnce } from "@/lib/jobs/worker";
import { db, PasswordResetToken, User } from "@/models";
import { callRoute, inRequest, linkIn, sessionCookieFor, testAccount, waitForMails, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

setupTestDatabase("seeded");
afterAll(() => stopBoss());

const json = (url: string, body: unknown, init: { method?: string; headers?: Record<string, string> } = {}) =>
  new Request(`http://127.0.0.1:3999${url}`, {
    method: init.method ?? "POST",
    headers: { "content-type": "application/json", ...init.headers },
    body: JSON.stringify(body),
  });

const count = (model: { count: () => Promise<number> }) => model.count();

// Sign-up answers "check your mail" and the account is made from the mailed link (issue 12 deliver 8
// changed this from 201 with the account; tests/integration/auth-enumeration.test.ts has the rest).
describe("sign-up", () => {
  it("mails a link that creates a contributor with a bcrypt hash, and the new password signs in", async () => {
    const res = await callRoute(
      signUpRoute,
      json("/api/auth/sign-up", { name: "  Wren Okafor ", email: " Wren@Example.Test ", password: "ten chars ok", confirm: "ten chars ok" }),
    );
    expect(res.status).toBe(202);
    expect((await res.json()).message).toMatch(/Check your mail/);
    expect(await User.count({ where: { email: "wren@example.test" } })).toBe(0);
    expect((await drainJobsOnce()).failed).toBe(0);
    const [mail] = await waitForMails("wren@example.test");
    expect(mail.subject).toBe("Finish your Shuntbook account");
    const token = new URL(linkIn(mail, "/signup/confirm?token=")).searchParams.get("token")!;
    const done = await callRoute(signUpConfirmRoute, json("/api/auth/sign-up/confirm", { token, password: "ten chars ok" }));
    expect(done.status).toBe(201);
    expect(await done.json()).toMatchObject({ email: "wren@example.test" });
    const stored = await User.scope("withPassword").findOne({ where: { email: "wren@example.test" } });
    expect(stored).toMatchObject({ name: "Wren Okafor", role: "contributor" });
    expect(stored!.passwordHash).toMatch(/^\$2[aby]\$10\$/); // bcrypt modular crypt format, cost 10
    expect(await authenticate("WREN@example.test", "ten chars ok")).toMatchObject({ id: stored!.id });
    expect(await authenticate("wren@example.test", "wrong password")).toBeNull();
  });

  it("refuses bad fields with a message per field and writes nothing", async () => {
    db();
    const before = await count(User);
    const res = await callRoute(signUpRoute, json("/api/auth/sign-up", { name: "", email: "not-an-address", password: "short", confirm: "different" }));
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(Object.keys(error.fieldErrors).sort()).toEqual(["confirm", "email", "name", "password"]);
    expect(error.fieldErrors.password[0]).toMatch(/at least 10/);
    expect(await count(User)).toBe(before);
  });

  it("does not say the address is taken: 202 as for any address, and the owner gets a note instead, whatever its case", async () => {
    const res = await callRoute(
      signUpRoute,
      json("/api/auth/sign-up", { name: "Copy", email: "Contributor@Shuntbook.test", password: "long enough pw", confirm: "long enough pw" }),
    );
    expect(res.status).toBe(202);
    expect((await drainJobsOnce()).failed).toBe(0);
    const mails = await waitForMails("contributor@shuntbook.test");
    expect(mails.some((m) => m.subject === "Your Shuntbook account already exists")).toBe(true);
  });

  it("refuses a body that is not JSON (so another site's form cannot post it) and a write from another site's page", async () => {
    const form = new Request("http://127.0.0.1:3999/api/auth/sign-up", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: "name=x",
    });
    expect((await callRoute(signUpRoute, form)).status).toBe(400);
    const crossSite = json("/api/auth/sign-up", {}, { headers: { origin: "https://elsewhere.test", host: "127.0.0.1:3999" } });
    expect((await callRoute(signUpRoute, crossSite)).status).toBe(403);
  });
});

describe("password sign-in", () => {
  it("every seeded demo account signs in with its documented password", async () => {
    for (const account of DEMO_ACCOUNT_LIST) {
      expect(await authenticate(account.email, account.password)).toMatchObject({ email: account.email, role: account.role });
    }
  });

  it("an unknown address and a wrong password both answer null", async () => {
    expect(await authenticate("nobody@example.test", "whatever it is")).toBeNull();
    expect(await authenticate(DEMO_ACCOUNT_LIST[0].email, "not the password")).toBeNull();
  });
});

describe("profile", () => {
  it("shows who is signed in and renames them; an empty name is refused", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "renamer@example.test" });
    const me = await callRoute(profileGet, withCookie(new Request("http://127.0.0.1:3999/api/auth/profile"), cookie));
    expect(me.status).toBe(200);
    expect((await me.json()).user.email).toBe("renamer@example.test");

    const ok = await callRoute(profilePatch, withCookie(json("/api/auth/profile", { name: "Ada Fenwick" }, { method: "PATCH" }), cookie));
    expect((await ok.json()).user.name).toBe("Ada Fenwick");
    const bad = await callRoute(profilePatch, withCookie(json("/api/auth/profile", { name: "   " }, { method: "PATCH" }), cookie));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fieldErrors.name).toBeDefined();
    expect((await User.findOne({ where: { email: "renamer@example.test" } }))!.name).toBe("Ada Fenwick");
  });

  it("anonymous callers get 401", async () => {
    expect((await callRoute(profileGet, new Request("http://127.0.0.1:3999/api/auth/profile"))).status).toBe(401);
    expect((await callRoute(profilePatch, json("/api/auth/profile", { name: "x" }, { method: "PATCH" }))).status).toBe(401);
  });

  it("changing the password needs the current one, signs out other sessions, keeps this one, and mails a notice", async () => {
    const account = await testAccount("contributor", { email: "changer@example.test" });
    await User.scope("withPassword").update(
      { passwordHash: await import("@/lib/auth/passwords").then((m) => m.hashPassword("old password 1")) },
      { where: { id: account.id } },
    );
    const { sessionCookieForAccount } = await import("@/tests/support/auth");
    const otherDevice = await sessionCookieForAccount(account, { signedInAt: new Date(Date.now() - 60_000) });
    const thisDevice = await sessionCookieForAccount(account, { signedInAt: new Date(Date.now() - 30_000) });

    const wrong = await callRoute(
      changePasswordRoute,
      withCookie(json("/api/auth/profile/password", { currentPassword: "nope", newPassword: "new password 22", confirm: "new password 22" }), thisDevice),
    );
    expect(wrong.status).toBe(400);
    expect((await wrong.json()).error.fieldErrors.currentPassword[0]).toMatch(/not your current password/);
    expect(await authenticate(account.email, "old password 1")).not.toBeNull();

    const res = await callRoute(
      changePasswordRoute,
      withCookie(
        json("/api/auth/profile/password", { currentPassword: "old password 1", newPassword: "new password 22", confirm: "new password 22" }),
        thisDevice,
      ),
    );
    expect(res.status).toBe(200);
    const fresh = res.headers.get("set-cookie")!.split(";")[0];
    expect(await authenticate(account.email, "new password 22")).not.toBeNull();
    expect(await inRequest(withCookie(new Request("http://x/"), otherDevice), currentUser)).toBeNull();
    expect(await inRequest(withCookie(new Request("http://x/"), thisDevice), currentUser)).toBeNull();
    expect(await inRequest(withCookie(new Request("http://x/"), fresh), currentUser)).toMatchObject({ id: account.id });

    expect((await drainJobsOnce()).failed).toBe(0);
    const [notice] = await waitForMails(account.email);
    expect(notice.subject).toMatch(/password was changed/);
  });
});

describe("password reset by e-mail", () => {
  it("mails a single-use link through the queue; the link sets the password once; only the hash is stored", async () => {
    const email = DEMO_ACCOUNT_LIST.find((a) => a.role === "moderator")!.email;
    const res = await callRoute(resetRequest, json("/api/auth/password-reset", { email: email.toUpperCase() }));
    expect(res.status).toBe(202);
    expect((await drainJobsOnce()).completed).toBeGreaterThanOrEqual(1);
    const [mail] = await waitForMails(email);
    expect(mail.subject).toMatch(/Reset your Shuntbook password/);
    const link = new URL(linkIn(mail, "/reset-password?token="));
    const token = link.searchParams.get("token")!;

    const row = await PasswordResetToken.findOne({ where: { tokenHash: hashLinkToken(token) } });
    expect(row).not.toBeNull();
    const minutes = (row!.expiresAt.getTime() - row!.createdAt.getTime()) / 60_000;
    expect(minutes).toBe(60);
    const plainStored = await PasswordResetToken.count({ where: { tokenHash: token } });
    expect(plainStored).toBe(0);

    const done = await callRoute(
      resetComplete,
      json("/api/auth/password-reset/complete", { token, password: "brand new secret", confirm: "brand new secret" }),
    );
    expect(done.status).toBe(200);
    expect(await authenticate(email, "brand new secret")).not.toBeNull();

    const again = await callRoute(resetComplete, json("/api/auth/password-reset/complete", { token, password: "another new one", confirm: "another new one" }));
    expect(again.status).toBe(400);
    expect((await again.json()).error.fieldErrors.token[0]).toMatch(/expired or was already used/);
    expect(await authenticate(email, "brand new secret")).not.toBeNull();
  });

  it("an expired link is refused and changes nothing", async () => {
    const { requestPasswordReset } = await import("@/lib/auth/password-reset");
    const account = await testAccount("contributor", { email: "late@example.test" });
    const token = (await requestPasswordReset(account.email))!;
    await db().query("UPDATE password_reset_tokens SET created_at = now() - interval '2 hours', expires_at = now() - interval '1 hour' WHERE user_id = $1", {
      bind: [account.id],
    });
    const res = await callRoute(
      resetComplete,
      json("/api/auth/password-reset/complete", { token, password: "too late for this", confirm: "too late for this" }),
    );
    expect(res.status).toBe(400);
    expect(await authenticate(account.email, "too late for this")).toBeNull();
  });

  it("answers the same for an unknown address, and writes no token", async () => {
    const before = await PasswordResetToken.count();
    const res = await callRoute(resetRequest, json("/api/auth/password-reset", { email: "no-such-person@example.test" }));
    expect(res.status).toBe(202);
    expect((await res.json()).message).toMatch(/If an account uses/);
    expect((await drainJobsOnce()).failed).toBe(0); // the lookup runs in the queued job
    expect(await PasswordResetToken.count()).toBe(before);
  });

  it(`is rate-limited per IP and address: request ${LIMITS.passwordReset.points + 1} gets a 429 with Retry-After`, async () => {
    const ask = (ip: string) =>
      callRoute(resetRequest, json("/api/auth/password-reset", { email: "limited@example.test" }, { headers: { "x-forwarded-for": ip } }));
    for (let i = 0; i < LIMITS.passwordReset.points; i++) expect((await ask("198.51.100.7")).status).toBe(202);
    const limited = await ask("198.51.100.7");
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = await limited.json();
    expect(body.error).toMatchObject({ status: 429, code: "too_many_requests" });
    expect(body.error.fieldErrors.email[0]).toMatch(/Too many password reset requests/);
    // another network (RFC 5737 documentation addresses) is counted on its own
    expect((await ask("203.0.113.9")).status).toBe(202);
  });
});
