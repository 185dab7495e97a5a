// The words of moderation: the queue's filters and sort orders, the logged actions and what they
// are called, and the limits of the texts moderators write. The migrations' CHECKs spell the same
// action words.

export const AUDIT_ACTIONS = ["approve", "reject", "request_changes", "auto_approve", "revert", "user_update"] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];
export type AuditEntityType = "submission" | "user";

/**
 * Why a pending submission needs a closer look:
 *  - "outlier":  a value's |modified z| against the group's approved values exceeds 3.5
 *                (NIST/SEMATECH e-Handbook §1.3.5.17), scored with board_stats' median and MAD;
 *  - "mismatch": its own evidence disagrees with the values (submissions.evidence_mismatch);
 *  - "new":      its contributor has no approved submission yet;
 *  - "none":     none of these (the filter for what bulk approval may take).
 * Too few approved values to judge (n < 3) is not a flag: there is nothing to compare against.
 */
export const QUEUE_FLAGS = ["outlier", "mismatch", "new", "none"] as const;
export type QueueFlag = (typeof QUEUE_FLAGS)[number];

/** How long a submission has waited: under a day, under a week, a week or more. */
export const QUEUE_AGES = ["day", "week", "older"] as const;
export type QueueAge = (typeof QUEUE_AGES)[number];

/** "severity": outliers by |z|, then evidence mismatches, then first-time contributors, then the rest; oldest first within each. */
export const QUEUE_SORTS = ["severity", "oldest", "newest"] as const;
export type QueueSort = (typeof QUEUE_SORTS)[number];

export const QUEUE_DEFAULT_PAGE_SIZE = 20;
export const QUEUE_MAX_PAGE_SIZE = 100;
/** Bulk approval takes at most this many items per request. */
export const BULK_MAX_ITEMS = 100;

export const QUEUE_FLAG_LABELS: Record<QueueFlag, string> = {
  outlier: "Far from the approved values",
  mismatch: "Evidence disagrees",
  new: "First-time contributor",
  none: "No flags",
};

export const QUEUE_AGE_LABELS: Record<QueueAge, string> = {
  day: "Last 24 hours",
  week: "Last 7 days",
  older: "Waiting over a week",
};

export const QUEUE_SORT_LABELS: Record<QueueSort, string> = {
  severity: "Most serious first",
  oldest: "Oldest first",
  newest: "Newest first",
};

/** The three decisions a moderator makes on a pending submission. */
export type Decision = "approve" | "reject" | "request_changes";

export const ACTION_LABELS: Record<AuditAction, string> = {
  approve: "Approved",
  reject: "Rejected",
  request_changes: "Asked for changes",
  auto_approve: "Approved automatically (trusted contributor)",
  revert: "Reverted",
  user_update: "Changed a user's role or trust",
};

/** moderator_note and audit reasons: the submissions CHECK allows 1–4000 characters. */
export const NOTE_MAX_LENGTH = 4000;

/** The one answer to a decision based on a version someone else has already moved past. */
export const CONFLICT_MESSAGE = "Someone else acted on this first";

/**
 * Trust, as lib/moderation/trust.ts decides it:
 *  - "admin":    an admin marked this person trusted;
 *  - "record":   enough approved submissions and no rejection;
 *  - "revoked":  an admin marked this person not trusted, whatever their record;
 *  - "rejected": they have had a submission rejected;
 *  - "building": not enough approved submissions yet.
 */
export type TrustReason = "admin" | "record" | "revoked" | "rejected" | "building";

export const TRUST_LABELS: Record<TrustReason, string> = {
  admin: "Trusted by an admin",
  record: "Trusted by their record",
  revoked: "Not trusted (set by an admin)",
  rejected: "Not trusted: a submission was rejected",
  building: "Not trusted yet",
};
