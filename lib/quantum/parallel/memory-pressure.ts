/**
 * Shared memory and the garbage collector. A SharedArrayBuffer or a shared WebAssembly.Memory
 * is freed only when its small owner object is collected, and the JavaScript engine does not
 * count its bytes as memory pressure: a loop of runs that allocates little else keeps every
 * dead state alive (measured: 40 density matrices of 11 qubits, 64 MiB each, one after the
 * other, held 2.6 GiB resident). Every shared allocation of at least NOTE_BYTES is followed
 * by one throwaway ArrayBuffer of NUDGE_BYTES — counted as external memory, its pages never
 * touched, so it costs no resident memory — which pushes the engine's marking on (the same
 * loop: 0.5 GiB; a nudge per 256 MiB allocated only started marking, which finished too late:
 * 2 GiB). Smaller states are left to the ordinary collections their runs' garbage triggers:
 * nudging for them too cost the 16-qubit gradient bench 15–20 %.
 */
export const NOTE_BYTES = 16 * 2 ** 20;
export const NUDGE_BYTES = 256 * 2 ** 20;

/** Byte length of the last throwaway buffer (kept so the allocation is observable). */
let lastNudge = 0;

/** Notes `bytes` of shared memory just allocated; nudges the collector for large ones. */
export function noteSharedAllocation(bytes: number): void {
  if (bytes < NOTE_BYTES) return;
  lastNudge = new ArrayBuffer(NUDGE_BYTES).byteLength;
}

/** How many bytes the last nudge reported (tests). */
export const lastNudgeBytes = (): number => lastNudge;
