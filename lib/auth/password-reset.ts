import { Op } from "sequelize";
import { z } from "zod";
import { ApiError } from "@/lib/http/errors";
import { JOB_PRIORITY, defineJob, enqueue } from "@/lib/jobs";
import { passwordChangedMail, passwordResetMail } from "@/lib/mail/templates";
import { db, PasswordResetToken, User } from "@/models";
import { byEmail } from "./accounts";
import { hashLinkToken, newLinkToken } from "./link-token";
import { hashPassword } from "./passwords";
import { siteUrl } from "./site-url";

// Password reset by e-mail. The link carries 32 random bytes; the table keeps only their SHA-256
// (a fast hash is enough: the token is random, not a password). A token works once, for an hour,
// and asking again retires the earlier ones. Both steps run in one transaction with the mail
// they cause, which goes out through the job queue (retried if the relay is down).
// The request itself (POST /api/auth/password-reset) only queues the job "auth.password-reset"
// (queuePasswordReset): the lookup, the token and the mail happen in the job, so the answer takes
// the same time whether or not an account has the address (issue 12, finding 9: a reset for an
// existing address took twice as long as for an unknown one).

export const RESET_TOKEN_MINUTES = 60;

/**
 * Starts a reset for `email` if an account has it. Says nothing about whether one does: the
 * caller answers the same either way, so the form cannot be used to find out who has an account.
 * Returns the token for tests; never show it to the requester.
 */
export async function requestPasswordReset(email: string): Promise<string | null> {
  const sequelize = db();
  const user = await User.findOne({ where: byEmail(email) });
  if (!user) return null;
  const { token, tokenHash } = newLinkToken();
  await sequelize.transaction(async (transaction) => {
    const now = new Date();
    await PasswordResetToken.update({ usedAt: now }, { where: { userId: user.id, usedAt: null }, transaction });
    await PasswordResetToken.create(
      { userId: user.id, tokenHash, expiresAt: new Date(now.getTime() + RESET_TOKEN_MINUTES * 60_000), createdAt: now },
      { transaction },
    );
    const url = siteUrl(`/reset-password?token=${encodeURIComponent(token)}`);
    await enqueue(
      "mail.send",
      { to: user.email, ...passwordResetMail({ name: user.name, url, minutes: RESET_TOKEN_MINUTES }) },
      { transaction, priority: JOB_PRIORITY.urgent },
    );
  });
  return token;
}

/** The queued half of a reset request; retried like a mail if the database is away. */
export const PASSWORD_RESET_JOB = defineJob("auth.password-reset", {
  parse: (data) => z.object({ email: z.email().max(254) }).parse(data),
  run: async ({ email }) => void (await requestPasswordReset(email)),
  retryLimit: 5,
  retryDelay: 30,
  retryBackoff: true,
  expireInSeconds: 60,
});

/** The request's half: the same work for every address (queue the job). */
export async function queuePasswordReset(email: string): Promise<void> {
  await enqueue(PASSWORD_RESET_JOB, { email });
}

const BAD_LINK = "This reset link has expired or was already used. Ask for a new one.";

/** Sets the new password if the token is good; returns the account's e-mail so the page can offer sign-in. */
export async function completePasswordReset(token: string, newPassword: string): Promise<{ email: string }> {
  const sequelize = db();
  const newHash = await hashPassword(newPassword);
  return sequelize.transaction(async (transaction) => {
    // the row lock makes two submissions of one link race for it: the second finds it used
    const row = await PasswordResetToken.findOne({
      where: { tokenHash: hashLinkToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!row) throw new ApiError(400, BAD_LINK, { token: [BAD_LINK] });
    const user = await User.findByPk(row.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new ApiError(400, BAD_LINK, { token: [BAD_LINK] });
    const now = new Date();
    await row.update({ usedAt: now }, { transaction });
    await PasswordResetToken.update({ usedAt: now }, { where: { userId: user.id, usedAt: null }, transaction });
    // passwordChangedAt ends every session from before now, including any an intruder holds
    await User.scope("withPassword").update({ passwordHash: newHash, passwordChangedAt: now }, { where: { id: user.id }, transaction });
    await enqueue(
      "mail.send",
      { to: user.email, ...passwordChangedMail({ name: user.name, signInUrl: siteUrl("/signin") }) },
      { transaction, priority: JOB_PRIORITY.urgent },
    );
    return { email: user.email };
  });
}
