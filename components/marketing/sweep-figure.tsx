/**
 * An illustrative 1-D energy landscape: the exact curve E(θ) = a + b·cos(θ − θ₀), sampled
 * points with ±1.96σ error bars (fixed, invented offsets), and the minimum marked.
 */
const W = 520;
const H = 240;
const M = { l: 46, r: 14, t: 14, b: 34 };
const a = -0.56;
const b = -0.58;
const theta0 = 0.23;
const E = (t: number) => a + b * Math.cos(t - theta0);
const domainX: [number, number] = [-Math.PI, Math.PI];
const domainY: [number, number] = [-1.35, 0.1];
const offsets = [
  0.011, -0.007, 0.004, -0.012, 0.006, 0.002, -0.009, 0.013, -0.004, 0.008, -0.006, 0.003, -0.01,
];
const sigma = 0.0105;

const x = (t: number) => M.l + ((t - domainX[0]) / (domainX[1] - domainX[0])) * (W - M.l - M.r);
const y = (e: number) => M.t + ((domainY[1] - e) / (domainY[1] - domainY[0])) * (H - M.t - M.b);

export function SweepFigure({ className }: { className?: string }) {
  const curve = Array.from({ length: 121 }, (_, i) => {
    const t = domainX[0] + (i / 120) * (domainX[1] - domainX[0]);
    return `${i ? "L" : "M"}${x(t).toFixed(1)} ${y(E(t)).toFixed(1)}`;
  }).join(" ");
  const pts = offsets.map((o, i) => {
    const t = domainX[0] + ((i + 0.5) / offsets.length) * (domainX[1] - domainX[0]);
    return { t, e: E(t) + o };
  });
  const yTicks = [-1.2, -0.9, -0.6, -0.3, 0];
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
      aria-label="Energy against the parameter θ from −π to π: a smooth exact curve with its minimum near θ = 0.23, and thirteen sampled points with error bars lying on it."
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
            {v.toFixed(1).replace("-", "\u2212")}
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
      {pts.map((p) => (
        <g key={p.t} className="stroke-sampled">
          <line
            x1={x(p.t)}
            x2={x(p.t)}
            y1={y(p.e - 1.96 * sigma)}
            y2={y(p.e + 1.96 * sigma)}
            strokeWidth={1.3}
          />
          <circle
            cx={x(p.t)}
            cy={y(p.e)}
            r={3.2}
            className="fill-sampled stroke-surface"
            strokeWidth={1.2}
          />
        </g>
      ))}
      <line
        x1={x(theta0)}
        x2={x(theta0)}
        y1={y(E(theta0)) + 6}
        y2={H - M.b}
        className="stroke-accent"
        strokeDasharray="3 3"
      />
      <circle
        cx={x(theta0)}
        cy={y(E(theta0))}
        r={5}
        fill="none"
        className="stroke-accent"
        strokeWidth={1.6}
      />
      <text
        x={x(theta0) + 9}
        y={y(E(theta0)) + 16}
        className="fill-accent-ink figures"
        fontSize={10.5}
        fontWeight={600}
      >
        min −1.140 at θ = 0.23
      </text>
    </svg>
  );
}
