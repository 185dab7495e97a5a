import type { FamilyUnits, QuantityKey, QuantityValues } from "@/lib/published/board-values-types";
import { MIN_VALUES_TO_JUDGE } from "@/lib/stats/spread";
import { ConfidenceBadge } from "./confidence-badge";
import { QUANTITY_TITLES, settingFromParts, settingMeaning, settingText, type PartsFigures } from "./quantity-meaning";

/**
 * One recommended setting, big enough to read off a phone on the field: the whole number the
 * pilot types in, what it stands for physically, the confidence label with n and what that label
 * means. Below 3 values the number is shown quieter, as a hint rather than a recommendation.
 */
export function RecommendedValue({
  quantity,
  values: q,
  units,
  parts,
}: {
  quantity: QuantityKey;
  values: QuantityValues | null;
  units: FamilyUnits;
  parts: PartsFigures;
}) {
  const headingId = `rec-${quantity}`;
  const expected = settingFromParts(quantity, parts, units);
  return (
    <article aria-labelledby={headingId} className="flex flex-col gap-1.5 rounded-md border-3 border-rule bg-surface px-4 py-3" data-quantity={quantity}>
      <h3 id={headingId} className="font-display text-lg font-bold tracking-wide uppercase">
        {QUANTITY_TITLES[quantity]}
      </h3>
      {q ? (
        <>
          {/* number and confidence side by side: on a phone both scales fit the first screen */}
          <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
            <p className="flex flex-col">
              <span className="sr-only">Setting to enter</span>
              <span
                className={`font-mono text-title leading-none font-bold tabular-nums sm:text-display ${q.n < MIN_VALUES_TO_JUDGE ? "text-muted" : "text-ink"}`}
                data-testid={`setting-${quantity}`}
              >
                {settingText(q.recommended.setting)}
              </span>
            </p>
            <ConfidenceBadge label={q.confidence.label} title={q.confidence.title} n={q.n} />
          </div>
          <ul className="text-small">
            {settingMeaning(quantity, q.recommended.setting, units).map((line) => (
              <li key={line}>{line}</li>
            ))}
            {expected !== null && (
              <li className="text-muted">
                Parts list: <span className="font-mono font-bold text-ink">{settingText(expected)}</span>
              </li>
            )}
          </ul>
          <p className="text-small leading-snug text-muted">{q.confidence.explanation}</p>
        </>
      ) : (
        <p className="sb-unknown">Nobody has published a {QUANTITY_TITLES[quantity].toLowerCase()} for this revision and firmware family yet.</p>
      )}
    </article>
  );
}
