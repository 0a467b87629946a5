/**
 * Pure helpers of the sweep charts: the grid shape of a 2-D sweep (the engine's order:
 * the first parameter varies slowest, row-major — lib/quantum/estimate/sweep-grid.ts),
 * the minimum point, and a sequential colour ramp in OKLCH.
 */
export type SweepPoint = {
  params: Record<string, number>;
  ideal: number;
  exact: number;
  sampled: { mean: number; stdErr: number; ci95?: readonly [number, number]; shots: number } | null;
};

export type SweepMetric = "exact" | "ideal" | "sampled";

export function metricOf(p: SweepPoint, m: SweepMetric): number | null {
  if (m === "sampled") return p.sampled ? p.sampled.mean : null;
  return p[m];
}

/** Index of the smallest finite value (first one on ties), or -1. */
export function argMin(values: readonly (number | null)[]): number {
  let best = -1;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v === null || !Number.isFinite(v)) continue;
    if (best < 0 || v < (values[best] as number)) best = i;
  }
  return best;
}

/** Distinct values of each axis in grid order, and the cell (row, col) of every point. */
export function gridShape(points: readonly SweepPoint[], names: readonly [string, string]) {
  const distinct = (name: string) => {
    const seen: number[] = [];
    for (const p of points) if (!seen.includes(p.params[name])) seen.push(p.params[name]);
    return seen;
  };
  const rows = distinct(names[0]);
  const cols = distinct(names[1]);
  const cells = points.map((p) => ({
    row: rows.indexOf(p.params[names[0]]),
    col: cols.indexOf(p.params[names[1]]),
  }));
  return { rows, cols, cells };
}

/**
 * Colour of t ∈ [0, 1] on Ketwise's landscape ramp: deep verdigris (low values, the
 * interesting minima) through pale mid-tones to copper (high values). OKLCH keeps the
 * lightness steps perceptually even.
 */
export function rampColor(t: number): string {
  const u = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  const stops = [
    [0.34, 0.075, 205],
    [0.6, 0.09, 190],
    [0.86, 0.05, 120],
    [0.8, 0.11, 70],
    [0.62, 0.15, 45],
  ];
  const x = u * (stops.length - 1);
  const i = Math.min(stops.length - 2, Math.floor(x));
  const f = x - i;
  const [l, c, h] = stops[i].map((v, k) => v + (stops[i + 1][k] - v) * f);
  return `oklch(${l.toFixed(3)} ${c.toFixed(3)} ${h.toFixed(1)})`;
}
