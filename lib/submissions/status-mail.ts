import type { Transaction } from "sequelize";
import { env } from "@/lib/env";
import { enqueue } from "@/lib/jobs";
import type { MailMessage } from "@/lib/mail/send";
import { BoardModel, BoardRevision, FirmwareFamily, Submission, User, db } from "@/models";
import type { SubmissionStatus } from "@/lib/vocabulary";
import { MY_SUBMISSIONS_PATH, submissionEditPath } from "./view";

// Every status change of a submission mails its contributor, through the job queue and inside the
// transaction that makes the change: the change and its mail commit together or not at all, and a
// relay outage only delays the mail (lib/jobs retries it). Creation counts as a change to
// 'pending'. Moderation calls queueStatusMail after it sets status (and moderator_note).
// A submission approved at once (a trusted contributor, nothing flagged) gets ONE mail, saying it
// was published automatically: createSubmission queues the "received" mail only when it stays
// pending, so no "pending review" mail follows the approval.

/** Why the submission is in its status now: 'pending' after creation or an edit, 'approved' by a moderator or automatically. */
export type StatusChange = "created" | "resubmitted" | "decided" | "auto_approved";

type Facts = {
  id: number;
  status: SubmissionStatus;
  board: string;
  revision: string;
  family: string;
  moderatorNote: string | null;
};

function baseUrl(): string {
  return (env().NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/+$/, "");
}

const noteBlock = (note: string | null) => (note ? `\nThe moderator wrote:\n\n${note.replace(/^/gm, "  ")}\n` : "");

/** The mail for a status, in plain text (the catcher and every client show it as written). */
export function statusMail(to: string, name: string, f: Facts, change: StatusChange): MailMessage {
  const what = `submission #${f.id} for the ${f.board} (revision ${f.revision}) under ${f.family}`;
  const list = `${baseUrl()}${MY_SUBMISSIONS_PATH}`;
  const edit = `${baseUrl()}${submissionEditPath(f.id)}`;
  const lines: Record<SubmissionStatus, { subject: string; body: string }> = {
    pending:
      change === "resubmitted"
        ? {
            subject: `Submission #${f.id} updated: back in the review queue`,
            body: `You updated ${what}. It is pending review again.\n\nYou can still change it while it waits:\n${edit}`,
          }
        : {
            subject: `Submission #${f.id} received: pending review`,
            body: `Thank you: we received ${what}. It is pending review; a moderator will check the values against the evidence.\n\nYou can change it while it waits:\n${edit}`,
          },
    approved:
      change === "auto_approved"
        ? {
            subject: `Submission #${f.id} published automatically`,
            body: `Thank you: ${what} was published automatically. You are a trusted contributor and nothing in it needed a closer look, so it did not wait for a moderator. Its values now count in the board's published figures.\n\nModerators can still look at it, and an admin can take it back if something turns out to be wrong.`,
          }
        : { subject: `Submission #${f.id} approved`, body: `A moderator approved ${what}. Its values now count in the board's published figures.` },
    rejected: { subject: `Submission #${f.id} not accepted`, body: `A moderator did not accept ${what}.` },
    changes_requested: {
      subject: `Submission #${f.id}: changes requested`,
      body: `A moderator asked for changes to ${what} before deciding on it.\n\nEdit it here:\n${edit}`,
    },
  };
  const { subject, body } = lines[f.status];
  const text = `Hello ${name},\n\n${body}\n${noteBlock(f.moderatorNote)}\nAll your submissions: ${list}\n\n— Shuntbook\n`;
  return { to, subject: `Shuntbook: ${subject}`, text };
}

/** Enqueues the status mail for the submission's current status, inside `transaction`. */
export async function queueStatusMail(submissionId: number, transaction: Transaction, change: StatusChange = "decided"): Promise<MailMessage> {
  db();
  const s = await Submission.findByPk(submissionId, {
    include: [
      { model: User, as: "contributor", attributes: ["id", "email", "name"] },
      { model: BoardRevision, as: "boardRevision", include: [{ model: BoardModel, as: "boardModel" }] },
      { model: FirmwareFamily, as: "firmwareFamily" },
    ],
    transaction,
  });
  if (!s?.contributor || !s.boardRevision?.boardModel || !s.firmwareFamily) throw new Error(`queueStatusMail: submission ${submissionId} not found`);
  const message = statusMail(
    s.contributor.email,
    s.contributor.name,
    {
      id: s.id,
      status: s.status,
      board: s.boardRevision.boardModel.name,
      revision: s.boardRevision.label,
      family: s.firmwareFamily.name,
      moderatorNote: s.moderatorNote,
    },
    change,
  );
  await enqueue("mail.send", message, { transaction });
  return message;
}
