import { formatFigure, plural } from "@/lib/catalogue/format";
import { getValueHistory, type HistoryPoint } from "@/lib/published/history";
import { ACTION_LABELS, type Quantity, QUANTITY_LABELS } from "@/lib/vocabulary";
import { TitledSection } from "@/components/titled-section";

// How each published value got where it is: one timeline per revision, firmware family and
// quantity, newest change first, with the value, n, interval, when and which kind of event moved
// it. Public: names and moderators' reasons are not shown (lib/published/history leaves them out).

const dateTime = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
const LABEL_BY_KEY: Record<string, string> = {
  voltageScale: QUANTITY_LABELS.voltage_scale,
  currentScale: QUANTITY_LABELS.current_scale,
  currentOffset: QUANTITY_LABELS.current_offset,
} satisfies Record<string, (typeof QUANTITY_LABELS)[Quantity]>;

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
        <time dateTime={p.at}>{dateTime.format(new Date(p.at))}</time> · {what}
      </p>
    </li>
  );
}

export async function ValueHistoryTimeline({ slug }: { slug: string }) {
  const history = await getValueHistory(slug);
  if (!history || history.series.length === 0) return null;
  return (
    <TitledSection id="history" title="How the values changed" className="space-y-3">
      <p className="max-w-prose text-muted">Every change to a published value: approvals move them, and so can a reverted decision.</p>
      <div className="space-y-2">
        {history.series.map((s) => (
          <details key={`${s.revision.id}-${s.family.id}-${s.quantity}`} className="rounded-md border-2 border-rule bg-surface p-3">
            <summary className="cursor-pointer font-semibold">
              {LABEL_BY_KEY[s.quantity]} · rev {s.revision.label} · {s.family.name}{" "}
              <span className="text-small text-muted">({plural(s.points.length, "change")})</span>
            </summary>
            <ol className="mt-3" aria-label={`${LABEL_BY_KEY[s.quantity]} history, newest first`}>
              {[...s.points].reverse().map((p, i) => (
                <Point key={i} p={p} />
              ))}
            </ol>
          </details>
        ))}
      </div>
    </TitledSection>
  );
}
