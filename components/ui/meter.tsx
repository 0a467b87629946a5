import { cn } from "./cn";
import { formatCompact, formatPercent } from "@/lib/format";

/**
 * Usage against a quota (ARIA role "meter"). The bar turns amber from `warnAt` (default
 * 80 %) and when exactly full, red only over the limit, where the overflow is stated in
 * text (exactly full is said as such: full is not over).
 * `limit` null or Infinity = unlimited.
 */
export function Meter({
  label,
  used,
  limit,
  unit,
  format = formatCompact,
  warnAt = 0.8,
  hint,
  className,
}: {
  label: string;
  used: number;
  limit: number | null;
  unit?: string;
  format?: (n: number) => string;
  warnAt?: number;
  hint?: string;
  className?: string;
}) {
  const unlimited = limit === null || !Number.isFinite(limit) || limit <= 0;
  const ratio = unlimited ? 0 : used / (limit as number);
  // exactly at the limit is "full", not over: nothing beyond the included quota is used
  const state = unlimited
    ? "ok"
    : used > (limit as number)
      ? "over"
      : used === limit
        ? "full"
        : ratio >= warnAt
          ? "warn"
          : "ok";
  const fill =
    state === "over"
      ? "bg-danger"
      : state === "warn" || state === "full"
        ? "bg-warn-fill"
        : "bg-accent";
  const u = unit ? ` ${unit}` : "";
  const valueText = unlimited
    ? `${format(used)}${u} used, no limit`
    : `${format(used)} of ${format(limit as number)}${u} (${formatPercent(ratio)})`;
  return (
    <div className={cn("grid gap-1.5", className)}>
      <div className="flex items-baseline justify-between gap-3 text-[13px]">
        <span className="font-medium text-ink">{label}</span>
        <span className="figures text-xs text-ink-2">
          <span className={cn(state === "over" ? "text-danger" : "text-ink")}>{format(used)}</span>
          {unlimited ? null : <span> / {format(limit as number)}</span>}
          {u}
        </span>
      </div>
      <div
        role="meter"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={unlimited ? undefined : (limit as number)}
        aria-valuenow={used}
        aria-valuetext={valueText}
        className="h-1.5 overflow-hidden rounded-full bg-surface-3"
      >
        <div
          className={cn("h-full rounded-full", fill)}
          style={{ width: `${Math.min(100, ratio * 100)}%` }}
        />
      </div>
      {state === "over" ? (
        <p className="text-xs text-danger">
          Over the included quota by {format(used - (limit as number))}
          {u}.
        </p>
      ) : state === "full" ? (
        <p className="text-xs text-ink-2">
          All {format(limit as number)}
          {u} included in use; the next one goes over the quota.
        </p>
      ) : hint ? (
        <p className="text-xs text-ink-3">{hint}</p>
      ) : null}
    </div>
  );
}
