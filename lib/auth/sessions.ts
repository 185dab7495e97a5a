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
// The guard (./guard.ts) and next-auth's own session endpoint (./options.ts) apply both.

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

/** True when a sign-out ended this session (a primary-key lookup). Tokens without a sid predate the rule. */
export async function isSessionEnded(sid: unknown): Promise<boolean> {
  if (typeof sid !== "string" || !UUID_RE.test(sid)) return false;
  db();
  return (await EndedSession.findByPk(sid, { attributes: ["sid"] })) !== null;
}
