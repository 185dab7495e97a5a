import type { QueryInterface } from "sequelize";

// "My submissions" filters a contributor's submissions by status and pages them newest first. This
// index answers that page in order without a sort, and also serves every (contributor, status)
// lookup that submissions_contributor_status_idx served (trust counts, the queue's
// first-time-contributor flag), so it replaces that index instead of sitting beside it.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(
    "CREATE INDEX submissions_contributor_status_created_idx ON submissions (contributor_id, status, created_at DESC, id DESC)",
  );
  await queryInterface.sequelize.query("DROP INDEX submissions_contributor_status_idx");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("CREATE INDEX submissions_contributor_status_idx ON submissions (contributor_id, status)");
  await queryInterface.sequelize.query("DROP INDEX submissions_contributor_status_created_idx");
}
