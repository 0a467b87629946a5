/**
 * Pauli words as bit masks (types.ts `PauliTerm`): qubit k carries
 * I (x=0,z=0), X (x=1,z=0), Z (x=0,z=1) or Y (x=1,z=1), where bit k of
 * `xMask`/`zMask` is qubit k. Dense words read qubit 0 first (leftmost letter).
 */
import { EngineError } from "../errors";
import type { PauliSum, PauliTerm } from "../types";
import { plural } from "../../format/plural";

export type PauliLetter = "I" | "X" | "Y" | "Z";

/** The letter of `term` on qubit q. */
export function letterAt(xMask: number, zMask: number, q: number): PauliLetter {
  const x = (xMask >>> q) & 1;
  const z = (zMask >>> q) & 1;
  return x ? (z ? "Y" : "X") : z ? "Z" : "I";
}

/** Dense word over n qubits, qubit 0 first. */
export function masksToWord(xMask: number, zMask: number, n: number): string {
  let w = "";
  for (let q = 0; q < n; q++) w += letterAt(xMask, zMask, q);
  return w;
}

/** Sets qubit q of the masks to `letter`. */
export function setLetter(masks: { x: number; z: number }, q: number, letter: PauliLetter): void {
  const bit = 1 << q;
  if (letter === "X" || letter === "Y") masks.x |= bit;
  if (letter === "Z" || letter === "Y") masks.z |= bit;
}

/** Sparse label such as "X0 Y3 Z12"; "I" for the identity. */
export function sparseLabel(xMask: number, zMask: number): string {
  const parts: string[] = [];
  const support = (xMask | zMask) >>> 0;
  for (let q = 0; q < 31; q++) if ((support >>> q) & 1) parts.push(letterAt(xMask, zMask, q) + q);
  return parts.length ? parts.join(" ") : "I";
}

export function isIdentity(t: Pick<PauliTerm, "xMask" | "zMask">): boolean {
  return t.xMask === 0 && t.zMask === 0;
}

/** Index of the highest qubit a term acts on non-trivially (−1 for the identity). */
export function highestQubit(t: Pick<PauliTerm, "xMask" | "zMask">): number {
  const s = (t.xMask | t.zMask) >>> 0;
  return s === 0 ? -1 : 31 - Math.clz32(s);
}

/**
 * The same sum over `n` qubits (words padded with I on the right, i.e. on the
 * higher qubits). Throws `observable_invalid` when the sum names a qubit ≥ n.
 */
export function padPauliSum(sum: PauliSum, n: number): PauliSum {
  if (sum.numQubits > n) {
    const highest = Math.max(-1, ...sum.terms.map(highestQubit));
    const named = highest >= n ? highest : sum.numQubits - 1;
    const message = `observable acts on qubit ${named} but the circuit has ${plural(n, "qubit")}`;
    throw new EngineError("observable_invalid", message, [
      { path: ["observable", "terms"], message },
    ]);
  }
  return {
    numQubits: n,
    terms: sum.terms.map((t) => ({ ...t, word: masksToWord(t.xMask, t.zMask, n) })),
  };
}
