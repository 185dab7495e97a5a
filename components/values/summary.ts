import { plural } from "@/lib/catalogue/format";
import { formatDate, formatMonth } from "@/lib/dates/format";
import type { FamilyUnits, QuantityKey, QuantityValues } from "@/lib/published/board-values-types";
import { MIN_VALUES_TO_JUDGE } from "@/lib/stats/spread";
import { minimumCountForCi } from "@/lib/stats/median-ci";
import { type Method, METHOD_LABELS } from "@/lib/vocabulary";
import { figureText, settingMeaning } from "./quantity-meaning";

// The words that stand in for a distribution chart (its accessible description and caption):
// n, the median, its 95 % range and the flagged values. Never prints NaN or undefined: every
// figure that can be missing has its own sentence.

export function methodLabel(method: Method): string {
  return METHOD_LABELS[method] ?? method;
}

export function chartSummary(quantity: QuantityKey, q: QuantityValues, units: FamilyUnits): string {
  const points = q.points ?? [];
  const parts: string[] = [];
  const span =
    points.length > 1
      ? `, from ${formatMonth(points[0].date)} to ${formatMonth(points[points.length - 1].date)}`
      : points.length === 1
        ? `, from ${formatMonth(points[0].date)}`
        : "";
  parts.push(`${plural(q.n, "approved value")}${span}.`);
  const meaning = settingMeaning(quantity, q.median, units)[0];
  parts.push(`Median ${figureText(q.median)}${meaning ? ` (${meaning})` : ""}.`);
  if (q.n < MIN_VALUES_TO_JUDGE) parts.push("Too few values to judge.");
  if (q.ciLow !== null && q.ciHigh !== null) {
    parts.push(`95 % range for the median: ${figureText(q.ciLow)} to ${figureText(q.ciHigh)}.`);
  } else {
    parts.push(`No 95 % range yet: that needs at least ${minimumCountForCi()} values.`);
  }
  const flagged = points.filter((p) => p.outlier);
  if (flagged.length === 0) {
    parts.push(q.n < MIN_VALUES_TO_JUDGE ? "Outliers are not judged below 3 values." : "No value is flagged as an outlier.");
  } else {
    const listed = flagged.slice(0, 5).map((p) => `${figureText(p.value)} (${methodLabel(p.method)}, ${formatDate(p.date)})`);
    const more = flagged.length > 5 ? ` and ${flagged.length - 5} more` : "";
    parts.push(`${plural(flagged.length, "flagged outlier")}: ${listed.join("; ")}${more}.`);
  }
  return parts.join(" ");
}
