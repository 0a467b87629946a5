/**
 * How many engine threads a run uses. `KETWISE_ENGINE_THREADS` overrides the default
 * (1 = the single-thread path; values are rounded down to a power of two, at most 16);
 * the default is the largest power of two ≤ the machine's cores, divided by the worker's
 * run concurrency when the caller passes it (runs × threads ≤ cores). States below
 * PARALLEL_MIN_QUBITS stay on one thread (synchronising per gate costs more than it saves).
 */
import { availableParallelism } from "node:os";
import { MAX_SLOTS } from "../wasm/runtime";

/** Measured crossover (npm run bench, threads rows): below 2^16 amplitudes one thread wins. */
export const PARALLEL_MIN_QUBITS = 16;

const pow2Floor = (x: number): number => (x < 1 ? 1 : 2 ** Math.floor(Math.log2(x)));

/**
 * Whether states are allocated in WebAssembly kernel memories (SIMD kernels). On unless
 * `KETWISE_ENGINE_WASM=0`, which keeps every state in plain arrays (the JavaScript kernels,
 * the reference path).
 */
export function engineWasm(): boolean {
  return process.env.KETWISE_ENGINE_WASM?.trim() !== "0";
}

export function engineThreads(concurrentRuns = 1): number {
  const raw = process.env.KETWISE_ENGINE_THREADS;
  if (raw !== undefined && raw.trim() !== "") {
    const v = Number(raw);
    if (Number.isInteger(v) && v >= 1) return Math.min(16, pow2Floor(v));
  }
  return Math.min(16, pow2Floor(availableParallelism() / Math.max(1, concurrentRuns)));
}

/** Threads for an n-qubit state: 1 below the crossover, and never more than 2^(n−1) slices. */
export function threadsFor(n: number, requested: number): number {
  if (n < PARALLEL_MIN_QUBITS || requested <= 1) return 1;
  // at most MAX_SLOTS threads: each has a scratch slot and a Pauli area in a kernel memory's head
  return Math.min(pow2Floor(requested), 2 ** (n - 1), MAX_SLOTS);
}
