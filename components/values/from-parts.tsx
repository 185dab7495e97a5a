import type { FamilyUnits, QuantityKey } from "@/lib/published/board-values-types";
import { partsArithmetic, QUANTITY_TITLES, settingFromParts, settingText, type PartsDetail } from "./quantity-meaning";

// Where nothing is published yet but the revision's sensor hardware is on record: the settings its
// parts list works out at, clearly marked as computed and not measured, with the arithmetic; where
// a part is missing, what to measure instead.

const SCALES: QuantityKey[] = ["voltageScale", "currentScale"];

const WHAT_TO_MEASURE: Record<QuantityKey, string> = {
  voltageScale: "the divider's two resistors are not on record: a voltage check with a multimeter finds the scale",
  currentScale: "the current sensor's figures are not on record: a fly-and-recharge worksheet finds the scale",
  currentOffset: "",
};

export function FromParts({ revision, parts, families }: { revision: string; parts: PartsDetail; families: FamilyUnits[] }) {
  return (
    <div className="rounded-md border-3 border-dashed border-rule bg-surface px-4 py-3" data-testid="from-parts">
      <p className="font-semibold">
        Computed from <span className="font-mono">{revision}</span>&rsquo;s parts list &mdash; not yet measured by anyone
      </p>
      <ul className="mt-2 space-y-2">
        {SCALES.map((q) => {
          const lines = families.map((u) => ({ family: u.name, setting: settingFromParts(q, parts, u), arithmetic: partsArithmetic(q, parts, u) }));
          return (
            <li key={q}>
              <span className="font-display font-bold tracking-wide uppercase">{QUANTITY_TITLES[q]}</span>
              {lines[0]?.arithmetic == null ? (
                <p className="text-small text-muted">Unknown: {WHAT_TO_MEASURE[q]}.</p>
              ) : (
                <ul className="space-y-1">
                  {lines.map((l) => (
                    <li key={l.family} className="flex flex-wrap items-baseline gap-x-3">
                      {families.length > 1 && <span className="w-24 font-semibold">{l.family}</span>}
                      <span className="font-mono text-heading font-bold text-muted" data-testid={`parts-${q}`}>
                        {settingText(l.setting!)}
                      </span>
                      <span className="text-small text-muted">{l.arithmetic}</span>
                    </li>
                  ))}
                </ul>
              )}
            </li>
          );
        })}
      </ul>
      <p className="mt-2 text-small text-muted">Parts have tolerances: check the result against a multimeter and a charger before trusting it.</p>
    </div>
  );
}
