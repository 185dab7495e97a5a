import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { ApiError } from "@/lib/http/errors";
import { db, User } from "@/models";
import type { Role } from "@/lib/vocabulary";
import { roleSatisfies } from "./roles";
import { signInPath } from "./safe-next";
import { decodeSessionToken, parseCookieHeader, sessionTokenFrom } from "./session-cookie";
import { isSessionEnded } from "./sessions";

// Authorisation in one place. Every page, server action and route handler that needs a signed-in
// person or a role asks here; nothing else reads the session.
//
// Role changes take effect AT ONCE: the session JWT proves who the caller is (its `sub` is the
// user id), but the role is re-read from the users table (a primary-key lookup) on every guarded
// request, so a promotion or demotion applies to the very next request with the same cookie. The
// role inside the JWT is only a hint for display. A deleted user's cookie stops working the same way,
// and so does every session that signed in before the user's last password change, or before
// the user signed out everywhere (users.session_version), and a session signed out on its own
// device (ended_sessions, ./sessions.ts).

export type SessionUser = { id: string; email: string; name: string; role: Role };

/** The user behind a session token, read fresh from the database; null for no, bad or stale tokens. */
async function userForToken(token: string | undefined): Promise<SessionUser | null> {
  const claims = await decodeSessionToken(token);
  const id = typeof claims?.sub === "string" ? claims.sub : undefined;
  // a uuid check first, so that a token from elsewhere never reaches PostgreSQL as a bad uuid
  if (!id || !/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) return null;
  db();
  const user = await User.findByPk(id, { attributes: ["id", "email", "name", "role", "passwordChangedAt", "sessionVersion"] });
  if (!user) return null;
  // a password change (or reset) ends every session signed in before it
  const authTime = typeof claims?.authTime === "number" ? claims.authTime : 0;
  if (user.passwordChangedAt && authTime < user.passwordChangedAt.getTime()) return null;
  // a sign-out (here or "everywhere") ends every session issued before it (./sessions.ts)
  if ((claims?.sessionVersion ?? 0) !== user.sessionVersion) return null;
  if (await isSessionEnded(claims?.sid)) return null;
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/** The signed-in user of the current request (pages, server actions, route handlers), or null. */
export async function currentUser(): Promise<SessionUser | null> {
  const jar = await cookies();
  return userForToken(sessionTokenFrom(new Map(jar.getAll().map((c) => [c.name, c.value]))));
}

/** The signed-in user of a Request, from its Cookie header (for API guards; no next/headers needed). */
export async function userFromRequest(request: Request): Promise<SessionUser | null> {
  return userForToken(sessionTokenFrom(parseCookieHeader(request.headers.get("cookie"))));
}

/** `user` if it holds one of `roles` or a higher one, else ApiError(403) saying which role it needs. */
export function checkRole(user: SessionUser, roles: readonly Role[]): SessionUser {
  if (!roleSatisfies(user.role, roles)) {
    throw new ApiError(403, `This needs the ${roles.join(" or ")} role; you are signed in as a ${user.role}.`);
  }
  return user;
}

/** `user` if there is one, else ApiError(401). */
export function mustBeSignedIn(user: SessionUser | null): SessionUser {
  if (!user) throw new ApiError(401, "Sign in first: this needs a Shuntbook account.");
  return user;
}

/** The signed-in user, or ApiError(401). */
export async function requireUser(): Promise<SessionUser> {
  return mustBeSignedIn(await currentUser());
}

/** The signed-in user holding one of `roles` (or a higher one): ApiError(401) anonymous, ApiError(403) otherwise. */
export async function requireRole(...roles: Role[]): Promise<SessionUser> {
  return checkRole(await requireUser(), roles);
}

/** For pages and server actions: the signed-in user, or a redirect to sign-in that comes back to nextPath. */
export async function requirePageUser(nextPath: string): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(signInPath(nextPath));
  return user;
}

/** As requirePageUser, and a redirect to /forbidden when the role does not suffice. */
export async function requirePageRole(nextPath: string, ...roles: Role[]): Promise<SessionUser> {
  const user = await requirePageUser(nextPath);
  if (!roleSatisfies(user.role, roles)) redirect(`/forbidden?needs=${encodeURIComponent(roles.join(","))}`);
  return user;
}
