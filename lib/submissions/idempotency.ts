import { createHash } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { ApiError, badRequest } from "@/lib/http/errors";
import { db } from "@/models";

// Idempotency-Key for POST /api/v1/submissions (the pattern of the IETF httpapi draft
// "The Idempotency-Key HTTP Header Field"): a client that is not sure its POST arrived sends it
// again with the same key, and gets the first response instead of a second submission.
//   - Keys are per user: two people may happen to pick the same key.
//   - The same key with a different body is refused with 422 (the draft's choice too): a client bug
//     must not silently get someone else's answer.
//   - A key is kept at least KEY_TTL_HOURS; after that it may be used afresh.
//   - Only a success is stored. A refused request writes nothing, so a corrected retry under the
//     same key is simply a new attempt.
// Concurrency: requests with the same (user, key) take an advisory lock at the start of their
// transaction, so a twin waits for the first to commit and then finds its stored response. The key
// row is inserted in the same transaction as the submission, and its primary key is the guarantee
// behind the lock: a second insert of a live key returns nothing and the caller rolls back.

export const IDEMPOTENCY_HEADER = "Idempotency-Key";
export const KEY_TTL_HOURS = 24;
const KEY_RE = /^[\x21-\x7e]{1,255}$/;

/** The header's key, null when absent; ApiError 400 (naming the header) when it cannot be a key. */
export function parseIdempotencyKey(header: string | null): string | null {
  if (header === null) return null;
  const key = header.trim();
  if (!KEY_RE.test(key)) {
    throw badRequest({ [IDEMPOTENCY_HEADER]: ["An Idempotency-Key is 1 to 255 visible ASCII characters without spaces, e.g. a UUID"] });
  }
  return key;
}

/** JSON with object keys sorted at every depth, so that key order does not make two bodies differ. */
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  if (value !== null && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
  }
  return JSON.stringify(value) ?? "null";
}

export function requestHash(body: unknown): string {
  return createHash("sha256").update(canonicalJson(body)).digest("hex");
}

export type StoredResponse = { status: number; body: unknown };

type Row = { requestHash: string; responseStatus: number; responseBody: unknown };

/** The stored first response for (user, key) while it is kept; 422 when it was for another body. */
export async function replayFor(userId: string, key: string, hash: string, transaction?: Transaction): Promise<StoredResponse | null> {
  const [row] = await db().query<Row>(
    `SELECT request_hash AS "requestHash", response_status AS "responseStatus", response_body AS "responseBody"
       FROM idempotency_keys WHERE user_id = $1 AND key = $2 AND expires_at > now()`,
    { bind: [userId, key], type: QueryTypes.SELECT, transaction },
  );
  if (!row) return null;
  if (row.requestHash !== hash) {
    throw new ApiError(
      422,
      "This Idempotency-Key was already used with a different request body. Use a new key for a new submission, or resend the first body unchanged.",
      { [IDEMPOTENCY_HEADER]: ["already used with a different body"] },
    );
  }
  return { status: row.responseStatus, body: row.responseBody };
}

/**
 * Records the response under (user, key) inside the transaction that produced it. False when a
 * live row already holds the key (a concurrent twin committed first): the caller must roll back.
 * An expired row is taken over.
 */
export async function claimKey(
  userId: string,
  key: string,
  hash: string,
  response: StoredResponse & { submissionId: number },
  transaction: Transaction,
): Promise<boolean> {
  const rows = await db().query(
    `INSERT INTO idempotency_keys (user_id, key, request_hash, response_status, response_body, submission_id, created_at, expires_at)
     VALUES ($1, $2, $3, $4, $5::jsonb, $6, now(), now() + make_interval(hours => $7))
     ON CONFLICT (user_id, key) DO UPDATE
        SET request_hash = EXCLUDED.request_hash, response_status = EXCLUDED.response_status,
            response_body = EXCLUDED.response_body, submission_id = EXCLUDED.submission_id,
            created_at = EXCLUDED.created_at, expires_at = EXCLUDED.expires_at
      WHERE idempotency_keys.expires_at <= now()
     RETURNING key`,
    { bind: [userId, key, hash, response.status, JSON.stringify(response.body), response.submissionId, KEY_TTL_HOURS], type: QueryTypes.SELECT, transaction },
  );
  return rows.length === 1;
}

/** Serialises requests with the same (user, key) until the end of `transaction` (an advisory lock). */
export async function lockKey(userId: string, key: string, transaction: Transaction): Promise<void> {
  await db().query("SELECT pg_advisory_xact_lock(hashtextextended($1, 0))", { bind: [`idempotency:${userId}:${key}`], type: QueryTypes.SELECT, transaction });
}

/** Deletes keys past their time; returns how many. For a periodic job or a maintenance task. */
export async function purgeExpiredKeys(): Promise<number> {
  const rows = await db().query("DELETE FROM idempotency_keys WHERE expires_at <= now() RETURNING key", { type: QueryTypes.SELECT });
  return rows.length;
}

/** Thrown inside the create transaction when a concurrent twin holds the key, to roll it back. */
export class KeyTakenError extends Error {
  constructor() {
    super("idempotency key taken by a concurrent request");
    this.name = "KeyTakenError";
  }
}
