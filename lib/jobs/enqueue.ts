import { QueryTypes, type Transaction } from "sequelize";
import { db } from "@/models";
import { bossWithQueue } from "./boss";
import { jobDefinition } from "./handlers";

type Executor = { executeSql(text: string, values: unknown[]): Promise<{ rows: unknown[] }> };

/**
 * pg-boss 10 lets send() run its INSERT through any executor. This one runs it on the connection
 * of a Sequelize transaction, so the job is committed or rolled back together with the rows the
 * transaction writes: a status change and the mail that tells someone about it commit as one, and
 * a mail that later fails to send is retried by the queue without touching the status change.
 */
export function inTransaction(transaction: Transaction): Executor {
  return {
    executeSql: async (text, values) => {
      // Sequelize refuses undefined binds, pg-boss leaves unset options undefined: both mean NULL
      const bind = values.map((v) => (v === undefined ? null : v));
      const rows = await db().query(text, { bind, transaction, type: QueryTypes.SELECT });
      return { rows };
    },
  };
}

/**
 * Queue priorities: the worker takes higher first (pg-boss orders due jobs by priority, then age).
 * Urgent: what someone is waiting for with the page open (a reset link, a sign-in link).
 */
export const JOB_PRIORITY = { normal: 0, urgent: 10 } as const;

/** Puts a job on the queue (inside `opts.transaction` when given). Throws on an unknown job or bad data. */
export async function enqueue(
  name: string,
  data: object,
  opts: { transaction?: Transaction; priority?: (typeof JOB_PRIORITY)[keyof typeof JOB_PRIORITY] } = {},
): Promise<void> {
  const def = jobDefinition(name);
  if (!def) throw new Error(`unknown job '${name}': add it to lib/jobs/handlers.ts`);
  const checked = def.parse(data) as object; // refuse bad data now, not at 3 a.m. in the worker
  const queue = await bossWithQueue(name);
  const priority = opts.priority ?? JOB_PRIORITY.normal;
  const id = await queue.send(name, checked, opts.transaction ? { priority, db: inTransaction(opts.transaction) } : { priority });
  // pg-boss returns null when the insert matched no queue row; never drop a job silently
  if (!id) throw new Error(`job '${name}' was not enqueued: its queue does not exist`);
}
