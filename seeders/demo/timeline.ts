// The scenario is laid out backwards from an anchor ("now"), so that a demo seeded today shows
// activity over the last months rather than frozen dates. The anchor is the start of the UTC day,
// so two seeds on the same day are identical.

const DAY_MS = 86_400_000;
/** mean Gregorian month */
const MONTH_MS = 30.436875 * DAY_MS;

/** How far back the submissions reach (the brief's "last ~18 months"). */
export const SUBMISSION_WINDOW_MONTHS = 18;

export function startOfUtcDay(d: Date): Date {
  return new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate()));
}

export function monthsBefore(anchor: Date, months: number): Date {
  return new Date(anchor.getTime() - Math.round(months * MONTH_MS));
}

export function daysAfter(d: Date, days: number): Date {
  return new Date(d.getTime() + Math.round(days * DAY_MS));
}

/** YYYY-MM-DD for a DATE column. */
export function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

export function monthsBetween(from: Date, to: Date): number {
  return (to.getTime() - from.getTime()) / MONTH_MS;
}
