import { col, fn, where } from "sequelize";
import { ApiError } from "@/lib/http/errors";
import { enqueue } from "@/lib/jobs";
import { passwordChangedMail } from "@/lib/mail/templates";
import { db, User } from "@/models";
import type { SessionUser } from "./guard";
import { hashPassword, verifyPassword } from "./passwords";
import { siteUrl } from "./site-url";

// Accounts: password sign-in and the profile's changes (sign-up is ./sign-up.ts). Inputs arrive already parsed by
// the schemas in ./schemas.ts (e-mail trimmed and lower-cased); these functions enforce what only
// the database can tell (is the current password right).

/** Finds a user by address the way the unique index users_email_lower_idx compares them, so the index serves it. */
export const byEmail = (email: string) => where(fn("lower", col("email")), email.toLowerCase());

const sessionUser = (u: User): SessionUser => ({ id: u.id, email: u.email, name: u.name, role: u.role });

/** The user whose address and password these are, or null (same answer, same time, for either mistake). */
export async function authenticate(email: string, password: string): Promise<SessionUser | null> {
  db();
  const user = await User.scope("withPassword").findOne({ where: byEmail(email) });
  const ok = await verifyPassword(password, user?.passwordHash);
  return ok && user ? sessionUser(user) : null;
}

export async function hasPassword(userId: string): Promise<boolean> {
  db();
  const user = await User.scope("withPassword").findByPk(userId, { attributes: ["id", "passwordHash"] });
  return Boolean(user?.passwordHash);
}

export async function updateName(userId: string, name: string): Promise<SessionUser> {
  db();
  const user = await User.findByPk(userId);
  if (!user) throw new ApiError(401, "Your account no longer exists.");
  await user.update({ name });
  return sessionUser(user);
}

/**
 * Sets a new password, checking the current one when the account has one (an account made by
 * magic link may set its first password without). Records the change time, which ends every
 * other session, and enqueues a notice mail in the same transaction.
 */
export async function changePassword(userId: string, input: { currentPassword?: string; newPassword: string }): Promise<Date> {
  const sequelize = db();
  const newHash = await hashPassword(input.newPassword);
  return sequelize.transaction(async (transaction) => {
    const user = await User.scope("withPassword").findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new ApiError(401, "Your account no longer exists.");
    if (user.passwordHash) {
      const message = "That is not your current password.";
      if (!input.currentPassword) throw new ApiError(400, "Enter your current password.", { currentPassword: ["Enter your current password."] });
      if (!(await verifyPassword(input.currentPassword, user.passwordHash))) throw new ApiError(400, message, { currentPassword: [message] });
    }
    const changedAt = new Date();
    await user.update({ passwordHash: newHash, passwordChangedAt: changedAt }, { transaction });
    await enqueue("mail.send", { to: user.email, ...passwordChangedMail({ name: user.name, signInUrl: siteUrl("/signin") }) }, { transaction });
    return changedAt;
  });
}
