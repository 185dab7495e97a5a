import { createSequelize } from "@/lib/db/sequelize";
import { rebuildAllStats } from "@/lib/published/rebuild";
import { prepareDatabase } from "./database";
import { Lifecycle } from "./lifecycle";
import { log } from "./log";
import { bringUpDatabase } from "./run-app";

/** `npm run stats:rebuild`: recompute every published statistic, with the same database bring-up as npm start. */
export async function runStatsRebuild(): Promise<number> {
  const lifecycle = new Lifecycle(true);
  try {
    const url = await bringUpDatabase(process.cwd(), lifecycle);
    await prepareDatabase(url, { seedWhenEmpty: false });
    const sequelize = createSequelize(url, { poolMax: 2 });
    try {
      const { rows, ms } = await rebuildAllStats(sequelize);
      log(`rebuilt ${rows} board_stats row(s) in ${ms} ms`);
    } finally {
      await sequelize.close();
    }
    return 0;
  } finally {
    await lifecycle.stop();
  }
}
