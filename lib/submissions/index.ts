// Public face of lib/submissions: contributions with evidence. The form (components/submission),
// the API (app/api/v1/submissions) and the pages (app/submit, app/my/submissions) go through these.
export { createSubmission, type CreateResult, type CreateOptions } from "./create";
export { updateSubmission } from "./update";
export { validateSubmission, type ValidatedSubmission } from "./validate";
export { listOwnSubmissions, getOwnSubmission, loadSubmissionView, type SubmissionView } from "./view";
export { queueStatusMail, statusMail, type StatusChange } from "./status-mail";
export { IDEMPOTENCY_HEADER, KEY_TTL_HOURS, parseIdempotencyKey, purgeExpiredKeys } from "./idempotency";
