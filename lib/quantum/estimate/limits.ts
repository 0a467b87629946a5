/**
 * Size limits of an estimate request, in one dependency-free module (the zod schemas,
 * and through them client forms, import it without pulling in the engine).
 */

/** Largest total shot count of one request (per sweep point). */
export const MAX_SHOTS = 100_000_000;
/** Seeds are unsigned 32-bit integers (rng.ts). */
export const MAX_SEED = 0xffffffff;
/** Largest parameter-sweep grid (product of the value-list lengths). */
export const MAX_SWEEP_POINTS = 10_000;
/** Largest explicit list of parameter bindings (`points`). */
export const MAX_POINTS = 10_000;
/** Largest circuit source / Pauli text (characters). */
export const MAX_SOURCE_CHARS = 1_000_000;
/** Entries of a JSON term-list observable ({ format: "terms" }). */
export const MAX_OBSERVABLE_TERMS = 100_000;
/** Matrix observables: at most 8 qubits (256 × 256). */
export const MAX_MATRIX_QUBITS = 8;
/** Qubit ceilings of the methods (the kernels enforce the same numbers). */
export const MAX_STATEVECTOR_QUBITS = 26;
export const MAX_DENSITY_MATRIX_QUBITS = 12;
/** The exact spectrum (Lanczos) is computed up to this many qubits. */
export const MAX_SPECTRUM_QUBITS = 16;
