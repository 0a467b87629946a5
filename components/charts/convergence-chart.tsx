"use client";
/**
 * The running estimate against shots (log axis): the mean at each checkpoint, its 95 %
 * band (the run's ci95 at that prefix; mean ± 1.96·stdErr for older runs), and the exact value as a reference line. A correct sampler's
 * band narrows as 1/√N around the exact value (or around the readout-biased value when
 * the noise model has readout error).
 */
import {
  Area,
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { Z95 } from "@/lib/quantum/sampling/normal";
import { ChartFigure, LegendKey, axisTick, colors, gridStroke, tooltipStyle } from "./chart-frame";
import { logTicks, niceTicks, paddedDomain, tickLabel } from "./scale";
import { formatCompact, formatFixed, formatPlusMinus, plural } from "@/lib/format";

export type ConvergencePoint = {
  shots: number;
  mean: number;
  stdErr: number;
  /** The run's 95 % interval at this prefix (older runs: mean ± 1.96·stdErr). */
  ci95?: readonly [number, number];
};

export function ConvergenceChart({
  points,
  exact,
  height = 260,
}: {
  points: readonly ConvergencePoint[];
  exact: number;
  height?: number;
}) {
  const data = points.map((p) => ({
    shots: p.shots,
    mean: p.mean,
    band: (p.ci95
      ? [p.ci95[0], p.ci95[1]]
      : [p.mean - Z95 * p.stdErr, p.mean + Z95 * p.stdErr]) as [number, number],
  }));
  const last = points[points.length - 1];
  const yDomain = paddedDomain([exact, ...data.flatMap((d) => d.band)], 0.06);
  const summary = last
    ? `Running estimate over ${plural(points.length, "checkpoint")} up to ${plural(last.shots, "shot")}, ending at ${formatPlusMinus(last.mean, last.stdErr)}; exact value ${formatFixed(exact, 6)}.`
    : "No checkpoints.";
  return (
    <ChartFigure
      summary={summary}
      height={height}
      legend={
        <>
          <LegendKey color={colors.sampled} label="running mean" />
          <LegendKey color={colors.sampled} kind="band" label="95 % band" />
          <LegendKey color={colors.exact} kind="dash" label="exact" />
        </>
      }
    >
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={data} margin={{ top: 8, right: 12, bottom: 4, left: 4 }}>
          <CartesianGrid stroke={gridStroke} strokeDasharray="2 4" />
          <XAxis
            dataKey="shots"
            type="number"
            scale="log"
            domain={["dataMin", "dataMax"]}
            ticks={logTicks(points[0]?.shots ?? 1, last?.shots ?? 1)}
            tick={axisTick}
            tickFormatter={(v: number) => formatCompact(v)}
            stroke="var(--color-line-strong)"
            label={{
              value: "shots",
              position: "insideBottomRight",
              offset: -2,
              fontSize: 11,
              fill: "var(--color-ink-3)",
            }}
            allowDataOverflow
          />
          <YAxis
            tick={axisTick}
            tickFormatter={tickLabel}
            width={64}
            domain={yDomain}
            ticks={niceTicks(yDomain[0], yDomain[1], 5)}
            allowDataOverflow
            stroke="var(--color-line-strong)"
          />
          <Tooltip
            {...tooltipStyle}
            labelFormatter={(v) => plural(Number(v), "shot")}
            formatter={(value, name) =>
              Array.isArray(value)
                ? [
                    `${formatFixed(Number(value[0]), 5)} … ${formatFixed(Number(value[1]), 5)}`,
                    "95 % band",
                  ]
                : [formatFixed(Number(value), 6), name === "mean" ? "mean" : String(name)]
            }
          />
          <Area
            dataKey="band"
            stroke="none"
            fill={colors.sampled}
            fillOpacity={0.18}
            isAnimationActive={false}
          />
          <ReferenceLine
            y={exact}
            stroke={colors.exact}
            strokeDasharray="5 3"
            strokeWidth={1.5}
            ifOverflow="extendDomain"
          />
          <Line
            dataKey="mean"
            stroke={colors.sampled}
            strokeWidth={2}
            dot={{ r: 2.5, fill: colors.sampled, strokeWidth: 0 }}
            isAnimationActive={false}
          />
        </ComposedChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}
