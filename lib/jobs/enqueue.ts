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
function inTransaction(transaction: Transaction): Executor {
  return {
    executeSql: async (text, values) => {
      // Sequelize refuses undefined binds, pg-boss leaves unset options undefined: both mean NULL
      const bind = values.map((v) => (v === undefined ? null : v));
      const rows = await db().query(text, { bind, transaction, type: QueryTypes.SELECT });
      return { rows };
    },
  };
}

/** Puts a job on the queue (inside `opts.transaction` when given). Throws on an unknown job or bad data. */
export async function enqueue(name: string, data: object, opts: { transaction?: Transaction } = {}): Promise<void> {
  const def = jobDefinition(name);
  if (!def) throw new Error(`unknown job '${name}': add it to lib/jobs/handlers.ts`);
  const checked = def.parse(data) as object; // refuse bad data now, not at 3 a.m. in the worker
  const queue = await bossWithQueue(name);
  const id = await queue.send(name, checked, opts.transaction ? { db: inTransaction(opts.transaction) } : {});
  // pg-boss returns null when the insert matched no queue row; never drop a job silently
  if (!id) throw new Error(`job '${name}' was not enqueued: its queue does not exist`);
}
