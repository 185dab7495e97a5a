// The one way Shuntbook writes a date: "4 Dec 2026", with "14:05 UTC" after it where the time
// matters. Always in UTC, so a page reads the same on the server and in every browser, and a
// stored calendar date (YYYY-MM-DD) is never shifted a day by a time zone.

const DAY = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
const TIME = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", hourCycle: "h23", timeZone: "UTC" });
const MONTH = new Intl.DateTimeFormat("en-GB", { month: "short", year: "numeric", timeZone: "UTC" });

/** A YYYY-MM-DD date or any ISO timestamp (or epoch ms) as an instant; a bare date is midnight UTC. */
const instant = (at: string | number | Date) =>
  at instanceof Date ? at : new Date(typeof at === "string" && /^\d{4}-\d{2}-\d{2}$/.test(at) ? `${at}T00:00:00Z` : at);

/** "4 Dec 2026" */
export function formatDate(at: string | number | Date): string {
  return DAY.format(instant(at));
}

/** "4 Dec 2026, 14:05 UTC" */
export function formatDateTime(at: string | number | Date): string {
  const d = instant(at);
  return `${DAY.format(d)}, ${TIME.format(d)} UTC`;
}

/** "Dec 2026", for axes and spans of months. */
export function formatMonth(at: string | number | Date): string {
  return MONTH.format(instant(at));
}
