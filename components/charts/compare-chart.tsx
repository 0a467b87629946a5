/**
 * Runs side by side on one shared number line: per run, the exact value (ink tick), the
 * noiseless ideal when noise moved it (dashed tick), the sampled 95 % interval with its
 * mean, and the mitigated interval when present. Pure SVG.
 */
import { linear, niceTicks, paddedDomain, tickLabel } from "./scale";

export type CompareRow = {
  id: string;
  label: string;
  exact: number;
  ideal: number;
  sampled: { mean: number; ci95: readonly [number, number] } | null;
  mitigated: { mean: number; ci95: readonly [number, number] } | null;
};

const W = 900;
const LEFT = 210;
const RIGHT = 20;
const ROW = 46;
const TOP = 10;

export function CompareChart({ rows }: { rows: readonly CompareRow[] }) {
  const values = rows.flatMap((r) => [
    r.exact,
    r.ideal,
    ...(r.sampled ? [...r.sampled.ci95] : []),
    ...(r.mitigated ? [...r.mitigated.ci95] : []),
  ]);
  const domain = paddedDomain(values, 0.08);
  const x = linear(domain, [LEFT, W - RIGHT]);
  const ticks = niceTicks(domain[0], domain[1], 6);
  const axisY = TOP + rows.length * ROW + 4;
  const H = axisY + 24;
  const summary = rows
    .map(
      (r) =>
        `${r.label}: exact ${r.exact}` +
        (r.sampled ? `, sampled interval ${r.sampled.ci95[0]} to ${r.sampled.ci95[1]}` : "") +
        (r.mitigated
          ? `, mitigated interval ${r.mitigated.ci95[0]} to ${r.mitigated.ci95[1]}`
          : ""),
    )
    .join("; ");
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="w-full"
      style={{ maxWidth: W }}
      role="img"
      aria-label={`Comparison: ${summary}`}
    >
      {ticks.map((t) => (
        <g key={t}>
          <line
            x1={x(t)}
            x2={x(t)}
            y1={TOP}
            y2={axisY}
            className="stroke-line"
            strokeDasharray="2 3"
          />
          <text
            x={x(t)}
            y={axisY + 16}
            textAnchor="middle"
            className="figures fill-ink-3"
            fontSize={10.5}
          >
            {tickLabel(t)}
          </text>
        </g>
      ))}
      <line x1={LEFT} x2={W - RIGHT} y1={axisY} y2={axisY} className="stroke-line-strong" />
      {rows.map((r, i) => {
        const y = TOP + i * ROW + ROW / 2;
        const noisy = Math.abs(x(r.ideal) - x(r.exact)) > 1.5;
        return (
          <g key={r.id}>
            {i % 2 === 0 ? (
              <rect x={0} y={y - ROW / 2} width={W} height={ROW} className="fill-surface-2/50" />
            ) : null}
            <text
              x={LEFT - 12}
              y={y + 4}
              textAnchor="end"
              className="fill-ink font-sans"
              fontSize={12}
              fontWeight={500}
            >
              {r.label.length > 30 ? `${r.label.slice(0, 29)}…` : r.label}
            </text>
            {noisy ? (
              <line
                x1={x(r.ideal)}
                x2={x(r.ideal)}
                y1={y - 14}
                y2={y + 14}
                className="stroke-ink-3"
                strokeWidth={1.25}
                strokeDasharray="3 2"
              />
            ) : null}
            <line
              x1={x(r.exact)}
              x2={x(r.exact)}
              y1={y - 15}
              y2={y + 15}
              className={noisy ? "stroke-noisy" : "stroke-exact"}
              strokeWidth={2}
            />
            {r.sampled ? (
              <g>
                <rect
                  x={x(r.sampled.ci95[0])}
                  y={y - (r.mitigated ? 10 : 5)}
                  width={Math.max(2, x(r.sampled.ci95[1]) - x(r.sampled.ci95[0]))}
                  height={8}
                  rx={4}
                  className="fill-sampled/20 stroke-sampled"
                  strokeWidth={1.2}
                />
                <circle
                  cx={x(r.sampled.mean)}
                  cy={y - (r.mitigated ? 6 : 1)}
                  r={3.8}
                  className="fill-sampled stroke-surface"
                  strokeWidth={1.2}
                />
              </g>
            ) : null}
            {r.mitigated ? (
              <g>
                <rect
                  x={x(r.mitigated.ci95[0])}
                  y={y + 2}
                  width={Math.max(2, x(r.mitigated.ci95[1]) - x(r.mitigated.ci95[0]))}
                  height={8}
                  rx={4}
                  className="fill-mitigated/20 stroke-mitigated"
                  strokeWidth={1.2}
                />
                <circle
                  cx={x(r.mitigated.mean)}
                  cy={y + 6}
                  r={3.8}
                  className="fill-mitigated stroke-surface"
                  strokeWidth={1.2}
                />
              </g>
            ) : null}
          </g>
        );
      })}
    </svg>
  );
}
