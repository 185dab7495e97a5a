// Public face of lib/moderation: the review queue, the review, decisions (one transaction each,
// optimistic concurrency on the submission's version), the append-only audit log, admin revert,
// trusted contributors and the daily digest. The history of published values that decisions
// cause lives in lib/published/history.ts. Route handlers in app/api/v1/moderation and
// app/api/v1/admin, and the moderation pages, go through these.
export { listQueue, nextInQueue, parseQueueParams, type QueueRow } from "./queue";
export { getReview } from "./review";
export { approveSubmission, bulkApprove, decide } from "./actions";
export { revertEvent } from "./revert";
export { listAuditEvents, parseAuditQuery } from "./audit";
export { applyTrustOnCreate, decideTrust, trustOf } from "./trust";
export { getUserSummary, listUsers, parseUsersQuery, updateUser } from "./users";
export { sendModeratorDigest } from "./digest";
export { registerModerationJobs, DIGEST_CRON, DIGEST_JOB } from "./jobs";

export * from "./schemas";
