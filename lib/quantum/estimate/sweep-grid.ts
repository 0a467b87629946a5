/**
 * Parameter points of a run. A sweep's grid is the Cartesian product of the listed values, the first
 * named parameter varying slowest (row-major); each point is `parameters` overridden by
 * the point's values. Point k samples with seed pointSeed(seed, k): the run's seed for
 * k = 0, else the murmur3 32-bit finaliser of seed + k·0x9E3779B9 (reproducible).
 */
import { EngineError } from "../errors";

export interface SweepGrid {
  /** "single" (one point from `parameters`), "grid" (`sweep`) or "points" (`points`). */
  kind: "single" | "grid" | "points";
  names: string[];
  points: Record<string, number>[];
}

/** The run's parameter points: the sweep grid, the explicit list, or the single point. */
export function parameterPoints(
  parameters: Record<string, number>,
  sweep: Record<string, number[]> | null,
  list: Record<string, number>[] | null,
  inputs: readonly { name: string }[],
): SweepGrid {
  return list ? pointList(parameters, list, inputs) : sweepGrid(parameters, sweep, inputs);
}

/**
 * An explicit list of bindings: point i is `parameters` overridden by `points[i]`. Every
 * point must name only declared inputs and, with `parameters`, give all of them a finite
 * value — checked here for every point, so a bad point is refused at submission with its
 * path (e.g. points.3.theta). `names` lists the inputs the points set, in declaration order.
 */
export function pointList(
  parameters: Record<string, number>,
  list: Record<string, number>[],
  inputs: readonly { name: string }[],
): SweepGrid {
  const declared = inputs.map((i) => i.name);
  const set = new Set<string>();
  const points = list.map((point, k) => {
    for (const [name, value] of Object.entries(point)) {
      if (!declared.includes(name)) {
        const list = declared.length
          ? `the circuit declares: ${declared.join(", ")}`
          : "the circuit declares no inputs";
        const message = `points[${k}] sets '${name}', which is not an input of the circuit (${list})`;
        throw new EngineError("invalid_request", message, [{ path: ["points", k, name], message }]);
      }
      if (typeof value !== "number" || !Number.isFinite(value)) {
        const message = `points[${k}].${name} must be a finite number, got ${String(value)}`;
        throw new EngineError("invalid_request", message, [{ path: ["points", k, name], message }]);
      }
      set.add(name);
    }
    for (const name of declared) {
      if (!Object.hasOwn(point, name) && !Object.hasOwn(parameters, name)) {
        const message = `points[${k}] has no value for input '${name}' (give it in the point or in parameters)`;
        throw new EngineError("invalid_request", message, [{ path: ["points", k, name], message }]);
      }
    }
    return { ...parameters, ...point };
  });
  return { kind: "points", names: declared.filter((n) => set.has(n)), points };
}

export function sweepGrid(
  parameters: Record<string, number>,
  sweep: Record<string, number[]> | null,
  inputs: readonly { name: string }[],
): SweepGrid {
  if (!sweep) return { kind: "single", names: [], points: [{ ...parameters }] };
  const declared = inputs.map((i) => i.name);
  const names = Object.keys(sweep);
  for (const name of names) {
    if (!declared.includes(name)) {
      const list = declared.length
        ? `the circuit declares: ${declared.join(", ")}`
        : "the circuit declares no inputs";
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
  return { kind: "grid", names, points };
}

export function pointSeed(seed: number, k: number): number {
  if (k === 0) return seed >>> 0;
  let z = (seed + Math.imul(k, 0x9e3779b9)) >>> 0;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
  return (z ^ (z >>> 16)) >>> 0;
}
