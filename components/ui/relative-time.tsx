import { formatDateTime, formatRelative, type DateInput } from "@/lib/format";

/**
 * "5 min ago" in a `<time>` element with the exact UTC date and time as its tooltip. The
 * words depend on the clock, so the server's render and the browser's hydration may differ
 * by a minute; the text alone is exempt from the hydration check (suppressHydrationWarning).
 */
export function RelativeTime({ date, className }: { date: DateInput; className?: string }) {
  const d = new Date(date);
  return (
    <time
      dateTime={d.toISOString()}
      title={formatDateTime(d, { seconds: true, zone: true })}
      className={className}
      suppressHydrationWarning
    >
      {formatRelative(d)}
    </time>
  );
}
