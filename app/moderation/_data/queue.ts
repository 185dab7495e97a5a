import { listQueue, type QueueCounts, type QueueRow } from "@/lib/moderation/queue";
import { QUEUE_AGES, QUEUE_FLAGS, QUEUE_SORTS, type QueueAge, type QueueFlag, type QueueSort } from "@/lib/moderation/vocabulary";

// The page's side of the queue: the URL's params (lenient: anything unknown falls back to the
// default, where the API answers 400) and links that keep them, over lib/moderation's listQueue,
// which scores, orders, filters and counts in PostgreSQL.

export type { QueueAge, QueueFlag, QueueSort };
export type QueueQuery = { page: number; sort: QueueSort; board: string | null; flag: QueueFlag | null; age: QueueAge | null };

export type QueueData = { rows: QueueRow[]; total: number; pageCount: number; counts: QueueCounts; boards: { slug: string; name: string }[] };

const one = <T extends readonly string[]>(list: T, v: string | undefined): T[number] | null => (v && (list as readonly string[]).includes(v) ? v : null);

export function parseQueueQuery(sp: Record<string, string | string[] | undefined>): QueueQuery {
  const s = (k: string) => (typeof sp[k] === "string" ? (sp[k] as string) : undefined);
  const page = Number(s("page"));
  const board = s("board")?.trim();
  return {
    page: Number.isSafeInteger(page) && page >= 1 && page <= 10_000 ? page : 1,
    sort: one(QUEUE_SORTS, s("sort")) ?? "severity",
    board: board && /^[a-z0-9-]{1,120}$/.test(board) ? board : null,
    flag: one(QUEUE_FLAGS, s("flag")),
    age: one(QUEUE_AGES, s("age")),
  };
}

/** The URL of the queue with `change` applied; the page goes back to 1 unless it is the change. */
export function queueHref(q: QueueQuery, change: Partial<QueueQuery>): string {
  const next = { ...q, page: "page" in change ? q.page : 1, ...change };
  const p = new URLSearchParams();
  if (next.page > 1) p.set("page", String(next.page));
  if (next.sort !== "severity") p.set("sort", next.sort);
  if (next.board) p.set("board", next.board);
  if (next.flag) p.set("flag", next.flag);
  if (next.age) p.set("age", next.age);
  const qs = p.toString();
  return qs ? `/moderation?${qs}` : "/moderation";
}

export async function loadQueue(q: QueueQuery): Promise<QueueData> {
  // an unknown board slug is a 400 from listQueue; the page shows the whole queue's boards and an empty list instead
  const page = await listQueue(q).catch(async (error) => {
    if (q.board) return { ...(await listQueue({ ...q, board: null })), rows: [], total: 0, pageCount: 1 };
    throw error;
  });
  return {
    rows: page.rows,
    total: page.total,
    pageCount: page.pageCount,
    counts: page.counts,
    boards: page.boards,
  };
}
