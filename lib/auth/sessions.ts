import { randomUUID } from "node:crypto";
import { Op } from "sequelize";
import { db, EndedSession, User } from "@/models";

// Ending sessions on the server. Session cookies are JWTs that nothing stores, so deleting one in
// the browser leaves any copy working until it expires. Two checks close that:
// - each session carries its own id (the `sid` claim, made at sign-in); a sign-out lists it in
//   ended_sessions, so that session (and every copy of its cookie) ends while the account's other
//   devices stay signed in;
// - each user has a session version (users.session_version) that every session JWT carries from
//   sign-in; "sign out everywhere" and a password change move it on, ending all of them.
// A password change (or reset) also ends every session signed in before it (users.password_changed_at).
// liveSessionUser applies all three in one query; the guard (./guard.ts) and next-auth's own
// session endpoint (./options.ts) both ask it, so neither can forget a rule.

/** A fresh session id for a sign-in. */
export const newSessionId = (): string => randomUUID();

/** The version a session starting now carries. */
export async function currentSessionVersion(userId: string): Promise<number> {
  db();
  return (await User.findByPk(userId, { attributes: ["id", "sessionVersion"] }))?.sessionVersion ?? 0;
}

/** Ends every session of the user issued so far. */
export async function endSessions(userId: string): Promise<void> {
  db();
  await User.increment("sessionVersion", { by: 1, where: { id: userId } });
}

const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Ends one session (its sid) until it would have expired anyway; clears entries past their expiry. */
export async function endSession(sid: unknown, userId: string, expiresAt: Date): Promise<void> {
  if (typeof sid !== "string" || !UUID_RE.test(sid)) return;
  db();
  await EndedSession.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } });
  await EndedSession.upsert({ sid, userId, expiresAt });
}

/** What a session JWT says about itself (next-auth's JWT and lib/auth/session-cookie's claims alike). */
type SessionClaimsLike = { sub?: unknown; authTime?: unknown; sessionVersion?: unknown; sid?: unknown } | null | undefined;

/**
 * The user behind a session that is still live, read fresh from the database (so the role is the
 * current one), or null: no such user, or a session ended by a password change, by "sign out
 * everywhere" or by its own sign-out. One primary-key lookup, with ended_sessions joined by its
 * primary key when the token has a sid (tokens without one predate the rule).
 */
export async function liveSessionUser(claims: SessionClaimsLike): Promise<User | null> {
  const id = claims?.sub;
  // a uuid check first, so that a token from elsewhere never reaches PostgreSQL as a bad uuid
  if (typeof id !== "string" || !UUID_RE.test(id)) return null;
  const sid = typeof claims?.sid === "string" && UUID_RE.test(claims.sid) ? claims.sid : null;
  db();
  const user = await User.findByPk(id, {
    attributes: ["id", "email", "name", "role", "passwordChangedAt", "sessionVersion"],
    include: sid ? [{ model: EndedSession, as: "endedSessions", attributes: ["sid"], where: { sid }, required: false }] : [],
  });
  if (!user) return null;
  const authTime = typeof claims?.authTime === "number" ? claims.authTime : 0;
  if (user.passwordChangedAt && authTime < user.passwordChangedAt.getTime()) return null;
  if ((typeof claims?.sessionVersion === "number" ? claims.sessionVersion : 0) !== user.sessionVersion) return null;
  if (((user as User & { endedSessions?: EndedSession[] }).endedSessions?.length ?? 0) > 0) return null;
  return user;
}
