import { QueryTypes, type Transaction } from "sequelize";
import { ApiError } from "@/lib/http/errors";
import { enqueue } from "@/lib/jobs";
import { invalidateBoardValues } from "@/lib/published/board-values";
import { QUANTITY_KEYS, type QuantityKey } from "@/lib/published/board-values-types";
import type { GroupKey } from "@/lib/published/group-key";
import { queueStatusMail } from "@/lib/submissions/status-mail";
import { type AuditAction, CONFLICT_MESSAGE, STATUS_LABELS, type SubmissionStatus } from "@/lib/vocabulary";
import { db } from "@/models";
import { writeAuditEvent, type SubmissionState } from "./audit";
import { refreshWithHistory } from "@/lib/published/history";
import { revertMail } from "./mails";

// One change of a submission's status, as every moderation action makes it (a decision, an
// auto-approval, a revert), inside the caller's transaction:
//   1. lock the submission row (SELECT … FOR UPDATE) and check the version the actor saw: a second
//      moderator acting on the same version waits for the first, then finds the version moved and
//      gets a 409 — exactly one of them wins;
//   2. check the status allows the change, and that nobody decides on their own submission;
//   3. UPDATE status, moderator_note, version + 1;
//   4. append the audit event (before, after, who, why);
//   5. when the approved set changes, refresh the group's board_stats and append the history of
//      what moved, naming the event (history.ts); a rejection of a pending submission changes no
//      published figure, so it leaves board_stats (and its freshness stamp) alone;
//   6. enqueue the contributor's mail in the same transaction;
//   7. after commit, drop the board's cached values.
// Any refusal throws before anything is written, and anything thrown rolls everything back.

/** A refusal, with a code that bulk approval reports per item. */
export class ModerationRefusal extends ApiError {
  constructor(
    status: 403 | 404 | 409,
    readonly refusal: "own_submission" | "not_found" | "conflict" | "wrong_status" | "flagged" | "already_reverted" | "not_revertable",
    message: string,
    fieldErrors: Record<string, string[]> = {},
  ) {
    super(status, message, fieldErrors);
  }
}

const missingSubmission = (id: number) =>
  new ModerationRefusal(404, "not_found", `There is no submission with id ${id}.`, { id: [`There is no submission with id ${id}.`] });

const staleVersion = (sent: number, current: number) =>
  new ModerationRefusal(
    409,
    "conflict",
    `${CONFLICT_MESSAGE}: this submission is now at version ${current} (you saw version ${sent}). Reload it to see what changed.`,
    {
      version: [`stale: the current version is ${current}`],
    },
  );

type LockedSubmission = SubmissionState & {
  id: number;
  contributorId: string;
  group: GroupKey;
};

async function lockSubmission(id: number, transaction: Transaction): Promise<LockedSubmission | null> {
  const [row] = await db().query<Omit<LockedSubmission, "group"> & { r: number; f: number }>(
    `SELECT id, status, moderator_note AS "moderatorNote", version, contributor_id AS "contributorId",
            board_revision_id AS r, firmware_family_id AS f
       FROM submissions WHERE id = :id FOR UPDATE`,
    { replacements: { id }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) return null;
  const { r, f, ...rest } = row;
  return { ...rest, group: { boardRevisionId: r, firmwareFamilyId: f } };
}

export type TransitionInput = {
  submissionId: number;
  /** The version the actor decided on; null when the system acts on the row as it is (auto-approval). */
  expectedVersion: number | null;
  /** Statuses the change may start from. */
  allowedFrom: readonly SubmissionStatus[];
  to: { status: SubmissionStatus; moderatorNote: string | null };
  actorId: string | null;
  action: Exclude<AuditAction, "user_update">;
  reason: string | null;
  revertsEventId?: number;
  /** Another check on the locked row (bulk approval's "no flags"); throw a ModerationRefusal to refuse. */
  check?: (row: LockedSubmission, transaction: Transaction) => Promise<void>;
  /** A 409 other than the generic one for a version mismatch (revert explains it differently). */
  staleError?: (sent: number, current: LockedSubmission) => ApiError;
};

export type TransitionResult = {
  submissionId: number;
  before: SubmissionState;
  after: SubmissionState;
  eventId: number;
  /** Published quantities of the group whose recommended value, n or interval moved. */
  changed: QuantityKey[];
  group: GroupKey;
};

const DONE_WORDS: Record<TransitionInput["action"], string> = {
  approve: "approved",
  auto_approve: "approved",
  reject: "rejected",
  request_changes: "sent back for changes",
  revert: "reverted",
};

function wrongStatus(row: LockedSubmission, action: TransitionInput["action"]): ModerationRefusal {
  const now = STATUS_LABELS[row.status].toLowerCase();
  const hint = row.status === "approved" || row.status === "rejected" ? " Only an admin can undo a decision, by reverting it in the log." : "";
  return new ModerationRefusal(409, "wrong_status", `This submission is ${now}, so it cannot be ${DONE_WORDS[action]} now.${hint}`, {
    status: [`it is ${row.status}`],
  });
}

/** Applies one status change inside `transaction` (see the steps above). */
export async function applyTransition(input: TransitionInput, transaction: Transaction): Promise<TransitionResult> {
  const row = await lockSubmission(input.submissionId, transaction);
  if (!row) throw missingSubmission(input.submissionId);
  if (input.actorId !== null && input.actorId === row.contributorId) {
    throw new ModerationRefusal(403, "own_submission", "Another moderator has to decide on your own submission.");
  }
  if (input.expectedVersion !== null && input.expectedVersion !== row.version) {
    throw input.staleError ? input.staleError(input.expectedVersion, row) : staleVersion(input.expectedVersion, row.version);
  }
  if (!input.allowedFrom.includes(row.status)) throw wrongStatus(row, input.action);
  await input.check?.(row, transaction);

  const sequelize = db();
  const before: SubmissionState = { status: row.status, moderatorNote: row.moderatorNote, version: row.version };
  const [updated] = await sequelize.query<{ version: number }>(
    `UPDATE submissions SET status = :status, moderator_note = :note, version = version + 1, updated_at = now()
      WHERE id = :id AND version = :version RETURNING version`,
    { replacements: { id: row.id, version: row.version, status: input.to.status, note: input.to.moderatorNote }, type: QueryTypes.SELECT, transaction },
  );
  // the row is locked, so this cannot miss; if it ever did, refuse rather than log a change that was not made
  if (!updated) throw staleVersion(row.version, row.version + 1);
  const after: SubmissionState = { status: input.to.status, moderatorNote: input.to.moderatorNote, version: updated.version };

  const event = await writeAuditEvent(
    {
      entityType: "submission",
      submissionId: row.id,
      actorId: input.actorId,
      action: input.action,
      reason: input.reason,
      revertsEventId: input.revertsEventId,
      before,
      after,
    },
    transaction,
  );

  let changed: QuantityKey[] = [];
  if (before.status === "approved" || after.status === "approved") {
    changed = (await refreshWithHistory(row.group, event.id, transaction)).map((q) => QUANTITY_KEYS[q]);
    transaction.afterCommit(() => invalidateBoardValues([row.group]));
  }

  if (input.action === "revert") await queueRevertMail(row.id, before.status, transaction);
  else await queueStatusMail(row.id, transaction, input.action === "auto_approve" ? "auto_approved" : "decided");

  return { submissionId: row.id, before, after, eventId: event.id, changed, group: row.group };
}

type MailFacts = { email: string; name: string; board: string; revision: string; family: string; status: SubmissionStatus; note: string | null };

async function queueRevertMail(submissionId: number, previous: SubmissionStatus, transaction: Transaction): Promise<void> {
  const [f] = await db().query<MailFacts>(
    `SELECT u.email, u.name, bm.name AS board, br.label AS revision, ff.name AS family, s.status, s.moderator_note AS note
       FROM submissions s JOIN users u ON u.id = s.contributor_id JOIN board_revisions br ON br.id = s.board_revision_id
       JOIN board_models bm ON bm.id = br.board_model_id JOIN firmware_families ff ON ff.id = s.firmware_family_id
      WHERE s.id = :id`,
    { replacements: { id: submissionId }, type: QueryTypes.SELECT, transaction },
  );
  await enqueue(
    "mail.send",
    revertMail({ to: f.email, name: f.name, submissionId, board: f.board, revision: f.revision, family: f.family, previous, status: f.status, note: f.note }),
    { transaction },
  );
}
