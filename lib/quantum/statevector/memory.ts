/**
 * Memory guards. A statevector of n qubits holds 2^n complex amplitudes as two Float64Arrays:
 * 16·2^n bytes. A density matrix holds 4^n complex entries: 16·4^n bytes.
 */
import { EngineError } from "../errors";
import { formatBytes as formatSize } from "../../format/units";

/** Default qubit ceiling of the statevector method (1 GiB of amplitudes). */
export const MAX_STATEVECTOR_QUBITS = 26;
/** Default qubit ceiling of the density-matrix method (256 MiB of entries). */
export const MAX_DENSITY_QUBITS = 12;

export interface MemoryLimits {
  /** Qubit ceiling (default: the method's ceiling above). */
  maxQubits?: number;
  /** Byte ceiling for the state itself (default: none beyond maxQubits). */
  maxBytes?: number;
}

/** Bytes of an n-qubit statevector: 2^n amplitudes × (8 B real + 8 B imaginary). */
export function statevectorBytes(n: number): number {
  return 16 * 2 ** n;
}

/** Bytes of an n-qubit density matrix: 4^n entries × 16 B. */
export function densityMatrixBytes(n: number): number {
  return 16 * 4 ** n;
}

/** Binary-prefixed size with one decimal for GiB/TiB ("4.0 GiB", "256 MiB", "512 B"). */
export function formatBytes(bytes: number): string {
  return formatSize(bytes, { binary: true });
}

function assertFits(
  kind: string,
  n: number,
  bytes: number,
  defaultMax: number,
  limits: MemoryLimits,
): void {
  const maxQubits = limits.maxQubits ?? defaultMax;
  const need = `a ${n}-qubit ${kind} needs ${formatBytes(bytes)}`;
  if (n > maxQubits) {
    throw new EngineError("too_large", `${need}; the limit is ${maxQubits} qubits`, [
      {
        path: ["circuit", "source"],
        message: `${n} qubits exceed the ${kind} limit of ${maxQubits}`,
      },
    ]);
  }
  if (limits.maxBytes !== undefined && bytes > limits.maxBytes) {
    throw new EngineError("too_large", `${need}; the limit is ${formatBytes(limits.maxBytes)}`, [
      { path: ["circuit", "source"], message: `${formatBytes(bytes)} exceed the memory limit` },
    ]);
  }
}

/** Throws EngineError("too_large") stating the memory an n-qubit statevector run needs. */
export function assertStatevectorFits(n: number, limits: MemoryLimits = {}): void {
  assertFits("statevector", n, statevectorBytes(n), MAX_STATEVECTOR_QUBITS, limits);
}

/** Throws EngineError("too_large") stating the memory an n-qubit density matrix needs. */
export function assertDensityMatrixFits(n: number, limits: MemoryLimits = {}): void {
  assertFits("density matrix", n, densityMatrixBytes(n), MAX_DENSITY_QUBITS, limits);
}
