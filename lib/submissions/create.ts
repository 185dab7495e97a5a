import { applyTrustOnCreate } from "@/lib/moderation/trust";
import type { SessionUser } from "@/lib/auth";
import { attachPhotosToSubmission } from "@/lib/storage/evidence-photos";
import { Submission, db } from "@/models";
import { evidenceVerdict, writeEvidence } from "./evidence-rows";
import { KeyTakenError, claimKey, lockKey, replayFor, requestHash } from "./idempotency";
import { queueStatusMail } from "./status-mail";
import { validateSubmission } from "./validate";
import { loadSubmissionView, type SubmissionView } from "./view";

// Creating a submission: validate (nothing is written for a refused request), then one transaction
// writes the submission, its evidence rows, the evidence verdict, the attached photos, the
// "received" mail job and the idempotency record. Any failure rolls all of it back.

export type CreateResult = { status: 201; body: { submission: SubmissionView }; replayed: boolean };

export async function createSubmission(user: Pick<SessionUser, "id">, body: unknown, opts: { idempotencyKey?: string | null } = {}): Promise<CreateResult> {
  const key = opts.idempotencyKey ?? null;
  const hash = requestHash(body);
  if (key) {
    const stored = await replayFor(user.id, key, hash);
    if (stored) return { ...(stored as Omit<CreateResult, "replayed">), replayed: true };
  }

  const { payload, family, revision } = await validateSubmission(body);
  const { summary, mismatch } = evidenceVerdict(payload, family);
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
      const submission = await Submission.create(
        {
          boardRevisionId: revision.id,
          firmwareFamilyId: family.id,
          contributorId: user.id,
          firmwareVersion: payload.firmwareVersion,
          sensingSource: payload.sensingSource,
          method: payload.method,
          voltageScale: payload.voltageScale,
          currentScale: payload.currentScale,
          currentOffset: payload.currentOffset,
          notes: payload.notes,
          status: "pending",
          evidenceMismatch: mismatch,
          evidenceSummary: summary,
          moderatorNote: null,
        },
        { transaction },
      );
      await writeEvidence(submission.id, payload, transaction);
      await attachPhotosToSubmission(payload.photoIds, submission.id, user.id, transaction);
      await queueStatusMail(submission.id, transaction, "created");
      // a trusted contributor's unflagged submission is approved at once, in this same transaction
      await applyTrustOnCreate(submission.id, transaction);
      const created = (await loadSubmissionView(submission.id, transaction))!;
      if (key && !(await claimKey(user.id, key, hash, { status: 201, body: { submission: created }, submissionId: submission.id }, transaction))) {
        throw new KeyTakenError();
      }
      return { status: 201, body: { submission: created }, replayed: false };
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
