import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { db } from "@/models";

// The mail worker's per-recipient throttle: at most `mails` mails to one address per window, for
// every app instance together (counted in the rate_limits table, like lib/auth/rate-limit.ts).
// A mail past the limit is not dropped: the worker puts it back on the queue for a later window,
// so a flood to one address (25 reset requests, a busy moderator) cannot hold up anyone else's
// mail, and the flooded mailbox still gets everything, spread out.

export const RECIPIENT_THROTTLE = { mails: 10, windowSeconds: 60 } as const;

const globalForThrottle = globalThis as unknown as { shuntbookMailThrottle?: { sequelize: unknown; limiter: RateLimiterPostgres } };

function limiter(): RateLimiterPostgres {
  const sequelize = db();
  if (globalForThrottle.shuntbookMailThrottle?.sequelize !== sequelize) {
    const limiter = new RateLimiterPostgres({
      storeClient: sequelize,
      storeType: "sequelize",
      tableName: "rate_limits",
      tableCreated: true,
      keyPrefix: "mailTo",
      points: RECIPIENT_THROTTLE.mails,
      duration: RECIPIENT_THROTTLE.windowSeconds,
    });
    globalForThrottle.shuntbookMailThrottle = { sequelize, limiter };
  }
  return globalForThrottle.shuntbookMailThrottle.limiter;
}

/**
 * Counts one mail to `to`. 0: send it now. Otherwise the seconds to hold it back: to the end of
 * this window, plus one window for each full `mails` already waiting ahead of it, so that a
 * backlog to one address comes back a window's worth at a time instead of all at once.
 */
export async function recipientDelaySeconds(to: string): Promise<number> {
  const key = to.trim().toLowerCase().slice(0, 200); // the key column is varchar(255)
  try {
    await limiter().consume(key, 1);
    return 0;
  } catch (rejection) {
    if (!(rejection instanceof RateLimiterRes)) throw rejection; // the database, not the limit
    const waitingAhead = Math.max(0, rejection.consumedPoints - RECIPIENT_THROTTLE.mails - 1);
    const laterWindows = Math.floor(waitingAhead / RECIPIENT_THROTTLE.mails);
    return Math.max(1, Math.ceil(rejection.msBeforeNext / 1000)) + laterWindows * RECIPIENT_THROTTLE.windowSeconds;
  }
}
