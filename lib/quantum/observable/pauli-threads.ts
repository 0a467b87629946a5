/**
 * The Pauli-sum expectation on engine threads: the flip-mask groups are dealt to the threads
 * (each group whole to one thread, so every term is computed by exactly the code and order of
 * the single-thread pass: results are bit-identical), balanced by their cost in passes over
 * the state. Every thread reads the whole (shared) state and writes its terms' values into a
 * shared output array.
 */
import type { MaskTerm } from "./pauli-mask-pass";
import { pairKey, pairable } from "../wasm/pauli";

/** One flip mask and its terms. */
export type MaskGroup = [x: number, terms: MaskTerm[]];

export interface PauliJob {
  groups: MaskGroup[];
  out: SharedArrayBuffer;
  lowBits: number;
}

/** Passes over the state a group costs (four terms share a SIMD pass; many share transforms). */
export function groupCost(terms: readonly MaskTerm[], transformAbove: number): number {
  return terms.length > transformAbove ? 4 : Math.ceil(terms.length / 4);
}

/**
 * Deals the groups to `parts` threads: groups that go through Walsh–Hadamard transforms (more
 * than `transformAbove` terms; each allocates one or two state-sized arrays) all to thread 0,
 * so the threads never hold several of those at once; then the others, largest cost first,
 * each to the least-loaded thread (ties to the lowest index) — two single terms that can share
 * a pass (pairKey) as one unit, so the thread that gets them pairs them. Every thread keeps
 * the groups in their original order.
 */
export function dealGroups(
  groups: readonly MaskGroup[],
  parts: number,
  transformAbove: number,
): MaskGroup[][] {
  const load = new Array<number>(parts).fill(0);
  const owner = new Array<number>(groups.length);
  const units: { members: number[]; cost: number }[] = [];
  const waiting = new Map<number, number>();
  groups.forEach(([x, terms], i) => {
    if (terms.length > transformAbove) {
      owner[i] = 0;
      load[0] += groupCost(terms, transformAbove);
    } else if (terms.length === 1 && pairable(x)) {
      const other = waiting.get(pairKey(x));
      if (other === undefined) waiting.set(pairKey(x), i);
      else {
        waiting.delete(pairKey(x));
        units.push({ members: [other, i], cost: 1.5 }); // three half-state reads for two terms
      }
    } else units.push({ members: [i], cost: groupCost(terms, transformAbove) });
  });
  for (const i of waiting.values()) units.push({ members: [i], cost: 1 });
  units.sort((a, b) => b.cost - a.cost || a.members[0] - b.members[0]);
  for (const { members, cost } of units) {
    let best = 0;
    for (let p = 1; p < parts; p++) if (load[p] < load[best]) best = p;
    for (const i of members) owner[i] = best;
    load[best] += cost;
  }
  const out: MaskGroup[][] = Array.from({ length: parts }, () => []);
  groups.forEach((g, i) => out[owner[i]].push(g));
  return out;
}
