"use client";
/**
 * Counts of one measurement setting by bitstring (qubit 0 first, the leftmost character), in
 * reading order. With many distinct outcomes only the most frequent `maxBars` are drawn
 * (in reading order) and the rest are summed in the caption.
 */
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { ChartFigure, axisTick, colors, gridStroke, tooltipStyle } from "./chart-frame";
import { formatCount, formatPercent, plural } from "@/lib/format";

export function topCounts(counts: Record<string, number>, maxBars: number) {
  const entries = Object.entries(counts);
  const total = entries.reduce((a, [, c]) => a + c, 0);
  const kept =
    entries.length > maxBars ? [...entries].sort((a, b) => b[1] - a[1]).slice(0, maxBars) : entries;
  const keptSet = new Set(kept.map(([k]) => k));
  const rest = entries.filter(([k]) => !keptSet.has(k));
  kept.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return {
    bars: kept.map(([bits, count]) => ({ bits, count, p: total ? count / total : 0 })),
    total,
    otherOutcomes: rest.length,
    otherCount: rest.reduce((a, [, c]) => a + c, 0),
  };
}

export function HistogramChart({
  bases,
  counts,
  shots,
  maxBars = 32,
  height = 200,
}: {
  bases: string;
  counts: Record<string, number>;
  shots: number;
  maxBars?: number;
  height?: number;
}) {
  const { bars, otherOutcomes, otherCount } = topCounts(counts, maxBars);
  const summary =
    `Setting ${bases}: ${plural(shots, "shot")}; ` +
    bars.map((b) => `${b.bits}: ${formatCount(b.count)}`).join(", ") +
    (otherOutcomes
      ? `; ${plural(otherOutcomes, "other outcome")} with ${plural(otherCount, "shot")}`
      : "");
  return (
    <ChartFigure
      title={
        <span>
          <span className="font-mono tracking-[0.12em]">{bases}</span>
          <span className="ml-2 font-normal text-ink-3">{plural(shots, "shot")}</span>
        </span>
      }
      description={
        otherOutcomes
          ? `${plural(otherOutcomes, "rarer outcome")} (${plural(otherCount, "shot")}) not drawn.`
          : undefined
      }
      summary={summary}
      height={height}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={bars} margin={{ top: 6, right: 6, bottom: 4, left: 0 }}>
          <CartesianGrid stroke={gridStroke} strokeDasharray="2 4" vertical={false} />
          <XAxis
            dataKey="bits"
            tick={{ ...axisTick, fontSize: bars.length > 12 ? 9.5 : 11 }}
            interval={0}
            angle={bars.length > 8 ? -45 : 0}
            textAnchor={bars.length > 8 ? "end" : "middle"}
            height={bars.length > 8 ? 14 + 7 * (bars[0]?.bits.length ?? 2) : 24}
            stroke="var(--color-line-strong)"
          />
          <YAxis
            tick={axisTick}
            width={44}
            allowDecimals={false}
            stroke="var(--color-line-strong)"
          />
          <Tooltip
            {...tooltipStyle}
            cursor={{ fill: "var(--color-surface-3)", opacity: 0.5 }}
            formatter={(value, _n, item) => [
              `${formatCount(Number(value))} (${formatPercent(item?.payload?.p ?? 0, 1)})`,
              "count",
            ]}
            labelFormatter={(v) => `bitstring ${v} (qubit 0 first)`}
          />
          <Bar
            dataKey="count"
            fill={colors.sampled}
            radius={[3, 3, 0, 0]}
            isAnimationActive={false}
            maxBarSize={44}
          />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}
