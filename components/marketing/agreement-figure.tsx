/**
 * The "agreement" strip: one number line with the exact value (ink line), a tolerance
 * band around it, the sampled 95 % interval (verdigris bar, mean dot) and the value a
 * noise model predicts (copper diamond with its own interval). Pure SVG, data-driven.
 * The illustration draws mean ± Z95·stdErr (the product's intervals are the run's ci95).
 */
import { formatFixed } from "@/lib/format";
import { Z95 } from "@/lib/quantum/sampling/normal";

export type AgreementFigureProps = {
  exact: number;
  sampled: { mean: number; stdErr: number };
  noisy: { mean: number; stdErr: number };
  /** Half-width of the shaded band around the exact value (e.g. 0.0016 for 1.6 mHa). */
  tolerance?: number;
  domain: [number, number];
  ticks: number[];
  className?: string;
};

/**
 * A domain wider than the given values by `pad` of their span on each side (room for
 * the lane labels beside the intervals) and ticks at a round step (1, 2 or 5 times a
 * power of ten) that give three to six labels.
 */
export function agreementAxis(
  values: number[],
  pad = 0.12,
): { domain: [number, number]; ticks: number[] } {
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const span = hi - lo || Math.abs(hi) || 1;
  const domain: [number, number] = [lo - pad * span, hi + pad * span];
  const raw = (domain[1] - domain[0]) / 5;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 5, 10].find((m) => m * power >= raw) ?? 10) * power;
  const ticks: number[] = [];
  for (let t = Math.ceil(domain[0] / step) * step; t <= domain[1]; t += step)
    ticks.push(Number(t.toFixed(12)));
  return { domain, ticks };
}

const W = 560;
const H = 132;
const L = 14;
const R = 14;

function fmt(v: number): string {
  return formatFixed(v, 2);
}

export function AgreementFigure({
  exact,
  sampled,
  noisy,
  tolerance,
  domain,
  ticks,
  className,
}: AgreementFigureProps) {
  const x = (v: number) => L + ((v - domain[0]) / (domain[1] - domain[0])) * (W - L - R);
  const z = Z95;
  const s = [sampled.mean - z * sampled.stdErr, sampled.mean + z * sampled.stdErr];
  const n = [noisy.mean - z * noisy.stdErr, noisy.mean + z * noisy.stdErr];
  const laneS = 44;
  const laneN = 80;
  const axisY = 106;
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className={className}
      role="img"
      aria-label={`Number line: the exact value ${fmt(exact)}; the sampled 95 % interval from ${formatFixed(s[0], 4)} to ${formatFixed(s[1], 4)} ${exact >= s[0] && exact <= s[1] ? "contains" : "misses"} it; the noise-model value sits near ${formatFixed(noisy.mean, 4)}, ${noisy.mean >= s[0] && noisy.mean <= s[1] ? "inside" : "outside"} that interval.`}
    >
      {tolerance ? (
        <rect
          x={x(exact - tolerance)}
          y={18}
          width={x(exact + tolerance) - x(exact - tolerance)}
          height={axisY - 22}
          className="fill-accent-soft"
          rx={2}
        />
      ) : null}
      {/* lanes */}
      <line x1={L} x2={W - R} y1={laneS} y2={laneS} className="stroke-line" strokeDasharray="2 4" />
      <line x1={L} x2={W - R} y1={laneN} y2={laneN} className="stroke-line" strokeDasharray="2 4" />
      {/* exact */}
      <line
        x1={x(exact)}
        x2={x(exact)}
        y1={14}
        y2={axisY}
        className="stroke-exact"
        strokeWidth={1.5}
      />
      <text x={x(exact) + 5} y={22} className="fill-exact figures" fontSize={10.5} fontWeight={600}>
        exact
      </text>
      {/* sampled interval */}
      <rect
        x={x(s[0])}
        y={laneS - 5}
        width={x(s[1]) - x(s[0])}
        height={10}
        rx={5}
        className="fill-sampled/20 stroke-sampled"
        strokeWidth={1.25}
      />
      <circle
        cx={x(sampled.mean)}
        cy={laneS}
        r={4.2}
        className="fill-sampled stroke-surface"
        strokeWidth={1.5}
      />
      <text
        x={x(s[0]) - 6}
        y={laneS + 3.5}
        textAnchor="end"
        className="fill-sampled figures"
        fontSize={10.5}
        fontWeight={600}
      >
        sampled 95 %
      </text>
      {/* noisy */}
      <line
        x1={x(n[0])}
        x2={x(n[1])}
        y1={laneN}
        y2={laneN}
        className="stroke-noisy"
        strokeWidth={1.5}
      />
      <line
        x1={x(n[0])}
        x2={x(n[0])}
        y1={laneN - 4}
        y2={laneN + 4}
        className="stroke-noisy"
        strokeWidth={1.5}
      />
      <line
        x1={x(n[1])}
        x2={x(n[1])}
        y1={laneN - 4}
        y2={laneN + 4}
        className="stroke-noisy"
        strokeWidth={1.5}
      />
      <rect
        x={x(noisy.mean) - 4.5}
        y={laneN - 4.5}
        width={9}
        height={9}
        transform={`rotate(45 ${x(noisy.mean)} ${laneN})`}
        className="fill-noisy stroke-surface"
        strokeWidth={1.5}
      />
      <text
        x={x(n[1]) + 7}
        y={laneN + 3.5}
        className="fill-noisy figures"
        fontSize={10.5}
        fontWeight={600}
      >
        noise model
      </text>
      {/* bias arrow between exact and noisy */}
      <path
        d={`M${x(exact) + 3} ${laneN} H${x(n[0]) - 3}`}
        className="stroke-noisy/50"
        strokeDasharray="1 3"
        strokeLinecap="round"
      />
      {/* axis */}
      <line x1={L} x2={W - R} y1={axisY} y2={axisY} className="stroke-line-strong" />
      {ticks.map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={axisY} y2={axisY + 4} className="stroke-line-strong" />
          <text
            x={x(t)}
            y={axisY + 17}
            textAnchor="middle"
            className="fill-ink-3 figures"
            fontSize={10}
          >
            {fmt(t)}
          </text>
        </g>
      ))}
    </svg>
  );
}
