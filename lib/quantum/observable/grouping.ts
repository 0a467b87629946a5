/**
 * Measurement settings: terms that commute qubit-wise (on every qubit both words
 * have the same letter or one has I) are measured together in one setting.
 *
 * Greedy colouring (documented, deterministic): non-identity terms sorted by
 * descending |coefficient| (ties: original order); each goes into the FIRST
 * existing setting it is compatible with, else opens a new setting. Settings keep
 * their creation order; terms inside a setting are listed in original order.
 * The identity term needs no measurement and belongs to no setting.
 */
import type { PauliSum } from "../types";
import { masksToWord } from "./pauli-word";

export interface MeasurementSetting {
  /** One letter per qubit, qubit 0 first: X, Y, Z, or I for an unmeasured qubit. */
  bases: string;
  xMask: number;
  zMask: number;
  /** Indices into `sum.terms`. */
  terms: number[];
}

export function groupQubitWise(sum: PauliSum): MeasurementSetting[] {
  const order = sum.terms
    .map((t, i) => i)
    .filter((i) => sum.terms[i].xMask !== 0 || sum.terms[i].zMask !== 0)
    .sort(
      (a, b) => Math.abs(sum.terms[b].coefficient) - Math.abs(sum.terms[a].coefficient) || a - b,
    );
  const groups: { x: number; z: number; s: number; terms: number[] }[] = [];
  for (const i of order) {
    const { xMask: tx, zMask: tz } = sum.terms[i];
    const ts = tx | tz;
    let g = groups.find((grp) => (((tx ^ grp.x) | (tz ^ grp.z)) & ts & grp.s) === 0);
    if (!g) {
      g = { x: 0, z: 0, s: 0, terms: [] };
      groups.push(g);
    }
    g.x |= tx;
    g.z |= tz;
    g.s |= ts;
    g.terms.push(i);
  }
  return groups.map((g) => ({
    bases: masksToWord(g.x, g.z, sum.numQubits),
    xMask: g.x,
    zMask: g.z,
    terms: g.terms.sort((a, b) => a - b),
  }));
}
