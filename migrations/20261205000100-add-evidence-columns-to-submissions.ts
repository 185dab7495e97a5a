import type { QueryInterface } from "sequelize";

// What the server concluded from a submission's evidence (lib/calibration/evidence.ts), kept on the
// submission so that moderation can sort its queue by it, plus the moderator's feedback that the
// contributor reads in "My submissions".
//   evidence_mismatch: a claimed value lies beyond the stated tolerance of what the evidence implies;
//   evidence_summary:  the implied values and each comparison (EvidenceSummary); null without evidence;
//   moderator_note:    Markdown from the moderator, rendered sanitised; null until one is written.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    ALTER TABLE submissions
      ADD COLUMN evidence_mismatch boolean NOT NULL DEFAULT false,
      ADD COLUMN evidence_summary  jsonb CHECK (evidence_summary IS NULL OR jsonb_typeof(evidence_summary) = 'object'),
      ADD COLUMN moderator_note    text CHECK (moderator_note IS NULL OR length(moderator_note) BETWEEN 1 AND 4000),
      -- a mismatch can only come from evidence that was summarised
      ADD CONSTRAINT submissions_mismatch_has_summary CHECK (NOT evidence_mismatch OR evidence_summary IS NOT NULL)`);
  // the review queue: one status, mismatches first, oldest first
  await queryInterface.sequelize.query("CREATE INDEX submissions_review_queue_idx ON submissions (status, evidence_mismatch DESC, created_at)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    DROP INDEX submissions_review_queue_idx;
    ALTER TABLE submissions
      DROP CONSTRAINT submissions_mismatch_has_summary,
      DROP COLUMN moderator_note,
      DROP COLUMN evidence_summary,
      DROP COLUMN evidence_mismatch`);
}
