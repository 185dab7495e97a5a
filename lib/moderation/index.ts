// Public face of lib/moderation: the review queue, the review, decisions (one transaction each,
// optimistic concurrency on the submission's version), the append-only audit log, admin revert,
// trusted contributors and the daily digest. The history of published values that decisions
// cause lives in lib/published/history.ts. Route handlers in app/api/v1/moderation and
// app/api/v1/admin, and the moderation pages, go through these.
export { listQueue, parseQueueParams, queueCounts, QueueParamsSchema, type QueueCounts, type QueuePage, type QueueParams, type QueueRow } from "./queue";
export { getReview, figuresOf, type Figures, type GroupPoint, type OtherSubmission, type QuantityReview, type Review, type ReviewPhoto } from "./review";
export {
  approveSubmission,
  bulkApprove,
  decide,
  rejectSubmission,
  requestChanges,
  type Actor,
  type BulkItemResult,
  type BulkResult,
  type DecisionResult,
} from "./actions";
export { revertEvent } from "./revert";
export {
  getAuditEvent,
  listAuditEvents,
  parseAuditQuery,
  AuditQuerySchema,
  type AuditEventView,
  type AuditPage,
  type AuditQuery,
  type SubmissionState,
  type UserState,
} from "./audit";
export {
  applyTrustOnCreate,
  contributorRecord,
  decideTrust,
  trustOf,
  trustThreshold,
  type ContributorRecord,
  type TrustOutcome,
  type TrustState,
} from "./trust";
export { getUserSummary, listUsers, parseUsersQuery, updateUser, type UserSummary, type UsersPage, type UserUpdateResult } from "./users";
export { digestCounts, sendModeratorDigest, type DigestCounts, type DigestResult } from "./digest";
export { registerModerationJobs, DIGEST_CRON, DIGEST_JOB } from "./jobs";
export { flagsOfRow, scoredSubmission, type SubmissionFlags } from "./flags";
export { ModerationRefusal } from "./transition";
export * from "./schemas";
