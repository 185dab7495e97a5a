import type { QueryInterface } from "sequelize";
import { deleteDemoScenario, insertDemoScenario } from "../lib/demo/persist";
import { buildDemoScenario } from "../lib/demo/scenario";

// The invented demo scenario (makers, boards, firmware families, people, submissions): built in
// lib/demo/scenario.ts without a database, inserted here in one transaction so that a failed seed
// leaves nothing behind. Relative imports: sequelize-cli loads this file through tsx, outside the
// app's path alias.
export async function up(queryInterface: QueryInterface) {
  const scenario = buildDemoScenario();
  await queryInterface.sequelize.transaction((transaction) => insertDemoScenario(queryInterface, scenario, transaction));
}

export async function down(queryInterface: QueryInterface) {
  const scenario = buildDemoScenario();
  await queryInterface.sequelize.transaction((transaction) => deleteDemoScenario(queryInterface, scenario, transaction));
}
