import { createHash, randomBytes } from "node:crypto";

// The secret in a mailed link (password reset, sign-up confirmation). 32 random bytes, sent once
// in the link; only its SHA-256 is stored, so a copy of the table opens no account.

/** The stored form of a link token. */
export const hashLinkToken = (token: string): string => createHash("sha256").update(token).digest("hex");

/** A fresh link token and the hash to store for it. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashLinkToken(token) };
}
