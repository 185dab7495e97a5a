import type { QueryInterface } from "sequelize";

// A contributor's record by status (approved / rejected counts for trust, "has this person ever
// had a submission approved?" for the queue's first-time-contributor flag) is read on every queue
// page and every new submission; this index answers it without reading their other rows.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("CREATE INDEX submissions_contributor_status_idx ON submissions (contributor_id, status)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP INDEX submissions_contributor_status_idx");
}
