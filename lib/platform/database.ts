import { QueryTypes } from "sequelize";
import { migrateUp, seedUp } from "@/lib/db/migrate";
import { createSequelize } from "@/lib/db/sequelize";
import { log } from "./log";

/** Brings a database's schema up to date and seeds the demo scenario when it holds no boards and no people. */
export async function prepareDatabase(url: string, opts: { seedWhenEmpty: boolean }): Promise<void> {
  const sequelize = createSequelize(url, { poolMax: 2 });
  try {
    const applied = await migrateUp(sequelize);
    if (applied.length) log(`applied ${applied.length} migration(s)`);
    if (!opts.seedWhenEmpty) return;
    const [row] = await sequelize.query<{ boards: number; users: number }>(
      "SELECT (SELECT count(*) FROM board_models) AS boards, (SELECT count(*) FROM users) AS users",
      { type: QueryTypes.SELECT },
    );
    if (row.boards === 0 && row.users === 0) {
      const started = Date.now();
      const seeded = await seedUp(sequelize);
      log(`seeded the demo scenario (${seeded.length} seeder(s), ${Date.now() - started} ms)`);
    }
  } finally {
    await sequelize.close();
  }
}
