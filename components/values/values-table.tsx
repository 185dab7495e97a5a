import { ColumnHeads } from "@/components/column-heads";
import type { QuantityKey, QuantityValues } from "@/lib/published/board-values-types";
import { plural } from "@/lib/catalogue/format";
import { QUANTITY_TITLES, settingText } from "./quantity-meaning";
import { formatDate } from "@/lib/dates/format";
import { methodLabel } from "./summary";

/**
 * Every approved value of a quantity as a table, newest first, folded away by default: the chart's
 * data for keyboard and screen-reader users, and for anyone who wants the numbers.
 */
export function ValuesTable({ quantity, values: q }: { quantity: QuantityKey; values: QuantityValues }) {
  const points = [...(q.points ?? [])].reverse();
  if (points.length === 0) return null;
  return (
    <details className="mt-3 border-t border-rule-soft pt-2">
      <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold text-copper">Show all {plural(points.length, "value")}</summary>
      <div className="max-h-80 overflow-y-auto">
        <table className="w-full text-small">
          <caption className="sr-only">Approved values of the {QUANTITY_TITLES[quantity].toLowerCase()}, newest first</caption>
          <thead>
            <tr className="border-b-2 border-rule text-left">
              <ColumnHeads
                heads={["Date", "Method", { label: "Setting", className: "py-1 text-right font-display tracking-wide uppercase" }]}
                className="py-1 pr-2 font-display tracking-wide uppercase"
              />
            </tr>
          </thead>
          <tbody>
            {points.map((p, i) => (
              <tr key={`${p.date}-${i}`} className="border-b border-rule-soft">
                <td className="py-1 pr-2 whitespace-nowrap">
                  <time dateTime={p.date}>{formatDate(p.date)}</time>
                </td>
                <td className="py-1 pr-2">{methodLabel(p.method)}</td>
                <td className="py-1 text-right font-mono whitespace-nowrap">
                  {settingText(p.value)}
                  {p.outlier && (
                    <span className="ml-1 font-body font-bold text-fault">
                      ✕<span className="sr-only"> flagged outlier</span>
                    </span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
