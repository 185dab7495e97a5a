import { formatDate, formatDateTime } from "@/lib/dates/format";

/** A date (or date and time) as the page shows every date, inside a machine-readable <time>. */
export function When({ at, time = false }: { at: string; time?: boolean }) {
  return <time dateTime={at}>{time ? formatDateTime(at) : formatDate(at)}</time>;
}
