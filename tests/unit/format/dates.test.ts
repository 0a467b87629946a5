import { describe, expect, it } from "vitest";
import {
  formatDate,
  formatDateTime,
  formatIsoDate,
  formatIsoMonth,
  formatLongDate,
  formatRelative,
} from "@/lib/format/dates";

// Expected strings follow the Unicode CLDR en-GB patterns (d MMM y; d MMMM y; HH:mm),
// printed in UTC whatever the machine's time zone.
describe("dates in UTC", () => {
  // 23:30 UTC on New Year's Eve: a browser east of UTC would already be in January
  const newYearsEve = "2026-12-31T23:30:15Z";

  it("prints the UTC day at a month and year boundary", () => {
    expect(formatDate(newYearsEve)).toBe("31 Dec 2026");
    expect(formatLongDate(newYearsEve)).toBe("31 December 2026");
    expect(formatDate("2027-01-01T00:00:00Z")).toBe("1 Jan 2027");
    expect(formatIsoDate(newYearsEve)).toBe("2026-12-31");
    expect(formatIsoMonth(newYearsEve)).toBe("2026-12");
    expect(formatIsoMonth("2027-01-01T00:00:00Z")).toBe("2027-01");
  });

  it("prints date and time, with seconds, long and with the zone on request", () => {
    expect(formatDateTime(newYearsEve)).toBe("31 Dec 2026, 23:30");
    expect(formatDateTime(newYearsEve, { seconds: true })).toBe("31 Dec 2026, 23:30:15");
    expect(formatDateTime(newYearsEve, { long: true, zone: true })).toBe(
      "31 December 2026 at 23:30 UTC",
    );
    expect(formatDateTime(null)).toBe("—");
  });

  it("accepts Date objects and epoch milliseconds alike", () => {
    const d = new Date(Date.UTC(2027, 1, 28, 12));
    expect(formatDate(d)).toBe("28 Feb 2027");
    expect(formatDate(d.getTime())).toBe("28 Feb 2027");
  });

  it("refuses an invalid date", () => {
    expect(() => formatDate("not a date")).toThrow(/valid date/);
  });
});

describe("formatRelative", () => {
  const now = "2026-12-03T12:00:00Z";
  it("says just now, minutes and hours, then the date", () => {
    expect(formatRelative("2026-12-03T11:59:30Z", now)).toBe("just now");
    expect(formatRelative("2026-12-03T11:55:00Z", now)).toBe("5 min ago");
    expect(formatRelative("2026-12-03T09:00:00Z", now)).toBe("3 h ago");
    expect(formatRelative("2026-12-01T08:05:00Z", now)).toBe("1 Dec 2026, 08:05");
  });
});
