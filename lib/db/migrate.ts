import path from "node:path";
import { Sequelize, type QueryInterface } from "sequelize";
import { require as tsxRequire } from "tsx/cjs/api";
import { SequelizeStorage, Umzug } from "umzug";

type MigrationModule = {
  up: (qi: QueryInterface, s: typeof Sequelize) => Promise<unknown>;
  down: (qi: QueryInterface, s: typeof Sequelize) => Promise<unknown>;
};

// The same files sequelize-cli runs, driven from code so that `npm start` and `npm test` need no
// shell-out. Both share the SequelizeMeta / SequelizeData tables.
function runnerFor(sequelize: Sequelize, folder: "migrations" | "seeders", root = process.cwd()) {
  return new Umzug({
    migrations: {
      glob: [`${folder}/*.{ts,js}`, { cwd: root }],
      resolve: ({ name, path: file, context }) => {
        // tsx loads the TypeScript file the same way sequelize-cli does (through .sequelizerc),
        // whether we run under the launcher or inside vitest.
        const load = async (): Promise<MigrationModule> => {
          const mod = tsxRequire(path.resolve(root, file!), __filename);
          return (mod.up ? mod : mod.default) as MigrationModule;
        };
        return {
          name,
          up: async () => (await load()).up(context, Sequelize),
          down: async () => (await load()).down(context, Sequelize),
        };
      },
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: folder === "migrations" ? "SequelizeMeta" : "SequelizeData" }),
    logger: undefined,
  });
}

export async function migrateUp(sequelize: Sequelize, root?: string): Promise<string[]> {
  return (await runnerFor(sequelize, "migrations", root).up()).map((m) => m.name);
}

/** Rolls back every migration, newest first. */
export async function migrateDownAll(sequelize: Sequelize, root?: string): Promise<string[]> {
  return (await runnerFor(sequelize, "migrations", root).down({ to: 0 })).map((m) => m.name);
}

export async function pendingMigrations(sequelize: Sequelize, root?: string): Promise<string[]> {
  return (await runnerFor(sequelize, "migrations", root).pending()).map((m) => m.name);
}

export async function seedUp(sequelize: Sequelize, root?: string): Promise<string[]> {
  return (await runnerFor(sequelize, "seeders", root).up()).map((m) => m.name);
}
