import type { Metadata } from "next";
import Link from "next/link";
import { ChipCount, FilterChip } from "@/components/filter-chip";
import { QueueView } from "@/components/moderation/queue-view";
import { Pagination } from "@/components/pagination";
import { requirePageRole } from "@/lib/auth";
import { QUEUE_AGE_LABELS as AGE_LABELS, QUEUE_SORT_LABELS as SORT_LABELS } from "@/lib/vocabulary";
import { loadQueue, parseQueueQuery, queueHref, type QueueAge, type QueueFlag, type QueueQuery, type QueueSort } from "./_data/queue";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Moderation" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const FLAG_LABELS: Record<QueueFlag | "all", string> = {
  all: "All pending",
  outlier: "Far off",
  mismatch: "Evidence disagrees",
  new: "First-time contributor",
  none: "No flags",
};

function FilterForm({ q, boards }: { q: QueueQuery; boards: { slug: string; name: string }[] }) {
  // a plain GET form, so filters work before (and without) JavaScript and stay in the URL
  return (
    <form method="get" action="/moderation" className="flex flex-wrap items-end gap-3" aria-label="Filter the queue">
      {q.flag && <input type="hidden" name="flag" value={q.flag} />}
      <label className="flex flex-col text-small font-semibold">
        Board
        <select name="board" defaultValue={q.board ?? ""} className="sb-field min-h-11">
          <option value="">Every board</option>
          {boards.map((b) => (
            <option key={b.slug} value={b.slug}>
              {b.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-small font-semibold">
        Sent
        <select name="age" defaultValue={q.age ?? ""} className="sb-field min-h-11">
          <option value="">Any time</option>
          {(Object.keys(AGE_LABELS) as QueueAge[]).map((a) => (
            <option key={a} value={a}>
              {AGE_LABELS[a]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-small font-semibold">
        Order
        <select name="sort" defaultValue={q.sort} className="sb-field min-h-11">
          {(Object.keys(SORT_LABELS) as QueueSort[]).map((s) => (
            <option key={s} value={s}>
              {SORT_LABELS[s]}
            </option>
          ))}
        </select>
      </label>
      <button type="submit" className="sb-button min-h-11">
        Show
      </button>
    </form>
  );
}

// /moderation: the pending submissions, the most serious first (far-off values, evidence that
// disagrees, first-time contributors), paged on the server with everything in the URL.
export default async function ModerationQueuePage({ searchParams }: Props) {
  const sp = await searchParams;
  const q = parseQueueQuery(sp);
  await requirePageRole(queueHref(q, { page: q.page }), "moderator");
  const data = await loadQueue(q);
  const flags: (QueueFlag | null)[] = [null, "outlier", "mismatch", "new", "none"];
  return (
    <div className="space-y-6 pb-12">
      <header>
        <p className="font-display text-lg font-bold tracking-wider uppercase">Moderation</p>
        <h1 className="font-display text-title uppercase">Review queue</h1>
        <p className="max-w-prose text-muted">Pending contributions. A flag is a reason to look closer, not a verdict: boards vary.</p>
      </header>
      <nav aria-label="Flags">
        <ul className="flex flex-wrap gap-2">
          {flags.map((f) => (
            <li key={f ?? "all"}>
              <FilterChip href={queueHref(q, { flag: f })} active={q.flag === f}>
                {FLAG_LABELS[f ?? "all"]}
                <ChipCount n={data.counts[f ?? "all"]} what="pending" />
              </FilterChip>
            </li>
          ))}
        </ul>
      </nav>
      <FilterForm q={q} boards={data.boards} />
      {data.rows.length === 0 ? (
        <p className="rounded-md border-3 border-rule bg-surface p-4">
          Nothing is waiting here. {q.flag || q.board || q.age ? <Link href="/moderation">Show the whole queue</Link> : null}
        </p>
      ) : (
        <QueueView rows={data.rows} filters={queueHref(q, { page: 1 }).slice("/moderation".length)} />
      )}
      <p className="text-small text-muted">
        {data.total} pending · page {q.page} of {data.pageCount}
      </p>
      <Pagination page={q.page} pageCount={data.pageCount} hrefFor={(page) => queueHref(q, { page })} />
    </div>
  );
}
