/**
 * Dates and times for people, in one locale and one time zone (UTC) on the server and in
 * the browser, so a server-rendered page and its hydration print the same text. The
 * day-month-year order ("3 Dec 2026") is the product's style everywhere.
 * ISO forms are for machine fields (CSV, file names, periods).
 */

export const DATE_LOCALE = "en-GB";
export const DISPLAY_TIME_ZONE = "UTC";

export type DateInput = Date | string | number;

const formats = {
  date: new Intl.DateTimeFormat(DATE_LOCALE, { dateStyle: "medium", timeZone: DISPLAY_TIME_ZONE }),
  longDate: new Intl.DateTimeFormat(DATE_LOCALE, {
    dateStyle: "long",
    timeZone: DISPLAY_TIME_ZONE,
  }),
  dateTime: new Intl.DateTimeFormat(DATE_LOCALE, {
    dateStyle: "medium",
    timeStyle: "short",
    timeZone: DISPLAY_TIME_ZONE,
  }),
  dateTimeSeconds: new Intl.DateTimeFormat(DATE_LOCALE, {
    dateStyle: "medium",
    timeStyle: "medium",
    timeZone: DISPLAY_TIME_ZONE,
  }),
  longDateTime: new Intl.DateTimeFormat(DATE_LOCALE, {
    dateStyle: "long",
    timeStyle: "short",
    timeZone: DISPLAY_TIME_ZONE,
  }),
};

/** A Date from a Date, an ISO string or epoch milliseconds; throws on an invalid date. */
export function toDate(d: DateInput): Date {
  const date = d instanceof Date ? d : new Date(d);
  if (Number.isNaN(date.getTime())) throw new RangeError(`Not a valid date: ${String(d)}.`);
  return date;
}

/** "3 Dec 2026" (UTC). */
export function formatDate(d: DateInput): string {
  return formats.date.format(toDate(d));
}

/** "3 December 2026" (UTC), for sentences and e-mails. */
export function formatLongDate(d: DateInput): string {
  return formats.longDate.format(toDate(d));
}

/**
 * "3 Dec 2026, 14:05" (UTC); `seconds` adds them ("14:05:09"), `long` spells the month,
 * `zone` appends " UTC" (for e-mails, read outside the product). A missing value is "—".
 */
export function formatDateTime(
  d: DateInput | null | undefined,
  options: { seconds?: boolean; long?: boolean; zone?: boolean } = {},
): string {
  if (d === null || d === undefined) return "—";
  const f = options.long
    ? formats.longDateTime
    : options.seconds
      ? formats.dateTimeSeconds
      : formats.dateTime;
  return f.format(toDate(d)) + (options.zone ? ` ${DISPLAY_TIME_ZONE}` : "");
}

/**
 * How long ago, for lists: "just now" (under 45 s), "5 min ago", "3 h ago", else the date
 * and time. `now` is explicit so tests and renders agree.
 */
export function formatRelative(d: DateInput, now: DateInput = Date.now()): string {
  const ms = toDate(now).getTime() - toDate(d).getTime();
  if (ms < 45_000) return "just now";
  if (ms < 3_600_000) return `${Math.round(ms / 60_000)} min ago`;
  if (ms < 86_400_000) return `${Math.round(ms / 3_600_000)} h ago`;
  return formatDateTime(d);
}

/** "2026-12-03" (UTC calendar day), for machine fields. */
export function formatIsoDate(d: DateInput): string {
  return toDate(d).toISOString().slice(0, 10);
}

/** "2026-12" (UTC calendar month), the usage period's key. */
export function formatIsoMonth(d: DateInput): string {
  return toDate(d).toISOString().slice(0, 7);
}
