import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, formatMonth } from "@/lib/dates/format";

// One date format everywhere (the daily-paths issue found five). Expected strings are en-GB
// short-month dates as ECMA-402 Intl.DateTimeFormat with the runtime's ICU data writes them.

describe("dates", () => {
  it("a calendar date is never shifted by a time zone", () => {
    expect(formatDate("2026-12-04")).toBe("4 Dec 2026");
    expect(formatDate("2026-01-01")).toBe("1 Jan 2026");
  });

  it("an instant is written in UTC, with the time marked UTC", () => {
    expect(formatDate("2026-12-04T23:30:00-05:00")).toBe("5 Dec 2026");
    expect(formatDateTime("2026-12-04T14:05:09Z")).toBe("4 Dec 2026, 14:05 UTC");
    expect(formatDateTime("2026-12-04T00:07:00Z")).toBe("4 Dec 2026, 00:07 UTC");
  });

  it("months for axes", () => {
    expect(formatMonth(Date.UTC(2025, 5, 30))).toBe("Jun 2025");
  });
});
