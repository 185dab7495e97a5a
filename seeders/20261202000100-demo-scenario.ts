import type { QueryInterface } from "sequelize";
import { deleteDemoScenario, insertDemoScenario } from "./demo/persist";
import { buildDemoScenario } from "./demo/scenario";
import { refreshGroups } from "@/lib/published/refresh";

// The invented demo scenario (makers, boards, firmware families, people, submissions): built in
// seeders/demo/scenario.ts without a database, inserted here in one transaction so that a failed seed
// leaves nothing behind. board_stats is derived from approved submissions and is kept current by
// whoever changes them, so the seed recomputes it in the same transaction.
export async function up(queryInterface: QueryInterface) {
  const scenario = buildDemoScenario();
  await queryInterface.sequelize.transaction(async (transaction) => {
    await insertDemoScenario(queryInterface, scenario, transaction);
    await refreshGroups(queryInterface.sequelize, null, transaction);
  });
}

export async function down(queryInterface: QueryInterface) {
  const scenario = buildDemoScenario();
  await queryInterface.sequelize.transaction(async (transaction) => {
    await deleteDemoScenario(queryInterface, scenario, transaction);
    // groups outside the demo may have lost submissions by demo people
    await refreshGroups(queryInterface.sequelize, null, transaction);
  });
}
