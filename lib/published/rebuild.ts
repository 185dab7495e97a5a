import type { Sequelize } from "sequelize";
import { refreshGroups } from "./refresh";

/** `npm run stats:rebuild`: recomputes every group's board_stats in one transaction. */
export async function rebuildAllStats(sequelize: Sequelize): Promise<{ rows: number; ms: number }> {
  const started = Date.now();
  const rows = await refreshGroups(sequelize, null);
  return { rows: rows.length, ms: Date.now() - started };
}
