/**
 * Shared look of the recharts charts: axis ticks in the figures face, theme-token colours
 * (CSS variables, so dark mode follows), and a titled figure with a text alternative.
 */
import type { ReactNode } from "react";
import { cn } from "@/components/ui/cn";

export const axisTick = {
  fontSize: 11,
  fill: "var(--color-ink-3)",
  fontFamily: "var(--font-mono)",
};
export const gridStroke = "var(--color-line)";
export const colors = {
  exact: "var(--color-exact)",
  ideal: "var(--color-ink-3)",
  sampled: "var(--color-sampled)",
  noisy: "var(--color-noisy)",
  mitigated: "var(--color-mitigated)",
  accent: "var(--color-accent)",
};

export const tooltipStyle = {
  contentStyle: {
    background: "var(--color-surface)",
    border: "1px solid var(--color-line-strong)",
    borderRadius: 6,
    boxShadow: "var(--shadow-pop)",
    fontSize: 12,
    fontFamily: "var(--font-mono)",
    color: "var(--color-ink)",
  },
  labelStyle: { color: "var(--color-ink-2)", marginBottom: 2 },
  itemStyle: { padding: 0 },
  cursor: { stroke: "var(--color-line-strong)", strokeDasharray: "3 3" },
};

export function ChartFigure({
  title,
  description,
  summary,
  legend,
  children,
  className,
  height = 260,
}: {
  title?: ReactNode;
  description?: ReactNode;
  /** Text alternative read by screen readers (the chart itself is hidden from them). */
  summary: string;
  legend?: ReactNode;
  children: ReactNode;
  className?: string;
  height?: number;
}) {
  return (
    <figure className={cn("grid min-w-0 gap-2", className)}>
      {title || legend ? (
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          {title ? (
            <figcaption className="text-[13px] font-semibold text-ink">{title}</figcaption>
          ) : null}
          {legend ? <div className="flex flex-wrap gap-3 text-xs text-ink-2">{legend}</div> : null}
        </div>
      ) : null}
      {description ? <p className="text-xs text-ink-3">{description}</p> : null}
      <div aria-hidden style={{ height }} className="min-w-0">
        {children}
      </div>
      <p className="sr-only">{summary}</p>
    </figure>
  );
}

export function LegendKey({
  color,
  label,
  kind = "line",
}: {
  color: string;
  label: string;
  kind?: "line" | "dot" | "band" | "dash";
}) {
  return (
    <span className="inline-flex items-center gap-1.5">
      <svg width="18" height="10" aria-hidden>
        {kind === "line" ? (
          <line x1="1" x2="17" y1="5" y2="5" stroke={color} strokeWidth="2" />
        ) : null}
        {kind === "dash" ? (
          <line
            x1="1"
            x2="17"
            y1="5"
            y2="5"
            stroke={color}
            strokeWidth="1.5"
            strokeDasharray="3 2"
          />
        ) : null}
        {kind === "dot" ? <circle cx="9" cy="5" r="3.5" fill={color} /> : null}
        {kind === "band" ? (
          <rect x="1" y="1" width="16" height="8" rx="2" fill={color} opacity="0.22" />
        ) : null}
      </svg>
      {label}
    </span>
  );
}
