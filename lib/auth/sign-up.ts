import { Op, UniqueConstraintError } from "sequelize";
import { z } from "zod";
import { ApiError } from "@/lib/http/errors";
import { JOB_PRIORITY, defineJob, enqueue } from "@/lib/jobs";
import { signUpConfirmMail, signUpExistingMail } from "@/lib/mail/templates";
import { db, SignUpToken, User } from "@/models";
import { byEmail } from "./accounts";
import { hashLinkToken, newLinkToken } from "./link-token";
import { hashPassword, verifyPassword } from "./passwords";
import { siteUrl } from "./site-url";

// Sign-up in two steps, so that the form tells nobody which addresses have an account (issue 12,
// finding 9: it used to answer 409 "already exists"), and answers in the same time either way.
//  1. The request (requestSignUp, called by POST /api/auth/sign-up) does the same work for every
//     address: it hashes the chosen password and queues the job "auth.sign-up". It looks nothing up.
//     The password is hashed here rather than in the job so that it never sits in the queue's
//     tables in plain text; bcrypt costs the same whatever the address.
//  2. The job (startSignUp) looks the address up. Taken: it mails the owner that someone tried,
//     with the way to sign in or reset. Free: it stores the name and hash with a random token
//     (only the token's SHA-256 is kept) and mails a link to /signup/confirm.
//  3. completeSignUp (POST /api/auth/sign-up/confirm) makes the account from the token, once. It
//     asks for the password again and checks it against the stored hash, so that a stranger who
//     signed up with your address cannot get you to confirm an account whose password they know.

export const SIGN_UP_TOKEN_HOURS = 24;

/** What the job carries: the form's fields with the password already hashed (bcrypt). */
const SignUpJobSchema = z.object({
  name: z.string().min(1).max(80),
  email: z.email().max(254),
  passwordHash: z.string().regex(/^\$2[aby]\$\d{2}\$[./A-Za-z0-9]{53}$/),
});

/**
 * The job: mails the owner of `email` either a confirmation link (no account yet) or a note that
 * the account exists. Returns the link's token for tests (null when the address is taken).
 */
export async function startSignUp(data: z.infer<typeof SignUpJobSchema>): Promise<string | null> {
  const sequelize = db();
  const existing = await User.findOne({ where: byEmail(data.email), attributes: ["id", "name", "email"] });
  if (existing) {
    const mail = signUpExistingMail({ name: existing.name, signInUrl: siteUrl("/signin"), resetUrl: siteUrl("/reset-password") });
    await enqueue("mail.send", { to: existing.email, ...mail }, { priority: JOB_PRIORITY.urgent });
    return null;
  }
  const { token, tokenHash } = newLinkToken();
  await sequelize.transaction(async (transaction) => {
    const now = new Date();
    // this address's finished or lapsed sign-ups are dead weight (and hold a password hash)
    await SignUpToken.destroy({
      where: { email: data.email, [Op.or]: [{ usedAt: { [Op.ne]: null } }, { expiresAt: { [Op.lte]: now } }] },
      transaction,
    });
    await SignUpToken.create({ ...data, tokenHash, expiresAt: new Date(now.getTime() + SIGN_UP_TOKEN_HOURS * 3_600_000), createdAt: now }, { transaction });
    const url = siteUrl(`/signup/confirm?token=${encodeURIComponent(token)}`);
    await enqueue(
      "mail.send",
      { to: data.email, ...signUpConfirmMail({ name: data.name, url, hours: SIGN_UP_TOKEN_HOURS }) },
      { transaction, priority: JOB_PRIORITY.urgent },
    );
  });
  return token;
}

/** The queued half of sign-up; retried like a mail if the database is away. */
export const SIGN_UP_JOB = defineJob("auth.sign-up", {
  parse: (data) => SignUpJobSchema.parse(data),
  run: async (data) => void (await startSignUp(data)),
  retryLimit: 5,
  retryDelay: 30,
  retryBackoff: true,
  expireInSeconds: 60,
});

/** The request's half: constant work whatever the address (hash, then queue). */
export async function requestSignUp(input: { name: string; email: string; password: string }): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  await enqueue(SIGN_UP_JOB, { name: input.name, email: input.email, passwordHash });
}

const BAD_LINK = "This link has expired or was already used. Sign up again, or sign in if you finished before.";
const TAKEN = "This address already has an account. Sign in, or reset its password.";
const WRONG_PASSWORD = "That is not the password you chose when you signed up.";

/** Makes the account the token stands for; returns its e-mail so the page can sign in. Field errors for a bad token or password. */
export async function completeSignUp(token: string, password: string): Promise<{ email: string }> {
  const sequelize = db();
  return sequelize.transaction(async (transaction) => {
    // the row lock makes two submissions of one link race for it: the second finds it used
    const row = await SignUpToken.findOne({ where: { tokenHash: hashLinkToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) throw new ApiError(400, BAD_LINK, { token: [BAD_LINK] });
    if (!(await verifyPassword(password, row.passwordHash))) throw new ApiError(400, WRONG_PASSWORD, { password: [WRONG_PASSWORD] });
    if (await User.findOne({ where: byEmail(row.email), attributes: ["id"], transaction })) throw new ApiError(400, TAKEN, { token: [TAKEN] });
    const now = new Date();
    try {
      // following the mailed link proves the address
      await User.create({ name: row.name, email: row.email, passwordHash: row.passwordHash, emailVerified: now, role: "contributor" }, { transaction });
    } catch (error) {
      // an account for this address made at the same moment (a magic link): the unique index decides
      if (error instanceof UniqueConstraintError) throw new ApiError(400, TAKEN, { token: [TAKEN] });
      throw error;
    }
    // this link and the address's other pending sign-ups are spent
    await SignUpToken.update({ usedAt: now }, { where: { email: row.email, usedAt: null }, transaction });
    return { email: row.email };
  });
}
