import { z } from "zod";
import { ApiError, badRequest, notFound } from "@/lib/http/errors";
import type { SessionUser } from "@/lib/auth";
import { attachPhotosToSubmission } from "@/lib/storage/evidence-photos";
import { Submission, db } from "@/models";
import { EDITABLE_STATUSES, STATUS_LABELS, type SubmissionStatus } from "@/lib/vocabulary";
import { submissionColumns, writeEvidence } from "./evidence-rows";
import { queueStatusMail } from "./status-mail";
import { validateSubmission } from "./validate";
import { loadSubmissionView, type SubmissionView } from "./view";

// Editing a submission: only its contributor, only while no moderator has decided it (pending or
// changes requested), and only from the version the editor last saw (optimistic concurrency: the
// `version` column, bumped by every save; models/Submission.ts has version: true). An edit after
// "changes requested" sends it back to pending review, which is a status change and is mailed.

export const VersionSchema = z.object({
  version: z.number({ error: "Send the version you edited (from the submission you loaded)" }).int("version is a whole number").min(0, "version is 0 or more"),
});

const missing = (id: unknown) => notFound(`There is no submission with id ${String(id)}.`, "id");

const stale = (sent: number, current: number) =>
  new ApiError(
    409,
    `This submission changed since you loaded it (you edited version ${sent}; it is now at version ${current}). Reload it and make your change again.`,
    {
      version: [`stale: the current version is ${current}`],
    },
  );

function checkEditable(s: Submission, user: Pick<SessionUser, "id">, version: number): void {
  if (s.contributorId !== user.id) throw new ApiError(403, "Only the contributor who sent a submission can edit it.");
  if (!EDITABLE_STATUSES.includes(s.status)) {
    throw new ApiError(
      409,
      `This submission is ${STATUS_LABELS[s.status as SubmissionStatus].toLowerCase()}, so it can no longer be edited. Send a new one instead.`,
    );
  }
  if (s.version !== version) throw stale(version, s.version);
}

export async function updateSubmission(user: Pick<SessionUser, "id">, id: number, body: unknown): Promise<SubmissionView> {
  const sequelize = db();
  const versionParsed = VersionSchema.safeParse(body);
  // who and what state come before the body's faults: a stranger learns nothing about the fields
  const existing = await Submission.findByPk(id, { attributes: ["id", "contributorId", "status", "version"] });
  if (!existing) throw missing(id);
  if (existing.contributorId !== user.id) throw new ApiError(403, "Only the contributor who sent a submission can edit it.");
  if (!versionParsed.success) {
    throw badRequest({ version: versionParsed.error.issues.map((i) => i.message) });
  }
  const { version } = versionParsed.data;
  checkEditable(existing, user, version);
  const { payload, family, revision } = await validateSubmission(body);
  const columns = submissionColumns(payload, family, revision);

  return sequelize.transaction(async (transaction) => {
    // lock the row and check again: another edit (or a moderator) may have come in between
    const s = await Submission.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!s) throw missing(id);
    checkEditable(s, user, version);
    const resubmitted = s.status === "changes_requested";
    s.set({ ...columns, status: "pending" });
    await s.save({ transaction }); // WHERE version = version, then version + 1
    await writeEvidence(s.id, payload, transaction);
    await attachPhotosToSubmission(payload.photoIds, s.id, user.id, transaction);
    if (resubmitted) await queueStatusMail(s.id, transaction, "resubmitted");
    return (await loadSubmissionView(s.id, transaction))!;
  });
}
