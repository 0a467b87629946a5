/**
 * The agreement number line of a run: the exact value as an ink rule across every lane,
 * the noiseless ideal as a dashed rule when noise moves the exact value, and one lane
 * per sampled estimate with its 95 % interval as a bar and the mean as a dot. Pure SVG,
 * scaled to its container's width.
 */
import { linear, niceTicks, paddedDomain, tickLabel } from "./scale";

export type AgreementLane = {
  label: string;
  mean: number;
  ci95: readonly [number, number];
  tone: "sampled" | "mitigated";
};

const W = 900;
const LEFT = 96;
const RIGHT = 18;
const LANE = 34;
const TOP = 26;

const toneClass = {
  sampled: { bar: "fill-sampled/20 stroke-sampled", dot: "fill-sampled", text: "fill-sampled" },
  mitigated: {
    bar: "fill-mitigated/20 stroke-mitigated",
    dot: "fill-mitigated",
    text: "fill-mitigated",
  },
};

export function AgreementLine({
  exact,
  ideal,
  lanes,
  className,
}: {
  exact: number;
  /** Noiseless value, drawn when it differs visibly from `exact`. */
  ideal?: number | null;
  lanes: AgreementLane[];
  className?: string;
}) {
  const values = [
    exact,
    ...(ideal !== null && ideal !== undefined ? [ideal] : []),
    ...lanes.flatMap((l) => [l.ci95[0], l.ci95[1], l.mean]),
  ];
  const domain = paddedDomain(values, 0.1);
  const x = linear(domain, [LEFT, W - RIGHT]);
  const ticks = niceTicks(domain[0], domain[1], 5);
  const laneCount = Math.max(1, lanes.length);
  const axisY = TOP + laneCount * LANE + 6;
  const H = axisY + 24;
  const showIdeal = ideal !== null && ideal !== undefined && Math.abs(x(ideal) - x(exact)) > 1.5;
  const describe =
    `Number line from ${tickLabel(domain[0])} to ${tickLabel(domain[1])}: exact value ${exact}` +
    (showIdeal ? `, noiseless ideal ${ideal}` : "") +
    lanes
      .map((l) => `; ${l.label} 95 % interval ${l.ci95[0]} to ${l.ci95[1]}, mean ${l.mean}`)
      .join("");

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className={className}
      role="img"
      aria-label={describe}
      preserveAspectRatio="xMinYMid meet"
      style={{ maxWidth: W }}
    >
      {ticks.map((t) => (
        <g key={t}>
          <line
            x1={x(t)}
            x2={x(t)}
            y1={TOP - 8}
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
      {showIdeal ? (
        <g>
          <line
            x1={x(ideal!)}
            x2={x(ideal!)}
            y1={TOP - 12}
            y2={axisY}
            className="stroke-ink-3"
            strokeWidth={1.25}
            strokeDasharray="4 3"
          />
          <text
            x={x(ideal!)}
            y={TOP - 15}
            textAnchor="middle"
            className="fill-ink-3 font-sans"
            fontSize={10.5}
            fontWeight={600}
          >
            ideal
          </text>
        </g>
      ) : null}
      <line
        x1={x(exact)}
        x2={x(exact)}
        y1={TOP - 12}
        y2={axisY}
        className="stroke-exact"
        strokeWidth={1.75}
      />
      <text
        x={x(exact)}
        y={TOP - 15}
        textAnchor={showIdeal && x(ideal!) > x(exact) ? "end" : showIdeal ? "start" : "middle"}
        dx={showIdeal ? (x(ideal!) > x(exact) ? -3 : 3) : 0}
        className="fill-exact font-sans"
        fontSize={10.5}
        fontWeight={700}
      >
        exact
      </text>
      {lanes.map((l, i) => {
        const y = TOP + i * LANE + LANE / 2;
        const c = toneClass[l.tone];
        const x0 = x(l.ci95[0]);
        const x1 = x(l.ci95[1]);
        return (
          <g key={l.label}>
            <text
              x={LEFT - 10}
              y={y + 3.5}
              textAnchor="end"
              className={`${c.text} font-sans`}
              fontSize={11}
              fontWeight={600}
            >
              {l.label}
            </text>
            <rect
              x={x0}
              y={y - 6}
              width={Math.max(2, x1 - x0)}
              height={12}
              rx={6}
              className={c.bar}
              strokeWidth={1.25}
            />
            <circle
              cx={x(l.mean)}
              cy={y}
              r={4.5}
              className={`${c.dot} stroke-surface`}
              strokeWidth={1.5}
            />
          </g>
        );
      })}
    </svg>
  );
}
