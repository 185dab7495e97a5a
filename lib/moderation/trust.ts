import { QueryTypes, type Transaction } from "sequelize";
import { env } from "@/lib/env";
import { db, User } from "@/models";
import type { SubmissionStatus, TrustReason } from "@/lib/vocabulary";
import { flagsOfRow, scoredSubmission, type SubmissionFlags } from "./flags";
import { applyTransition } from "./transition";

// Trusted contributors: someone whose submissions have been approved MODERATION_TRUST_THRESHOLD
// times (default 5) without a single rejection no longer waits in the queue, unless the new
// submission raises a flag. An admin can overrule the record either way (users.trusted: true =
// trusted regardless, false = never, null = by record; PATCH /api/v1/admin/users/{id}).

export function trustThreshold(): number {
  return env().MODERATION_TRUST_THRESHOLD;
}

/** A contributor's submissions by current status (a reverted approval no longer counts). */
export type ContributorRecord = Record<SubmissionStatus, number> & { total: number };

/** Counts by status, through submissions_contributor_status_created_idx. */
export async function contributorRecord(userId: string, transaction?: Transaction): Promise<ContributorRecord> {
  const [row] = await db().query<ContributorRecord>(
    `SELECT count(*) FILTER (WHERE status = 'pending')::int AS pending,
            count(*) FILTER (WHERE status = 'approved')::int AS approved,
            count(*) FILTER (WHERE status = 'rejected')::int AS rejected,
            count(*) FILTER (WHERE status = 'changes_requested')::int AS changes_requested,
            count(*)::int AS total
       FROM submissions WHERE contributor_id = :id`,
    { replacements: { id: userId }, type: QueryTypes.SELECT, transaction },
  );
  return row;
}

export type TrustState = {
  trusted: boolean;
  reason: TrustReason;
  /** The admin's setting: true, false, or null (by record). */
  override: boolean | null;
  threshold: number;
  approved: number;
  rejected: number;
};

/** The rule itself, without the database: the admin's word first, then the record. */
export function decideTrust(record: Pick<ContributorRecord, "approved" | "rejected">, override: boolean | null, threshold = trustThreshold()): TrustState {
  const base = { override, threshold, approved: record.approved, rejected: record.rejected };
  if (override === true) return { ...base, trusted: true, reason: "admin" };
  if (override === false) return { ...base, trusted: false, reason: "revoked" };
  if (record.rejected > 0) return { ...base, trusted: false, reason: "rejected" };
  if (record.approved >= threshold) return { ...base, trusted: true, reason: "record" };
  return { ...base, trusted: false, reason: "building" };
}

/** users.trusted: the admin's override, null when there is none; undefined when there is no such user. */
async function trustOverride(userId: string, transaction?: Transaction): Promise<boolean | null | undefined> {
  db();
  const user = await User.findByPk(userId, { attributes: ["trusted"], transaction });
  return user ? user.trusted : undefined;
}

/** A contributor's trust; null when there is no such user. */
export async function trustOf(userId: string, transaction?: Transaction): Promise<TrustState | null> {
  // one after the other: queries of one transaction share its connection
  const override = await trustOverride(userId, transaction);
  if (override === undefined) return null;
  return decideTrust(await contributorRecord(userId, transaction), override);
}

export type TrustOutcome =
  | { autoApproved: true; eventId: number; version: number }
  | { autoApproved: false; why: "not_pending" | "not_trusted" | "flagged"; trust: TrustState | null; flags: SubmissionFlags | null };

/**
 * Call inside the transaction that creates a submission, after its row (and its evidence verdict)
 * is written. When its contributor is trusted and it raises no flag — no value with |modified z|
 * > 3.5 against its group's approved values, no evidence mismatch (too few approved values to
 * judge is not a flag) — it is approved at once: status, audit event 'auto_approve' (no actor),
 * board_stats and history refreshed, the approval mail queued, the board's cached values dropped
 * after commit. Otherwise nothing is written and the reason is returned.
 */
export async function applyTrustOnCreate(submissionId: number, transaction: Transaction): Promise<TrustOutcome> {
  const row = await scoredSubmission(submissionId, transaction);
  if (!row || row.status !== "pending") return { autoApproved: false, why: "not_pending", trust: null, flags: row ? flagsOfRow(row) : null };
  const trust = await trustOf(row.contributorId, transaction);
  const flags = flagsOfRow(row);
  if (!trust?.trusted) return { autoApproved: false, why: "not_trusted", trust, flags };
  if (flags.outlier || flags.mismatch) return { autoApproved: false, why: "flagged", trust, flags };
  const result = await applyTransition(
    {
      submissionId,
      expectedVersion: row.version,
      allowedFrom: ["pending"],
      to: { status: "approved", moderatorNote: null },
      actorId: null,
      action: "auto_approve",
      reason: null,
    },
    transaction,
  );
  return { autoApproved: true, eventId: result.eventId, version: result.after.version };
}
