import { QueryTypes } from "sequelize";
import { enqueue } from "@/lib/jobs";
import { db } from "@/models";
import { FLAG_CONDITIONS, flaggedSql } from "./flags";
import { digestMail } from "./mails";
import { queueCounts, type QueueCounts } from "./queue";

// The daily moderator digest: what waits for review, counted by the queue's own flags, mailed to
// every moderator and admin through the job queue (lib/jobs "mail.send", one transaction for all,
// so a failure sends none and the next run tries again). Nothing is sent when nothing waits.
// jobs.ts schedules it; tests and scripts call sendModeratorDigest() directly.

type DigestCounts = QueueCounts & {
  /** Pending submissions far off OR with disagreeing evidence, each counted once. */
  flagged: number;
  oldestPendingAt: Date | null;
};

async function digestCounts(): Promise<DigestCounts> {
  const sequelize = db();
  const counts = await queueCounts();
  // submissions_status_created_idx for the oldest; the flag count reuses the queue's scoring
  const [extra] = await sequelize.query<{ flagged: number; oldest: Date | null }>(
    `SELECT (SELECT count(*)::int FROM (${flaggedSql("s.status = 'pending'")}) q WHERE ${FLAG_CONDITIONS.outlier} OR ${FLAG_CONDITIONS.mismatch}) AS flagged,
            (SELECT min(created_at) FROM submissions WHERE status = 'pending') AS oldest`,
    { type: QueryTypes.SELECT },
  );
  return { ...counts, flagged: extra.flagged, oldestPendingAt: extra.oldest ? new Date(extra.oldest) : null };
}

export type DigestResult = { counts: DigestCounts; recipients: string[] };

/** Queues today's digest for every moderator and admin (users_role_idx); recipients is empty when nothing waits. */
export async function sendModeratorDigest(): Promise<DigestResult> {
  const sequelize = db();
  const counts = await digestCounts();
  if (counts.all === 0) return { counts, recipients: [] };
  const staff = await sequelize.query<{ email: string; name: string }>("SELECT email, name FROM users WHERE role IN ('moderator', 'admin') ORDER BY email", {
    type: QueryTypes.SELECT,
  });
  await sequelize.transaction(async (transaction) => {
    for (const person of staff) {
      await enqueue(
        "mail.send",
        digestMail({ to: person.email, name: person.name, counts, flagged: counts.flagged, oldestPendingAt: counts.oldestPendingAt }),
        { transaction },
      );
    }
  });
  return { counts, recipients: staff.map((s) => s.email) };
}
