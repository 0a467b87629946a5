/**
 * Bit helpers for Pauli masks and basis-state indices (index bit k = qubit k).
 * Masks are non-negative integers below 2^30 (the parser caps qubit indices at 29),
 * so 32-bit bitwise operators are safe.
 */

/** POPCOUNT16[v] = number of set bits of v, for 0 ≤ v < 2^16. */
export const POPCOUNT16: Uint8Array = (() => {
  const t = new Uint8Array(1 << 16);
  for (let v = 1; v < 1 << 16; v++) t[v] = (v & 1) + t[v >>> 1];
  return t;
})();

/** Number of set bits of a non-negative 32-bit integer (two table lookups). */
export function popcount(v: number): number {
  return POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16];
}

/** Parity (0 or 1) of the set bits of v. */
export function parity(v: number): number {
  return (POPCOUNT16[v & 0xffff] + POPCOUNT16[v >>> 16]) & 1;
}

/** Largest qubit index a Pauli word may name (masks stay positive 32-bit integers). */
export const MAX_PAULI_QUBIT_INDEX = 29;

/**
 * Bitstring of an index over n qubits, qubit 0 FIRST (leftmost):
 * index 0b011 with n = 3 is "110" (qubits 0 and 1 are 1).
 */
export function indexToBitstring(index: number, n: number): string {
  let s = "";
  for (let q = 0; q < n; q++) s += (index >>> q) & 1 ? "1" : "0";
  return s;
}

/** Inverse of {@link indexToBitstring}. */
export function bitstringToIndex(bits: string): number {
  let v = 0;
  for (let q = 0; q < bits.length; q++) if (bits[q] === "1") v |= 1 << q;
  return v >>> 0;
}
