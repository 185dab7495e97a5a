import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { ApiError } from "@/lib/http/errors";
import type { Role } from "@/lib/vocabulary";
import { roleSatisfies } from "./roles";
import { signInPath } from "./safe-next";
import { decodeSessionToken, parseCookieHeader, sessionTokenFrom } from "./session-cookie";
import { liveSessionUser } from "./sessions";

// Authorisation in one place. Every page, server action and route handler that needs a signed-in
// person or a role asks here; nothing else reads the session.
//
// Role changes take effect AT ONCE: the session JWT proves who the caller is (its `sub` is the
// user id), but the role is re-read from the users table (a primary-key lookup) on every guarded
// request, so a promotion or demotion applies to the very next request with the same cookie. The
// role inside the JWT is only a hint for display. A deleted user's cookie stops working the same way,
// and so does a session ended by a password change or a sign-out (./sessions.ts, liveSessionUser).

export type SessionUser = { id: string; email: string; name: string; role: Role };

/** The user behind a session token, read fresh from the database; null for no, bad or stale tokens. */
async function userForToken(token: string | undefined): Promise<SessionUser | null> {
  const user = await liveSessionUser(await decodeSessionToken(token));
  return user ? { id: user.id, email: user.email, name: user.name, role: user.role } : null;
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
