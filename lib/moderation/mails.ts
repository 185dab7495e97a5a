import { siteUrl } from "@/lib/auth/site-url";
import type { MailMessage } from "@/lib/mail/send";
import { STATUS_LABELS, type SubmissionStatus } from "@/lib/vocabulary";
import type { QueueCounts } from "./queue";

// The two mails moderation writes itself. A decision's mail to the contributor is lib/submissions'
// status mail (queueStatusMail); a revert needs its own words, since "received" or "approved" would
// not tell the contributor that an earlier decision was undone. Plain text, like the status mails.

export function revertMail(opts: {
  to: string;
  name: string;
  submissionId: number;
  board: string;
  revision: string;
  family: string;
  /** The status the decision being undone had set, and the one restored. */
  previous: SubmissionStatus;
  status: SubmissionStatus;
  note: string | null;
}): MailMessage {
  const what = `submission #${opts.submissionId} for the ${opts.board} (revision ${opts.revision}) under ${opts.family}`;
  const now = STATUS_LABELS[opts.status].toLowerCase();
  const lines = [
    `Hello ${opts.name},`,
    `An admin reversed an earlier moderation decision on ${what}. It was ${STATUS_LABELS[opts.previous].toLowerCase()}; it is now ${now} again.`,
    opts.status === "approved"
      ? "Its values count in the board's published figures again."
      : opts.previous === "approved"
        ? "Its values no longer count in the board's published figures."
        : "",
    opts.note ? `The moderator's note on it:\n\n${opts.note.replace(/^/gm, "  ")}` : "",
    `All your submissions: ${siteUrl("/my/submissions")}`,
    "— Shuntbook",
  ].filter(Boolean);
  return { to: opts.to, subject: `Shuntbook: submission #${opts.submissionId} is ${now} again`, text: `${lines.join("\n\n")}\n` };
}

/** The daily summary for one moderator: what waits, by flag, and where to start. `flagged`: far off or evidence disagrees (each submission once). */
export function digestMail(opts: { to: string; name: string; counts: QueueCounts; flagged: number; oldestPendingAt: Date | null }): MailMessage {
  const c = opts.counts;
  const days = opts.oldestPendingAt ? Math.floor((Date.now() - opts.oldestPendingAt.getTime()) / 86_400_000) : 0;
  const lines = [
    `Hello ${opts.name},`,
    `${c.all} submission${c.all === 1 ? " waits" : "s wait"} for review${opts.oldestPendingAt ? `; the oldest has waited ${days === 0 ? "less than a day" : `${days} day${days === 1 ? "" : "s"}`}` : ""}.`,
    [
      `  Far from the approved values: ${c.outlier}`,
      `  Evidence disagrees with the values: ${c.mismatch}`,
      `  From a first-time contributor: ${c.new}`,
      `  No flags (can be approved in bulk): ${c.none}`,
    ].join("\n"),
    `The queue, most serious first: ${siteUrl("/moderation")}`,
    "You get this summary each morning while you are a moderator; it is not sent on days with nothing waiting.\n\n— Shuntbook",
  ];
  const flagged = opts.flagged;
  return {
    to: opts.to,
    subject: `Shuntbook: ${c.all} waiting for review${flagged ? `, ${flagged} flagged` : ""}`,
    text: `${lines.join("\n\n")}\n`,
  };
}
