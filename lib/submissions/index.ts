// Public face of lib/submissions: contributions with evidence. The form (components/submission),
// the API (app/api/v1/submissions) and the pages (app/submit, app/my/submissions) go through these.
export { createSubmission } from "./create";
export { updateSubmission } from "./update";

export { getOwnSubmission, type SubmissionView } from "./view";
export { listOwnSubmissions, OwnListQuerySchema, parseOwnListQuery, type OwnListPage } from "./own-list";
export { queueStatusMail } from "./status-mail";
export { KEY_TTL_HOURS, parseIdempotencyKey } from "./idempotency";
