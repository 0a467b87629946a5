import { cn } from "./cn";
import { formatPercent } from "@/lib/format";

/**
 * Progress of a task. `value` in [0, 1]; omit it (or pass null) for an indeterminate bar.
 * The accessible name comes from `label`; the percentage is announced as the value.
 */
export function ProgressBar({
  value,
  label,
  showValue = false,
  tone = "accent",
  className,
}: {
  value?: number | null;
  label: string;
  showValue?: boolean;
  tone?: "accent" | "info" | "ok" | "danger";
  className?: string;
}) {
  const determinate = typeof value === "number" && Number.isFinite(value);
  const pct = determinate ? Math.round(Math.min(1, Math.max(0, value)) * 100) : null;
  const fill = { accent: "bg-accent", info: "bg-info", ok: "bg-ok", danger: "bg-danger" }[tone];
  return (
    <div className={cn("grid gap-1.5", className)}>
      {showValue ? (
        <div className="flex items-baseline justify-between text-[13px]">
          <span className="text-ink-2">{label}</span>
          <span className="figures text-xs text-ink-2">
            {pct === null ? "…" : formatPercent(pct / 100)}
          </span>
        </div>
      ) : null}
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct ?? undefined}
        className="relative h-1.5 overflow-hidden rounded-full bg-surface-3"
      >
        {pct === null ? (
          <div
            className={cn("absolute inset-y-0 w-2/5 rounded-full animate-indeterminate", fill)}
          />
        ) : (
          <div
            className={cn("h-full rounded-full transition-[width] duration-300 ease-out", fill)}
            style={{ width: `${pct}%` }}
          />
        )}
      </div>
    </div>
  );
}
