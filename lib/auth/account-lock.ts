import { accountKey, blockFor, checkBlocked, clearAttempts, pointsUsed, spendAttempt, waitWords, type LimitVerdict } from "./rate-limit";

// Failed password sign-ins per account, from any address: the first FREE_FAILURES in a day cost
// nothing; each one after locks the account's password sign-in for a delay that doubles, from
// FIRST_DELAY_SECONDS up to MAX_DELAY_SECONDS. The lock holds for the right password too (or a
// guesser would learn it from the one different answer). A sign-in link still works, since it
// proves the mailbox, so the owner is never locked out by someone else's guessing. Growing delays
// rather than a hard lock-out: OWASP Authentication Cheat Sheet, "Account Lockout" (from memory).

export const FREE_FAILURES = 8;
const FIRST_DELAY_SECONDS = 30;
const MAX_DELAY_SECONDS = 15 * 60;

/** The lock after the n-th failure in a row (n counted from 1): 0 up to FREE_FAILURES - 1, then 30 s, 60 s, … ≤ 15 min. */
export function lockSeconds(failures: number): number {
  if (failures < FREE_FAILURES) return 0;
  return Math.min(MAX_DELAY_SECONDS, FIRST_DELAY_SECONDS * 2 ** (failures - FREE_FAILURES));
}

const lockMessage = (retryAfterSeconds: number) =>
  `This account had too many wrong passwords. Wait ${waitWords(retryAfterSeconds)}, or sign in with an e-mailed link instead.`;

/** Refuses a password attempt while the account is locked. Spends nothing. */
export function accountLocked(email: string): Promise<LimitVerdict> {
  return checkBlocked("accountLock", accountKey(email), lockMessage);
}

/** Counts a failed password attempt on the account and locks it when the count calls for it. */
export async function recordFailure(email: string): Promise<void> {
  const key = accountKey(email);
  await spendAttempt("accountFailures", key);
  const seconds = lockSeconds(await pointsUsed("accountFailures", key));
  if (seconds > 0) await blockFor("accountLock", key, seconds);
}

/** A successful sign-in: the account's failures are forgotten. */
export async function clearFailures(email: string): Promise<void> {
  const key = accountKey(email);
  await Promise.all([clearAttempts("accountFailures", key), clearAttempts("accountLock", key)]);
}
