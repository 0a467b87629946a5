/**
 * A 2-D sweep as a heat map: one cell per grid point coloured by the chosen value
 * (sweep-math's ramp, low = deep verdigris), the minimum ringed, axis labels from the
 * swept values, and a colour key. Each cell has a native tooltip; a text summary and
 * the point table beside the chart carry the same numbers for screen readers.
 */
import { formatAngle } from "@/components/circuit-diagram/angle";
import { linear, tickLabel } from "./scale";
import {
  argMin,
  gridShape,
  metricOf,
  rampColor,
  type SweepMetric,
  type SweepPoint,
} from "./sweep-math";
import { formatFixed, plural } from "@/lib/format";

export function SweepHeatmap({
  points,
  names,
  metric,
  className,
}: {
  points: readonly SweepPoint[];
  names: readonly [string, string];
  metric: SweepMetric;
  className?: string;
}) {
  const { rows, cols, cells } = gridShape(points, names);
  const values = points.map((p) => metricOf(p, metric));
  const finite = values.filter((v): v is number => v !== null && Number.isFinite(v));
  const lo = finite.length ? Math.min(...finite) : 0;
  const hi = finite.length ? Math.max(...finite) : 1;
  const t = linear([lo, hi === lo ? lo + 1 : hi], [0, 1]);
  const iMin = argMin(values);

  const L = 60;
  const T = 12;
  const cell = Math.max(8, Math.min(36, Math.floor(560 / Math.max(cols.length, 1))));
  const cellH = Math.max(8, Math.min(28, Math.floor(360 / Math.max(rows.length, 1))));
  const W = L + cols.length * cell + 96;
  const H = T + rows.length * cellH + 40;
  const every = (n: number) => Math.max(1, Math.ceil(n / 8));
  const keyX = L + cols.length * cell + 22;
  const keyH = rows.length * cellH;

  const minPoint = iMin >= 0 ? points[iMin] : null;
  const summary =
    `Heat map of the ${metric} value over ${names[0]} (rows, ${plural(rows.length, "value")}) and ${names[1]} (columns, ${plural(cols.length, "value")}); ` +
    `values from ${formatFixed(lo, 5)} to ${formatFixed(hi, 5)}` +
    (minPoint
      ? `; minimum ${formatFixed(values[iMin]!, 6)} at ${names[0]} = ${formatAngle(minPoint.params[names[0]])}, ${names[1]} = ${formatAngle(minPoint.params[names[1]])}.`
      : ".");

  return (
    <figure className={className}>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-3xl" role="img" aria-label={summary}>
        {points.map((p, i) => {
          const v = values[i];
          const { row, col } = cells[i];
          return (
            <rect
              key={i}
              x={L + col * cell}
              y={T + row * cellH}
              width={cell}
              height={cellH}
              fill={v === null ? "var(--color-surface-3)" : rampColor(t(v))}
            >
              <title>{`${names[0]} = ${formatAngle(p.params[names[0]])}, ${names[1]} = ${formatAngle(p.params[names[1]])}: ${v === null ? "no value" : formatFixed(v, 6)}`}</title>
            </rect>
          );
        })}
        {minPoint ? (
          <g>
            <circle
              cx={L + cells[iMin].col * cell + cell / 2}
              cy={T + cells[iMin].row * cellH + cellH / 2}
              r={Math.max(4, Math.min(cell, cellH) / 2 - 1)}
              fill="none"
              stroke="white"
              strokeWidth={2.5}
            />
            <circle
              cx={L + cells[iMin].col * cell + cell / 2}
              cy={T + cells[iMin].row * cellH + cellH / 2}
              r={Math.max(4, Math.min(cell, cellH) / 2 - 1)}
              fill="none"
              stroke="black"
              strokeWidth={1}
            />
          </g>
        ) : null}
        {rows.map((r, i) =>
          i % every(rows.length) === 0 ? (
            <text
              key={`r${i}`}
              x={L - 6}
              y={T + i * cellH + cellH / 2 + 3.5}
              textAnchor="end"
              className="figures fill-ink-3"
              fontSize={10}
            >
              {formatAngle(r)}
            </text>
          ) : null,
        )}
        {cols.map((c, j) =>
          j % every(cols.length) === 0 ? (
            <text
              key={`c${j}`}
              x={L + j * cell + cell / 2}
              y={T + rows.length * cellH + 14}
              textAnchor="middle"
              className="figures fill-ink-3"
              fontSize={10}
            >
              {formatAngle(c)}
            </text>
          ) : null,
        )}
        <text
          x={L + (cols.length * cell) / 2}
          y={H - 6}
          textAnchor="middle"
          className="fill-ink-2 font-mono"
          fontSize={11}
        >
          {names[1]}
        </text>
        <text
          x={12}
          y={T + (rows.length * cellH) / 2}
          textAnchor="middle"
          transform={`rotate(-90 12 ${T + (rows.length * cellH) / 2})`}
          className="fill-ink-2 font-mono"
          fontSize={11}
        >
          {names[0]}
        </text>
        <defs>
          <linearGradient id="kw-ramp" x1="0" x2="0" y1="1" y2="0">
            {[0, 0.25, 0.5, 0.75, 1].map((s) => (
              <stop key={s} offset={s} stopColor={rampColor(s)} />
            ))}
          </linearGradient>
        </defs>
        <rect x={keyX} y={T} width={10} height={keyH} fill="url(#kw-ramp)" rx={2} />
        <text x={keyX + 14} y={T + 8} className="figures fill-ink-3" fontSize={10}>
          {tickLabel(hi)}
        </text>
        <text x={keyX + 14} y={T + keyH} className="figures fill-ink-3" fontSize={10}>
          {tickLabel(lo)}
        </text>
      </svg>
      <figcaption className="mt-1 text-xs text-ink-3">
        {minPoint ? (
          <>
            Ringed: lowest {metric} value{" "}
            <span className="figures text-ink">{formatFixed(values[iMin]!, 6)}</span> at{" "}
            <span className="figures text-ink">
              {names[0]} = {formatAngle(minPoint.params[names[0]])}, {names[1]} ={" "}
              {formatAngle(minPoint.params[names[1]])}
            </span>
            .
          </>
        ) : (
          "No values."
        )}
      </figcaption>
    </figure>
  );
}
