import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { db } from "@/models";

// Attempts at signing in, signing up and resetting a password, counted in PostgreSQL (table
// rate_limits, made by migration; tableCreated: true so the library runs no DDL) so that every app
// instance shares one count. Three kinds of key:
//  - address + account ("signIn", "passwordReset"): one person mistyping does not lock out the
//    rest of a shared network, and one address cannot be hammered from one network;
//  - account alone ("accountLock", "resetMailbox", "signUpMailbox"): holds whatever address the tries come from
//    (see ./account-lock.ts for the growing delay);
//  - address alone ("signInAddress", "signUp"): one network cannot spray many accounts or open
//    unlimited new ones.
// The address is the one lib/auth/client-address.ts gives, never a header the client chose.

export type LimitName =
  "signIn" | "signInAddress" | "accountFailures" | "accountLock" | "passwordReset" | "resetMailbox" | "resetAddress" | "signUp" | "signUpMailbox";

/** Points per window; each attempt costs one point. */
export const LIMITS: Record<LimitName, { points: number; durationSeconds: number; what: string }> = {
  // a successful sign-in clears its key, so this counts failures in practice
  signIn: { points: 8, durationSeconds: 15 * 60, what: "sign-in attempts" },
  // every password or sign-in-link attempt from one address, whichever account it names
  signInAddress: { points: 30, durationSeconds: 15 * 60, what: "sign-in attempts" },
  // failed password sign-ins on one account in a day, from any address (a count, never refused by itself)
  accountFailures: { points: 100_000, durationSeconds: 24 * 60 * 60, what: "failed sign-ins" },
  // one point: block() sets it past the limit for the delay ./account-lock.ts computes
  accountLock: { points: 1, durationSeconds: 24 * 60 * 60, what: "failed sign-ins on this account" },
  passwordReset: { points: 3, durationSeconds: 60 * 60, what: "password reset requests" },
  // reset mails to one mailbox from anywhere: bounds what a flood can make us send to one person
  resetMailbox: { points: 6, durationSeconds: 60 * 60, what: "password reset requests" },
  resetAddress: { points: 10, durationSeconds: 60 * 60, what: "password reset requests" },
  // keyed on the address alone: accounts per network, not per network and e-mail
  signUp: { points: 5, durationSeconds: 60 * 60, what: "new accounts" },
  // sign-up mails to one mailbox from anywhere: a flood of sign-ups cannot flood one person's inbox
  signUpMailbox: { points: 3, durationSeconds: 60 * 60, what: "sign-ups" },
};

const globalForLimits = globalThis as unknown as { shuntbookLimiters?: { sequelize: unknown; limiters: Map<LimitName, RateLimiterPostgres> } };

function limiter(name: LimitName): RateLimiterPostgres {
  const sequelize = db();
  if (globalForLimits.shuntbookLimiters?.sequelize !== sequelize) {
    globalForLimits.shuntbookLimiters = { sequelize, limiters: new Map() };
  }
  const cache = globalForLimits.shuntbookLimiters.limiters;
  let found = cache.get(name);
  if (!found) {
    found = new RateLimiterPostgres({
      storeClient: sequelize,
      storeType: "sequelize",
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix: name,
      points: LIMITS[name].points,
      duration: LIMITS[name].durationSeconds,
    });
    cache.set(name, found);
  }
  return found;
}

/** An e-mail address as a key part: the key column is varchar(255), so an over-long address is cut, not refused. */
export const accountKey = (email: string) => email.trim().toLowerCase().slice(0, 160);

export function limitKey(ip: string, email: string): string {
  return `${ip.slice(0, 64)}:${accountKey(email)}`;
}

export type LimitVerdict = { ok: true } | { ok: false; retryAfterSeconds: number; message: string };

function refused(name: LimitName, msBeforeNext: number, who: string): LimitVerdict {
  const retryAfterSeconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
  return { ok: false, retryAfterSeconds, message: tooManyMessage(name, retryAfterSeconds, who) };
}

const WHO: Record<LimitName, string> = {
  signIn: "for this address from your network",
  signInAddress: "from your network",
  accountFailures: "",
  accountLock: "",
  passwordReset: "for this address from your network",
  resetMailbox: "for this address",
  resetAddress: "from your network",
  signUp: "from your network",
  signUpMailbox: "for this address",
};

/** Spends one attempt; `ok: false` once the window's attempts are used up. */
export async function spendAttempt(name: LimitName, key: string): Promise<LimitVerdict> {
  try {
    await limiter(name).consume(key, 1);
    return { ok: true };
  } catch (rejection) {
    if (!(rejection instanceof RateLimiterRes)) throw rejection; // the database, not the limit
    return refused(name, rejection.msBeforeNext, WHO[name]);
  }
}

/** Spends one attempt on each limit in turn; the first refusal wins (the later ones are not spent). */
export async function spendAttempts(...spends: [LimitName, string][]): Promise<LimitVerdict> {
  for (const [name, key] of spends) {
    const verdict = await spendAttempt(name, key);
    if (!verdict.ok) return verdict;
  }
  return { ok: true };
}

/** Forgets a key's attempts (after a successful sign-in). */
export async function clearAttempts(name: LimitName, key: string): Promise<void> {
  await limiter(name).delete(key);
}

/** How many points a key has used in its window (0 when none). */
export async function pointsUsed(name: LimitName, key: string): Promise<number> {
  return (await limiter(name).get(key))?.consumedPoints ?? 0;
}

/** Sets a key past its limit for `seconds`, whatever it held. */
export async function blockFor(name: LimitName, key: string, seconds: number): Promise<void> {
  await limiter(name).block(key, seconds);
}

/** `ok: false` while a key is past its limit, without spending anything. */
export async function checkBlocked(name: LimitName, key: string, message: (retryAfterSeconds: number) => string): Promise<LimitVerdict> {
  const res = await limiter(name).get(key);
  if (!res || res.consumedPoints <= LIMITS[name].points) return { ok: true };
  const retryAfterSeconds = Math.max(1, Math.ceil(res.msBeforeNext / 1000));
  return { ok: false, retryAfterSeconds, message: message(retryAfterSeconds) };
}

export function waitWords(retryAfterSeconds: number): string {
  return retryAfterSeconds < 90 ? `${retryAfterSeconds} seconds` : `${Math.ceil(retryAfterSeconds / 60)} minutes`;
}

function tooManyMessage(name: LimitName, retryAfterSeconds: number, who: string): string {
  return `Too many ${LIMITS[name].what} ${who}. Wait ${waitWords(retryAfterSeconds)} and try again.`;
}
