import type { QueryInterface } from "sequelize";

// An admin's word on whether a contributor's submissions may skip the review queue
// (lib/moderation/trust.ts): NULL = by their record (MODERATION_TRUST_THRESHOLD approved
// submissions and no rejection), true = trusted regardless, false = never auto-approved. Even a
// trusted contributor's submission waits for a moderator when it raises a flag.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("ALTER TABLE users ADD COLUMN trusted boolean");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("ALTER TABLE users DROP COLUMN trusted");
}
