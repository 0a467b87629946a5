/**
 * Small scale helpers for the hand-drawn SVG charts (agreement line, heat map, compare).
 *
 * `niceTicks` picks a step of 1, 2 or 5 × 10ᵏ so that about `count` ticks cover the
 * domain (the common "nice numbers" practice of chart axes); `paddedDomain` widens the
 * extent of the values by a fraction on each side and never returns a zero-width range
 * (a single value gets a ±2 % window, at least ±0.001).
 */
import { formatSignificant, withMinus } from "@/lib/format";

export function paddedDomain(values: readonly number[], pad = 0.12): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (!finite.length) return [-1, 1];
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  const mid = (lo + hi) / 2;
  // A single point (e.g. an eigenstate: every shot alike) gets a ±2 % window (at least ±0.001).
  const degenerate = hi - lo <= 1e-12 * Math.max(1, Math.abs(mid));
  const half = degenerate ? Math.max(Math.abs(mid) * 0.02, 1e-3) : (hi - lo) / 2;
  lo = mid - half * (1 + 2 * pad);
  hi = mid + half * (1 + 2 * pad);
  return [lo, hi];
}

export function niceStep(span: number, count: number): number {
  const raw = span / Math.max(1, count);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const r = raw / mag;
  const m = r <= 1 ? 1 : r <= 2 ? 2 : r <= 5 ? 5 : 10;
  return m * mag;
}

/** Ticks inside [lo, hi] on a nice step; values are rounded to the step's decimals. */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  if (!(hi > lo)) return [lo];
  const step = niceStep(hi - lo, count);
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  const first = Math.ceil(lo / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = first; v <= hi + step * 1e-9; v += step) ticks.push(Number(v.toFixed(decimals)));
  return ticks;
}

/** Linear map of [d0, d1] onto [r0, r1]. */
export function linear(domain: readonly [number, number], range: readonly [number, number]) {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  return (v: number) => r0 + (v - d0) * k;
}

/** Short tick label: up to 4 significant digits, U+2212 minus. */
export function tickLabel(v: number): string {
  if (v === 0) return "0";
  return Math.abs(v) >= 1e4 || Math.abs(v) < 1e-3
    ? withMinus(v.toExponential(1))
    : formatSignificant(v, 4);
}

/** Ticks of a log axis within [lo, hi]: 1, 2 and 5 × 10ᵏ (only powers of ten when that gives ≥ 3). */
export function logTicks(lo: number, hi: number): number[] {
  if (!(lo > 0) || !(hi >= lo)) return [];
  const out: number[] = [];
  const powers: number[] = [];
  for (let k = Math.floor(Math.log10(lo)); k <= Math.ceil(Math.log10(hi)); k++) {
    const p = 10 ** k;
    if (p >= lo && p <= hi) powers.push(p);
    for (const m of [1, 2, 5]) if (m * p >= lo && m * p <= hi) out.push(m * p);
  }
  return powers.length >= 3 ? powers : out;
}
