/**
 * Shared-memory protocol between the engine thread (coordinator) and its kernel helpers.
 * One Int32Array control block per pool, one Float64Array for the gate matrix:
 * - SEQ: bumped by the coordinator for every command; helpers wait on it (Atomics.wait).
 * - DONE: helpers add 1 when their share of the command is finished; the coordinator waits.
 * - JOINED, READY: helpers join a state (see JOINED), then add 1 to READY once attached.
 * - KIND, K, Q0…: the command (apply a gate on k ≤ MAX_K qubits, apply the tiling stage in
 *   the stage buffer (stage-codec.ts) to this thread's share of its tiles, or detach).
 */
import type { MessagePort } from "node:worker_threads";

export const SEQ = 0;
export const DONE = 1;
export const READY = 2;
export const KIND = 3;
export const K = 4;
export const Q0 = 5;
export const MAX_K = 2;
/** Set to 1 by a helper whose share of a command threw (the caller then throws). */
export const ERR = Q0 + MAX_K;
/**
 * Helpers that joined the state (each adds 1 before touching it), or −1 once the caller gave
 * up waiting: a helper that arrives after that leaves the state alone.
 */
export const JOINED = ERR + 1;
export const CONTROL_INTS = JOINED + 1;
/** Interleaved 2^k × 2^k matrix, k ≤ MAX_K. */
export const MATRIX_DOUBLES = 2 * 4 ** MAX_K;

export const CMD_GATE = 1;
export const CMD_DETACH = 2;
export const CMD_STAGE = 3;
/** A job (named work with a payload, kernel-jobs.ts) posted on the helper's job port. */
export const CMD_JOB = 4;

/**
 * Message that attaches a helper to a state: its share is chunk `index` of `parts` of the
 * `dim` amplitudes (for gates) and part `index` of every stage's tiles at byte offsets reAt / imAt of `re` / `im`. A state in a kernel memory
 * also sends the memory (re = im = its buffer): the helper binds the WebAssembly kernels to it.
 */
export interface AttachMessage {
  type: "attach";
  re: SharedArrayBuffer;
  im: SharedArrayBuffer;
  reAt: number;
  imAt: number;
  dim: number;
  memory?: WebAssembly.Memory;
  control: SharedArrayBuffer;
  matrix: SharedArrayBuffer;
  /** Command buffer of tiling stages (STAGE_DOUBLES doubles). */
  stage: SharedArrayBuffer;
  /** Port on which the payloads of CMD_JOB commands arrive (read synchronously). */
  jobs: MessagePort;
  /** True for a new state: the helper writes zeros over its slice first. */
  fresh: boolean;
  /** A second state of the same size the jobs see (at byte offsets of its buffers). */
  companion?: {
    re: SharedArrayBuffer;
    im: SharedArrayBuffer;
    reAt: number;
    imAt: number;
    memory?: WebAssembly.Memory;
  };
  /** Qubits of the state (dim = 2^n). */
  n: number;
  index: number;
  parts: number;
}
