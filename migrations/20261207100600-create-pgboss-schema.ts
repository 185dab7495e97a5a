import PgBoss from "pg-boss";
import type { QueryInterface } from "sequelize";

// The job queue's tables (lib/jobs). pg-boss keeps them in its own schema, `pgboss`, which it
// would also create by itself on first start; running its construction plan here instead means a
// fresh database (and every test clone) has the queue before any app process starts, and the app
// needs no DDL rights. pg-boss still checks the schema version at start and migrates it itself
// when a newer pg-boss needs that. The queues themselves are created at start from lib/jobs/handlers.ts.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(PgBoss.getConstructionPlans("pgboss"));
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP SCHEMA pgboss CASCADE");
}
