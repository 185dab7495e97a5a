import type { Transaction } from "sequelize";
import { applyTrustOnCreate } from "@/lib/moderation/trust";
import type { SessionUser } from "@/lib/auth";
import { attachPhotosToSubmission } from "@/lib/storage/evidence-photos";
import { Submission, db } from "@/models";
import { submissionColumns, writeEvidence } from "./evidence-rows";
import { KeyTakenError, claimKey, lockKey, replayFor, requestHash } from "./idempotency";
import { queueStatusMail } from "./status-mail";
import { validateSubmission, type ValidatedSubmission } from "./validate";
import { loadSubmissionView, type SubmissionView } from "./view";

// Creating a submission: validate (nothing is written for a refused request), then one transaction
// writes the submission, its evidence rows, the evidence verdict, the attached photos, the
// contributor's one mail job ("received", or "published automatically") and the idempotency
// record. Any failure rolls all of it back.
//
// A caller that must write more in the same transaction (a worksheet linking the submission it
// became, lib/worksheets/publish.ts) passes its own `transaction`: then everything here happens in
// it, commits with the caller's work or rolls back with it, and after-commit hooks (the published
// values' cache) wait for the caller's commit. Such a caller guards against twins itself (it holds
// a row lock), so an idempotency key cannot come with it: the key's "roll back and replay" needs a
// transaction of its own.

export type CreateResult = { status: 201; body: { submission: SubmissionView }; replayed: boolean };

export type CreateOptions = { idempotencyKey?: string | null; transaction?: undefined } | { transaction: Transaction; idempotencyKey?: undefined };

export async function createSubmission(user: Pick<SessionUser, "id">, body: unknown, opts: CreateOptions = {}): Promise<CreateResult> {
  if (opts.transaction) {
    if (opts.idempotencyKey) throw new Error("createSubmission: an idempotency key needs its own transaction");
    const { payload, family, revision } = await validateSubmission(body, opts.transaction);
    return writeSubmission(user, payload, family, revision, opts.transaction, null);
  }
  const key = opts.idempotencyKey ?? null;
  const hash = requestHash(body);
  if (key) {
    const stored = await replayFor(user.id, key, hash);
    if (stored) return { ...(stored as Omit<CreateResult, "replayed">), replayed: true };
  }

  const { payload, family, revision } = await validateSubmission(body);
  const sequelize = db();
  try {
    const outcome = await sequelize.transaction(async (transaction): Promise<CreateResult> => {
      if (key) {
        // twins queue here, before any row is touched (a photo attached by the first would make the
        // second fail instead of replaying); the primary key below stays the guarantee
        await lockKey(user.id, key, transaction);
        const stored = await replayFor(user.id, key, hash, transaction);
        if (stored) return { ...(stored as Omit<CreateResult, "replayed">), replayed: true };
      }
      return writeSubmission(user, payload, family, revision, transaction, key ? { key, hash } : null);
    });
    return outcome;
  } catch (error) {
    if (!(error instanceof KeyTakenError)) throw error;
    // a twin with the same key committed first: everything above was rolled back; answer as it did
    const stored = await replayFor(user.id, key!, hash);
    if (!stored) throw new Error("idempotency key was taken but holds no response");
    return { ...(stored as Omit<CreateResult, "replayed">), replayed: true };
  }
}

/** The writes, inside `transaction`; KeyTakenError when `idempotency`'s key was claimed meanwhile. */
async function writeSubmission(
  user: Pick<SessionUser, "id">,
  payload: ValidatedSubmission["payload"],
  family: ValidatedSubmission["family"],
  revision: ValidatedSubmission["revision"],
  transaction: Transaction,
  idempotency: { key: string; hash: string } | null,
): Promise<CreateResult> {
  const submission = await Submission.create(
    { ...submissionColumns(payload, family, revision), contributorId: user.id, status: "pending", moderatorNote: null },
    { transaction },
  );
  await writeEvidence(submission.id, payload, transaction);
  await attachPhotosToSubmission(payload.photoIds, submission.id, user.id, transaction);
  // a trusted contributor's unflagged submission is approved at once, in this same transaction, and
  // its one mail says so (queued by the approval); only one that waits is told it is pending review
  const trust = await applyTrustOnCreate(submission.id, transaction);
  if (!trust.autoApproved) await queueStatusMail(submission.id, transaction, "created");
  const created = (await loadSubmissionView(submission.id, transaction))!;
  const response = { status: 201 as const, body: { submission: created } };
  if (idempotency && !(await claimKey(user.id, idempotency.key, idempotency.hash, { ...response, submissionId: submission.id }, transaction))) {
    throw new KeyTakenError();
  }
  return { ...response, replayed: false };
}
