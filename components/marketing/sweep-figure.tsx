/**
 * The invented three-spin cluster's landscape along its one-parameter ansatz: the exact
 * curve E(θ) on a fine grid, thirteen sampled points with ±1.96σ error bars and the
 * minimum of the grid marked. Every number is the engine's (lib/examples).
 */
import figures from "@/lib/examples/example-figures.json";
import { Z95 } from "@/lib/quantum/sampling/normal";
import { agreementAxis } from "./agreement-figure";
import { formatFixed, plural, withMinus } from "@/lib/format";

const W = 520;
const H = 240;
const M = { l: 46, r: 14, t: 14, b: 34 };
const domainX: [number, number] = [-Math.PI, Math.PI];
const best = figures.curve.reduce((a, p) => (p.exact < a.exact ? p : a));
const yAxis = agreementAxis([
  ...figures.curve.map((p) => p.exact),
  ...figures.points.flatMap((p) => [p.mean - Z95 * p.stdErr, p.mean + Z95 * p.stdErr]),
]);
const domainY = yAxis.domain;

const x = (t: number) => M.l + ((t - domainX[0]) / (domainX[1] - domainX[0])) * (W - M.l - M.r);
const y = (e: number) => M.t + ((domainY[1] - e) / (domainY[1] - domainY[0])) * (H - M.t - M.b);

export function SweepFigure({ className }: { className?: string }) {
  const curve = figures.curve
    .map((p, i) => `${i ? "L" : "M"}${x(p.theta).toFixed(1)} ${y(p.exact).toFixed(1)}`)
    .join(" ");
  const yTicks = yAxis.ticks;
  const xTicks = [
    { v: -Math.PI, l: "−π" },
    { v: -Math.PI / 2, l: "−π/2" },
    { v: 0, l: "0" },
    { v: Math.PI / 2, l: "π/2" },
    { v: Math.PI, l: "π" },
  ];
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className={className}
      role="img"
      aria-label={`Energy against the parameter θ from −π to π: a smooth exact curve with its minimum near θ = ${formatFixed(best.theta, 2)}, and ${plural(figures.points.length, "sampled point")} with error bars lying on it.`}
    >
      {yTicks.map((v) => (
        <g key={v}>
          <line
            x1={M.l}
            x2={W - M.r}
            y1={y(v)}
            y2={y(v)}
            className="stroke-line"
            strokeDasharray={v === 0 ? undefined : "2 4"}
          />
          <text
            x={M.l - 8}
            y={y(v) + 3.5}
            textAnchor="end"
            className="fill-ink-3 figures"
            fontSize={10}
          >
            {withMinus(String(v))}
          </text>
        </g>
      ))}
      {xTicks.map((t) => (
        <text
          key={t.l}
          x={x(t.v)}
          y={H - M.b + 18}
          textAnchor="middle"
          className="fill-ink-3 figures"
          fontSize={10}
        >
          {t.l}
        </text>
      ))}
      <text x={W - M.r} y={H - 4} textAnchor="end" className="fill-ink-3" fontSize={10.5}>
        θ (rad)
      </text>
      <path d={curve} fill="none" className="stroke-exact" strokeWidth={1.6} />
      {figures.points.map((p) => (
        <g key={p.theta} className="stroke-sampled">
          <line
            x1={x(p.theta)}
            x2={x(p.theta)}
            y1={y(p.mean - Z95 * p.stdErr)}
            y2={y(p.mean + Z95 * p.stdErr)}
            strokeWidth={1.3}
          />
          <circle
            cx={x(p.theta)}
            cy={y(p.mean)}
            r={3.2}
            className="fill-sampled stroke-surface"
            strokeWidth={1.2}
          />
        </g>
      ))}
      <line
        x1={x(best.theta)}
        x2={x(best.theta)}
        y1={y(best.exact) + 6}
        y2={H - M.b}
        className="stroke-accent"
        strokeDasharray="3 3"
      />
      <circle
        cx={x(best.theta)}
        cy={y(best.exact)}
        r={5}
        fill="none"
        className="stroke-accent"
        strokeWidth={1.6}
      />
      <text
        x={x(best.theta) + 9}
        y={y(best.exact) + 16}
        className="fill-accent-ink figures"
        fontSize={10.5}
        fontWeight={600}
      >
        min {formatFixed(best.exact, 3)} at θ = {formatFixed(best.theta, 2)}
      </text>
    </svg>
  );
}
