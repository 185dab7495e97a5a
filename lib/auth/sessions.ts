import { db, User } from "@/models";

// Ending sessions on the server. Session cookies are JWTs that nothing stores, so deleting one in
// the browser leaves any copy working until it expires. Each user has a session version instead
// (users.session_version); every session JWT carries the version it began with, and the guard
// (./guard.ts) and next-auth's own session endpoint (./options.ts) refuse one that differs. A
// sign-out adds one to it: simple and certain, at the price that signing out on one device signs
// the account out on the others too (said on the profile page).

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
