import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { db } from "@/models";

// Attempts at signing in and at resetting a password, counted in PostgreSQL (table rate_limits,
// made by migration; tableCreated: true so the library runs no DDL) so that every app instance
// shares one count. Keys are the caller's IP and the e-mail address tried: one person mistyping
// does not lock out the rest of a shared network, and one address cannot be hammered from an IP.

export type LimitName = "signIn" | "passwordReset" | "signUp";

/** Points per window; each attempt costs one point. */
export const LIMITS: Record<LimitName, { points: number; durationSeconds: number; what: string }> = {
  // a successful sign-in clears its key, so this counts failures in practice
  signIn: { points: 8, durationSeconds: 15 * 60, what: "sign-in attempts" },
  passwordReset: { points: 3, durationSeconds: 60 * 60, what: "password reset requests" },
  signUp: { points: 5, durationSeconds: 60 * 60, what: "new accounts" },
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

export function limitKey(ip: string, email: string): string {
  // the key column is varchar(255); an over-long address is cut, not refused, since it is only a key
  return `${ip.slice(0, 64)}:${email.trim().toLowerCase().slice(0, 160)}`;
}

export type LimitVerdict = { ok: true } | { ok: false; retryAfterSeconds: number; message: string };

/** Spends one attempt; `ok: false` once the window's attempts are used up. */
export async function spendAttempt(name: LimitName, key: string): Promise<LimitVerdict> {
  try {
    await limiter(name).consume(key, 1);
    return { ok: true };
  } catch (rejection) {
    if (!(rejection instanceof RateLimiterRes)) throw rejection; // the database, not the limit
    const retryAfterSeconds = Math.max(1, Math.ceil(rejection.msBeforeNext / 1000));
    return { ok: false, retryAfterSeconds, message: tooManyMessage(name, retryAfterSeconds) };
  }
}

/** Forgets a key's attempts (after a successful sign-in). */
export async function clearAttempts(name: LimitName, key: string): Promise<void> {
  await limiter(name).delete(key);
}

function tooManyMessage(name: LimitName, retryAfterSeconds: number): string {
  const minutes = Math.ceil(retryAfterSeconds / 60);
  const wait = retryAfterSeconds < 90 ? `${retryAfterSeconds} seconds` : `${minutes} minutes`;
  return `Too many ${LIMITS[name].what} for this address from your network. Wait ${wait} and try again.`;
}

/** The caller's address as the nearest proxy reports it (first X-Forwarded-For hop), else "unknown". */
export function clientIp(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || headers.get("x-real-ip")?.trim() || "unknown";
}
