import { formatFigure, plural } from "@/lib/catalogue/format";
import type { HistoryPoint, HistorySeries } from "@/lib/published/history";
import { ACTION_LABELS } from "@/lib/vocabulary";
import { When } from "@/components/when";
import { QUANTITY_TITLES } from "./quantity-meaning";
import type { Selection } from "./selection";

// How each published value got where it is, newest change first, with the value, n, interval,
// when and which kind of event moved it. The selected revision and family come first; every other
// series waits behind one disclosure. Public: names and moderators' reasons are not part of it.

function Point({ p }: { p: HistoryPoint }) {
  const what = p.event ? ACTION_LABELS[p.event.action] : "Published before changes were recorded";
  return (
    <li className="relative border-l-3 border-rule pb-3 pl-4 before:absolute before:top-1.5 before:-left-[7px] before:size-3 before:rounded-full before:bg-ink">
      <p className="font-mono text-lg">
        {p.recommendedValue === null ? <span className="sb-unknown text-body">no longer published</span> : formatFigure(p.recommendedValue)}
      </p>
      <p className="text-small">
        {plural(p.n, "approved value")}
        {p.ciLow !== null && p.ciHigh !== null ? ` · 95 % interval for the median ${formatFigure(p.ciLow)}–${formatFigure(p.ciHigh)}` : " · no interval yet"}
      </p>
      <p className="text-small text-muted">
        <When at={p.at} /> · {what}
      </p>
    </li>
  );
}

function Series({ s, withGroup }: { s: HistorySeries; withGroup: boolean }) {
  const title = withGroup ? `${QUANTITY_TITLES[s.quantity]} · ${s.revision.label} · ${s.family.name}` : QUANTITY_TITLES[s.quantity];
  return (
    <details className="rounded-md border-2 border-rule bg-surface p-3">
      <summary className="cursor-pointer font-semibold">
        {title} <span className="text-small text-muted">({plural(s.points.length, "change")})</span>
      </summary>
      <ol className="mt-3" aria-label={`${title} history, newest first`}>
        {[...s.points].reverse().map((p, i) => (
          <Point key={i} p={p} />
        ))}
      </ol>
    </details>
  );
}

export function ValueHistoryList({ series, selection }: { series: HistorySeries[]; selection: Selection }) {
  if (series.length === 0) return null;
  const shown = series.filter((s) => s.revision.label === selection.revision && s.family.slug === selection.family);
  const rest = series.filter((s) => !shown.includes(s));
  return (
    <section aria-labelledby="history-title" className="space-y-3" id="history" data-testid="value-history">
      <h3 id="history-title" className="font-display text-xl font-bold tracking-wide uppercase">
        How the values changed
      </h3>
      <p className="max-w-prose text-small text-muted">Every change to a published value: approvals move them, and so can a reverted decision.</p>
      {shown.length > 0 ? (
        <div className="space-y-2">
          {shown.map((s) => (
            <Series key={`${s.revision.id}-${s.family.id}-${s.quantity}`} s={s} withGroup={false} />
          ))}
        </div>
      ) : (
        <p className="text-small text-muted">No recorded changes for this revision and firmware family.</p>
      )}
      {rest.length > 0 && (
        <details className="rounded-md border-2 border-rule-soft p-3">
          <summary className="cursor-pointer font-semibold">Other revisions and firmware families ({plural(rest.length, "series", "series")})</summary>
          <div className="mt-3 space-y-2">
            {rest.map((s) => (
              <Series key={`${s.revision.id}-${s.family.id}-${s.quantity}`} s={s} withGroup />
            ))}
          </div>
        </details>
      )}
    </section>
  );
}
