import type { ConfidenceLabel } from "@/lib/vocabulary";
import { plural } from "@/lib/catalogue/format";

// The confidence label as a word, a count and a three-pip gauge. The word carries the meaning;
// pips and colour only repeat it, so nothing depends on telling colours apart.
const LOOK: Record<ConfidenceLabel, { pips: number; className: string }> = {
  strong: { pips: 3, className: "border-verdigris text-verdigris" },
  fair: { pips: 2, className: "border-copper text-copper" },
  weak: { pips: 1, className: "border-rule text-ink" },
  too_few: { pips: 0, className: "border-dashed border-rule text-muted" },
};

export function ConfidenceBadge({ label, title, n }: { label: ConfidenceLabel; title: string; n: number }) {
  const look = LOOK[label] ?? LOOK.too_few;
  return (
    <p className={`inline-flex flex-wrap items-center gap-x-2 rounded-md border-2 bg-surface px-2.5 py-1 ${look.className}`} data-testid="confidence">
      <span aria-hidden="true" className="inline-flex items-end gap-0.5">
        {[1, 2, 3].map((i) => (
          <span
            key={i}
            className={`inline-block w-1.5 rounded-sm border border-current ${i <= look.pips ? "bg-current" : ""}`}
            style={{ height: `${0.45 + i * 0.2}rem` }}
          />
        ))}
      </span>
      <span className="font-display text-base font-bold tracking-wide uppercase">
        <span className="sr-only">Confidence: </span>
        {title}
      </span>
      <span className="font-mono text-small text-ink">n&nbsp;=&nbsp;{n}</span>
      <span className="sr-only">({plural(n, "approved value")})</span>
    </p>
  );
}
