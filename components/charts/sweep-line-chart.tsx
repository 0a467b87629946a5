"use client";
/**
 * A 1-D sweep: ⟨A⟩ against one parameter. The exact value (under the noise model, if any)
 * as a line, the noiseless ideal dashed when it differs, sampled points with 95 % error
 * bars (the point's ci95, asymmetric next to a deterministic outcome) when the run drew shots, and the minimum of the exact curve
 * marked with a ring and its coordinates.
 */
import {
  CartesianGrid,
  ComposedChart,
  ErrorBar,
  Line,
  ReferenceDot,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatAngle } from "@/components/circuit-diagram/angle";
import { Z95 } from "@/lib/quantum/sampling/normal";
import { ChartFigure, LegendKey, axisTick, colors, gridStroke, tooltipStyle } from "./chart-frame";
import { tickLabel } from "./scale";
import { argMin, type SweepPoint } from "./sweep-math";
import { formatFixed, formatSignificant, plural } from "@/lib/format";

export function SweepLineChart({
  points,
  name,
  noisy,
  height = 300,
}: {
  points: readonly SweepPoint[];
  name: string;
  noisy: boolean;
  height?: number;
}) {
  const data = points
    .map((p) => ({
      x: p.params[name],
      exact: p.exact,
      ideal: p.ideal,
      sampled: p.sampled?.mean ?? null,
      // asymmetric bars from the run's 95 % interval (older runs: ±1.96·stdErr)
      err: p.sampled
        ? p.sampled.ci95
          ? ([p.sampled.mean - p.sampled.ci95[0], p.sampled.ci95[1] - p.sampled.mean] as [
              number,
              number,
            ])
          : Z95 * p.sampled.stdErr
        : null,
    }))
    .sort((a, b) => a.x - b.x);
  const hasSampled = data.some((d) => d.sampled !== null);
  const iMin = argMin(data.map((d) => d.exact));
  const min = iMin >= 0 ? data[iMin] : null;
  const summary =
    `${plural(data.length, "value")} of ${name} from ${formatAngle(data[0]?.x ?? 0)} to ${formatAngle(data[data.length - 1]?.x ?? 0)}. ` +
    (min
      ? `Lowest exact value ${formatFixed(min.exact, 6)} at ${name} = ${formatAngle(min.x)}.`
      : "");
  return (
    <ChartFigure
      summary={summary}
      height={height}
      legend={
        <>
          <LegendKey
            color={noisy ? colors.noisy : colors.exact}
            label={noisy ? "exact under noise" : "exact"}
          />
          {noisy ? <LegendKey color={colors.ideal} kind="dash" label="ideal" /> : null}
          {hasSampled ? (
            <LegendKey color={colors.sampled} kind="dot" label="sampled, 95 % bars" />
          ) : null}
          {min ? (
            <LegendKey
              color={colors.accent}
              kind="dot"
              label={`min at ${name} = ${formatAngle(min.x)}`}
            />
          ) : null}
        </>
      }
    >
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={data} margin={{ top: 12, right: 16, bottom: 8, left: 4 }}>
          <CartesianGrid stroke={gridStroke} strokeDasharray="2 4" />
          <XAxis
            dataKey="x"
            type="number"
            domain={["dataMin", "dataMax"]}
            tick={axisTick}
            tickFormatter={tickLabel}
            stroke="var(--color-line-strong)"
            label={{
              value: name,
              position: "insideBottomRight",
              offset: -4,
              fontSize: 11,
              fill: "var(--color-ink-3)",
            }}
          />
          <YAxis
            tick={axisTick}
            tickFormatter={tickLabel}
            width={64}
            domain={["auto", "auto"]}
            stroke="var(--color-line-strong)"
          />
          <Tooltip
            {...tooltipStyle}
            labelFormatter={(v) => `${name} = ${formatSignificant(Number(v), 6)}`}
            formatter={(value, key) => [
              value === null ? "—" : formatFixed(Number(value), 6),
              String(key),
            ]}
          />
          {noisy ? (
            <Line
              dataKey="ideal"
              stroke={colors.ideal}
              strokeDasharray="5 3"
              strokeWidth={1.5}
              dot={false}
              isAnimationActive={false}
            />
          ) : null}
          <Line
            dataKey="exact"
            stroke={noisy ? colors.noisy : colors.exact}
            strokeWidth={2}
            dot={data.length <= 40 ? { r: 2 } : false}
            isAnimationActive={false}
          />
          {hasSampled ? (
            <Scatter dataKey="sampled" fill={colors.sampled} isAnimationActive={false}>
              <ErrorBar
                dataKey="err"
                width={4}
                stroke={colors.sampled}
                strokeWidth={1.25}
                direction="y"
              />
            </Scatter>
          ) : null}
          {min ? (
            <ReferenceDot
              x={min.x}
              y={min.exact}
              r={7}
              fill="none"
              stroke={colors.accent}
              strokeWidth={2}
              ifOverflow="extendDomain"
            />
          ) : null}
        </ComposedChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}
