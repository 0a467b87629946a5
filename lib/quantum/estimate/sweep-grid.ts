/**
 * Parameter sweeps: the grid is the Cartesian product of the listed values, the first
 * named parameter varying slowest (row-major); each point is `parameters` overridden by
 * the point's values. Point k samples with seed pointSeed(seed, k): the run's seed for
 * k = 0, else the murmur3 32-bit finaliser of seed + k·0x9E3779B9 (reproducible).
 */
import { EngineError } from "../errors";

export interface SweepGrid {
  names: string[];
  points: Record<string, number>[];
}

export function sweepGrid(parameters: Record<string, number>, sweep: Record<string, number[]> | null, inputs: readonly { name: string }[]): SweepGrid {
  if (!sweep) return { names: [], points: [{ ...parameters }] };
  const declared = inputs.map((i) => i.name);
  const names = Object.keys(sweep);
  for (const name of names) {
    if (!declared.includes(name)) {
      const list = declared.length ? `the circuit declares: ${declared.join(", ")}` : "the circuit declares no inputs";
      const message = `cannot sweep '${name}': it is not an input of the circuit (${list})`;
      throw new EngineError("invalid_request", message, [{ path: ["sweep", name], message }]);
    }
  }
  const points: Record<string, number>[] = [];
  const total = names.reduce((a, n) => a * sweep[n].length, 1);
  for (let k = 0; k < total; k++) {
    const p = { ...parameters };
    let rest = k;
    for (let j = names.length - 1; j >= 0; j--) {
      const values = sweep[names[j]];
      p[names[j]] = values[rest % values.length];
      rest = Math.floor(rest / values.length);
    }
    points.push(p);
  }
  return { names, points };
}

export function pointSeed(seed: number, k: number): number {
  if (k === 0) return seed >>> 0;
  let z = (seed + Math.imul(k, 0x9e3779b9)) >>> 0;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
  return (z ^ (z >>> 16)) >>> 0;
}
