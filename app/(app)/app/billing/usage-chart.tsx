"use client";

import {
  Area,
  AreaChart,
  CartesianGrid,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatCompact } from "@/lib/format";

export type ChartPoint = { day: string; value: number };

/**
 * Cumulative use of one meter over the period, day by day, with the plan's
 * included amount as a dashed line (when there is one).
 */
export function UsageChart({
  points,
  included,
  unit,
  label,
}: {
  points: ChartPoint[];
  included: number | null;
  unit: string;
  label: string;
}) {
  return (
    <figure className="grid gap-1.5">
      <figcaption className="text-[13px] font-medium text-ink">{label}</figcaption>
      <div
        className="h-40 w-full"
        role="img"
        aria-label={`${label}: ${formatCompact(points.at(-1)?.value ?? 0)} ${unit} used so far this period`}
      >
        <ResponsiveContainer width="100%" height="100%">
          <AreaChart data={points} margin={{ top: 6, right: 8, bottom: 0, left: 0 }}>
            <CartesianGrid stroke="var(--color-line)" strokeDasharray="2 4" vertical={false} />
            <XAxis
              dataKey="day"
              tickFormatter={(d: string) => d.slice(8)}
              tick={{ fontSize: 11, fill: "var(--color-ink-3)" }}
              tickLine={false}
              axisLine={false}
              interval="preserveStartEnd"
            />
            <YAxis
              domain={[0, (dataMax: number) => Math.max(dataMax, included ?? 0) || 1]}
              tickFormatter={(v: number) => formatCompact(v)}
              tick={{ fontSize: 11, fill: "var(--color-ink-3)" }}
              tickLine={false}
              axisLine={false}
              width={44}
            />
            <Tooltip
              formatter={(v) => [`${formatCompact(Number(v))} ${unit}`, "Used so far"]}
              labelFormatter={(d) => String(d)}
              contentStyle={{
                fontSize: 12,
                borderRadius: 6,
                border: "1px solid var(--color-line)",
                background: "var(--color-surface)",
              }}
            />
            {included ? (
              <ReferenceLine
                y={included}
                stroke="var(--color-warn)"
                strokeDasharray="4 3"
                label={{
                  value: "included",
                  fontSize: 10,
                  fill: "var(--color-ink-3)",
                  position: "insideTopRight",
                }}
              />
            ) : null}
            <Area
              type="stepAfter"
              dataKey="value"
              stroke="var(--color-accent)"
              fill="var(--color-accent-soft)"
              strokeWidth={1.5}
              isAnimationActive={false}
            />
          </AreaChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
