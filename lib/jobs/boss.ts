import PgBoss from "pg-boss";
import { databaseUrl } from "@/lib/env";
import { jobDefinition, type JobDefinition } from "./handlers";

// pg-boss keeps its jobs in PostgreSQL, in its own schema `pgboss` (created by the migration
// 20261202001000-create-pgboss-schema from pg-boss's own construction plan, so that a fresh
// database and every test clone already have it; pg-boss only checks the version at start).
// One instance per process, on its own small pool, made on first use and kept on globalThis so
// that dev reloads do not leak pools.

const BOSS_SCHEMA = "pgboss";

type BossHolder = { url: string; boss: PgBoss; started: Promise<PgBoss>; queues: Map<string, Promise<void>> };
const globalForJobs = globalThis as unknown as { shuntbookBoss?: BossHolder };

/** The started pg-boss instance for DATABASE_URL (queues are made by bossWithQueue). */
export function boss(): Promise<PgBoss> {
  const url = databaseUrl();
  const held = globalForJobs.shuntbookBoss;
  if (held && held.url === url) return held.started;
  const instance = new PgBoss({
    connectionString: url,
    schema: BOSS_SCHEMA,
    // the mail pollers (lib/jobs/handlers.ts drain settings) fetch, complete and fail on it
    max: 5,
    // maintenance: a job whose worker died is expired and retried, old jobs are archived; several
    // instances may all supervise (pg-boss takes an advisory lock for it)
    supervise: true,
    // turns stored cron schedules (the moderators' daily digest) into jobs; pg-boss holds a lock so
    // only one of several instances does it
    schedule: true,
  });
  instance.on("error", (error) => console.error("[jobs] pg-boss:", error));
  const started = (async () => {
    await instance.start();
    return instance;
  })();
  globalForJobs.shuntbookBoss = { url, boss: instance, started, queues: new Map() };
  started.catch(() => {
    if (globalForJobs.shuntbookBoss?.boss === instance) globalForJobs.shuntbookBoss = undefined;
  });
  return started;
}

async function createQueue(instance: PgBoss, name: string, def: JobDefinition): Promise<void> {
  const options = { name, retryLimit: def.retryLimit, retryDelay: def.retryDelay, retryBackoff: def.retryBackoff, expireInSeconds: def.expireInSeconds };
  await instance.createQueue(name, options); // ON CONFLICT DO NOTHING inside pg-boss
  await instance.updateQueue(name, options); // so a changed retry policy applies to an existing queue
}

/**
 * The started pg-boss instance with the queue of job `name` made (once per process, on first use:
 * a concept's job may be defined after pg-boss started). Throws for a job nobody defined.
 */
export async function bossWithQueue(name: string): Promise<PgBoss> {
  const instance = await boss();
  const def = jobDefinition(name);
  if (!def) throw new Error(`unknown job '${name}': add it to lib/jobs/handlers.ts or define it with defineJob`);
  const queues = globalForJobs.shuntbookBoss!.queues;
  let made = queues.get(name);
  if (!made) {
    made = createQueue(instance, name, def);
    queues.set(name, made);
    made.catch(() => queues.delete(name)); // so that a later call tries again
  }
  await made;
  return instance;
}

/** Stops this process's pg-boss (workers finish their current job first). Tests call it in afterAll. */
export async function stopBoss(): Promise<void> {
  const held = globalForJobs.shuntbookBoss;
  globalForJobs.shuntbookBoss = undefined;
  if (!held) return;
  const instance = await held.started.catch(() => undefined);
  await instance?.stop({ graceful: true, wait: true, timeout: 10_000 });
}
