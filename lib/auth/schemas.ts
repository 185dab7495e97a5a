import { z } from "zod";
import { oneLine } from "@/lib/input/text";

// The fields of every sign-in form, checked with the same schema in the browser (react-hook-form
// with zodResolver) and in the handler, so the messages a person sees are the ones the server
// would give. Plain zod only: this file is imported by client components.

/** An e-mail address, trimmed and lower-cased: addresses are stored and compared in lower case. */
/** The account endpoints' JSON body cap: these bodies are a few short fields, so 8 kB bounds the parser. */
export const ACCOUNT_BODY_BYTES = 8 * 1024;

export const emailField = z
  .string({ error: "Enter your e-mail address." })
  .trim()
  .min(1, "Enter your e-mail address.")
  .max(254, "An e-mail address has at most 254 characters.")
  .toLowerCase()
  .pipe(z.email("That does not look like an e-mail address (name@example.com)."));

const utf8Bytes = (s: string) => new TextEncoder().encode(s).length;

/**
 * A new password. At least 10 characters (NIST SP 800-63B asks for at least 8 and no composition
 * rules, from memory; we ask for a little more), at most 72 bytes because bcrypt ignores anything
 * past that and we would rather say so than silently cut it.
 */
export const newPasswordField = z
  .string({ error: "Choose a password." })
  .min(10, "Use at least 10 characters.")
  .refine((s) => utf8Bytes(s) <= 72, "Use at most 72 bytes (about 72 plain letters; fewer with accents or emoji).")
  .refine((s) => s.trim().length > 0, "A password of only spaces is too easy to guess.");

/** A password being checked, not chosen: any length we can hash, no hints about the rules. */
const existingPasswordField = z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(200, "That is longer than any password here.");

const nameField = oneLine(
  z.string({ error: "Enter a name." }).trim().min(1, "Enter a name others will see beside your contributions.").max(80, "Use at most 80 characters."),
  "A name",
);

/** The token in a reset link: 32 random bytes, base64url. */
export const resetTokenField = z
  .string({ error: "The reset link is incomplete." })
  .regex(/^[A-Za-z0-9_-]{43}$/, "This reset link is damaged; ask for a new one.");

/** The token in a sign-up confirmation link: 32 random bytes, base64url, like a reset link's. */
export const signUpTokenField = z
  .string({ error: "The link is incomplete." })
  .regex(/^[A-Za-z0-9_-]{43}$/, "This link is damaged; copy the whole address from the mail, or sign up again.");

const confirmField = z.string({ error: "Type the password again." }).min(1, "Type the password again.");

/** The "type it again" check, reported on the confirm field. */
function sameAs<K extends string>(field: K): [(v: Record<K | "confirm", string>) => boolean, { path: string[]; message: string }] {
  // an empty confirm already has its own message ("Type the password again.")
  return [(v) => !v.confirm || v[field] === v.confirm, { path: ["confirm"], message: "The two passwords differ." }];
}

export const SignInSchema = z.object({ email: emailField, password: existingPasswordField });
export const MagicLinkSchema = z.object({ email: emailField });
export const SignUpSchema = z.object({ name: nameField, email: emailField, password: newPasswordField, confirm: confirmField }).refine(...sameAs("password"));
/** Finishing a sign-up from the mailed link: the password chosen on the form, checked against the one stored with the token. */
export const SignUpConfirmSchema = z.object({ token: signUpTokenField, password: existingPasswordField });
export const ResetRequestSchema = z.object({ email: emailField });
export const ResetConfirmSchema = z.object({ token: resetTokenField, password: newPasswordField, confirm: confirmField }).refine(...sameAs("password"));
export const ProfileNameSchema = z.object({ name: nameField });
export const ChangePasswordSchema = z
  .object({ currentPassword: existingPasswordField, newPassword: newPasswordField, confirm: confirmField })
  .refine(...sameAs("newPassword"));
/** For an account that has no password yet (made by magic link): nothing to confirm it with. */
export const SetPasswordSchema = z.object({ newPassword: newPasswordField, confirm: confirmField }).refine(...sameAs("newPassword"));

export type SignInInput = z.input<typeof SignInSchema>;
export type MagicLinkInput = z.input<typeof MagicLinkSchema>;
export type SignUpInput = z.input<typeof SignUpSchema>;
export type SignUpConfirmInput = z.input<typeof SignUpConfirmSchema>;
export type ResetRequestInput = z.input<typeof ResetRequestSchema>;
export type ResetConfirmInput = z.input<typeof ResetConfirmSchema>;
export type ProfileNameInput = z.input<typeof ProfileNameSchema>;
export type ChangePasswordInput = z.input<typeof ChangePasswordSchema>;
export type SetPasswordInput = z.input<typeof SetPasswordSchema>;
