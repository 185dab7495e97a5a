import { describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { currentUser, requirePageRole, requirePageUser, requireRole, requireUser } from "@/lib/auth";
import { route } from "@/lib/http";
import { sessionCookieName } from "@/lib/auth/session-cookie";
import { db, User } from "@/models";
import { ANONYMOUS, callRoute, inRequest, redirectTarget, sessionCookieFor, sessionCookieForAccount, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

setupTestDatabase("migrated");

const page = (cookie: string) => withCookie(new Request("http://test/somewhere"), cookie);
const whoAmI = route({ auth: "user" }, async () => Response.json(await requireUser()));
const moderatorsOnly = route({ auth: "moderator" }, async () => Response.json({ ok: true }));

describe("the guard (lib/auth/guard.ts)", () => {
  it("anonymous: currentUser is null, requireUser throws 401, API guards answer 401 JSON, pages redirect to sign-in", async () => {
    expect(await inRequest(page(ANONYMOUS), currentUser)).toBeNull();
    await expect(inRequest(page(ANONYMOUS), requireUser)).rejects.toMatchObject({ status: 401 });
    const res = await callRoute(whoAmI, page(ANONYMOUS));
    expect(res.status).toBe(401);
    expect((await res.json()).error).toMatchObject({ status: 401, code: "unauthorized" });
    expect(await redirectTarget(inRequest(page(ANONYMOUS), () => requirePageUser("/profile?tab=name")))).toBe("/signin?next=%2Fprofile%3Ftab%3Dname");
  });

  it("a signed-in contributor is recognised, with the role from the database", async () => {
    const cookie = await sessionCookieFor("contributor");
    const user = await inRequest(page(cookie), currentUser);
    expect(user).toMatchObject({ role: "contributor", email: "test-contributor@auth.test" });
    const res = await callRoute(whoAmI, page(cookie));
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ id: user!.id, role: "contributor" });
  });

  it("wrong role: 403 from the API guard and requireRole, /forbidden for pages", async () => {
    const cookie = await sessionCookieFor("contributor");
    const res = await callRoute(moderatorsOnly, page(cookie));
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe("forbidden");
    await expect(inRequest(page(cookie), () => requireRole("moderator"))).rejects.toMatchObject({ status: 403 });
    expect(await redirectTarget(inRequest(page(cookie), () => requirePageRole("/moderation", "moderator")))).toBe("/forbidden?needs=moderator");
  });

  it("roles are ranked: admin passes every moderator check, a moderator passes contributor checks", async () => {
    const admin = await sessionCookieFor("admin");
    const moderator = await sessionCookieFor("moderator");
    expect((await callRoute(moderatorsOnly, page(admin))).status).toBe(200);
    expect((await callRoute(moderatorsOnly, page(moderator))).status).toBe(200);
    expect(await inRequest(page(moderator), () => requireRole("contributor"))).toMatchObject({ role: "moderator" });
    await expect(inRequest(page(moderator), () => requireRole("admin"))).rejects.toMatchObject({ status: 403 });
    expect(await inRequest(page(admin), () => requirePageRole("/admin", "admin"))).toMatchObject({ role: "admin" });
  });

  it("a role change takes effect at once: the same cookie is promoted and demoted between two calls", async () => {
    const account = await testAccount("contributor", { email: "changing@auth.test" });
    const cookie = await sessionCookieForAccount(account); // its JWT says "contributor" throughout
    expect((await callRoute(moderatorsOnly, page(cookie))).status).toBe(403);

    await User.update({ role: "moderator" }, { where: { id: account.id } });
    expect((await callRoute(moderatorsOnly, page(cookie))).status).toBe(200);
    expect(await inRequest(page(cookie), currentUser)).toMatchObject({ role: "moderator" });

    await User.update({ role: "contributor" }, { where: { id: account.id } });
    expect((await callRoute(moderatorsOnly, page(cookie))).status).toBe(403);
  });

  it("a deleted user's cookie, a forged cookie and an expired one all count as anonymous", async () => {
    const gone = await testAccount("contributor", { email: "gone@auth.test" });
    const goneCookie = await sessionCookieForAccount(gone);
    db();
    await User.destroy({ where: { id: gone.id } });
    expect((await callRoute(whoAmI, page(goneCookie))).status).toBe(401);

    expect((await callRoute(whoAmI, page(`${sessionCookieName()}=not-a-jwe`))).status).toBe(401);

    const expired = await sessionCookieForAccount(await testAccount("admin"), { maxAgeSeconds: -60 });
    expect((await callRoute(whoAmI, page(expired))).status).toBe(401);
  });

  it("a guarded write from another site's page is refused (403) even with a valid cookie; same-site and Origin-less calls pass", async () => {
    const cookie = await sessionCookieFor("contributor");
    const write = (origin?: string) =>
      withCookie(new Request("http://127.0.0.1:3999/x", { method: "POST", headers: { host: "127.0.0.1:3999", ...(origin ? { origin } : {}) } }), cookie);
    expect((await callRoute(whoAmI, write("https://elsewhere.test"))).status).toBe(403);
    expect((await callRoute(whoAmI, write("http://127.0.0.1:3999"))).status).toBe(200);
    expect((await callRoute(whoAmI, write())).status).toBe(200);
  });

  it("a token split into chunks, as next-auth does for long ones, is joined back", async () => {
    const cookie = await sessionCookieFor("moderator");
    const [name, token] = [cookie.slice(0, cookie.indexOf("=")), cookie.slice(cookie.indexOf("=") + 1)];
    const half = Math.floor(token.length / 2);
    const chunked = `${name}.1=${token.slice(half)}; ${name}.0=${token.slice(0, half)}`;
    expect(await inRequest(page(chunked), currentUser)).toMatchObject({ role: "moderator" });
  });
});
