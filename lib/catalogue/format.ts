// How catalogue numbers are written on the pages. Kept here (not in components) so that the
// JSON API and any export can render the same strings, and tests can pin them.

const trim = (n: number, maxDigits: number) => new Intl.NumberFormat("en", { maximumFractionDigits: maxDigits, useGrouping: false }).format(n);

/** Resistance with an SI prefix, as printed on schematics: 10000 → "10 kΩ", 4700 → "4.7 kΩ". */
export function formatOhms(ohms: number): string {
  if (ohms >= 1_000_000) return `${trim(ohms / 1_000_000, 3)} MΩ`;
  if (ohms >= 1_000) return `${trim(ohms / 1_000, 3)} kΩ`;
  return `${trim(ohms, 3)} Ω`;
}

/** A plain figure with at most `digits` decimals and no trailing zeros: 11 → "11", 10.1 → "10.1". */
export function formatFigure(n: number, digits = 3): string {
  return trim(n, digits);
}

/** Hole spacing as written on the page: "30.5x30.5" → "30.5 × 30.5" (thin spaces keep it compact). */
export function formatMounting(pattern: string): string {
  return pattern.replace("x", "\u2009×\u2009");
}

/** Cell range of a board: "3–8S", or "6S" when both ends agree. */
export function formatCells(min: number, max: number): string {
  return min === max ? `${max}S` : `${min}–${max}S`;
}

/** "1 value" / "3 values" — counts read as words on the page. */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${new Intl.NumberFormat("en").format(n)} ${n === 1 ? one : many}`;
}
