/**
 * Shared memory and the garbage collector. A SharedArrayBuffer or a shared WebAssembly.Memory
 * is freed only when its small owner object is collected, and the JavaScript engine does not
 * count its bytes as memory pressure: a loop of runs that allocates little else keeps every
 * dead state alive (measured: 40 density matrices of 11 qubits, 64 MiB each, one after the
 * other, held 2.6 GiB resident). Every shared allocation is noted here; after NOTE_BYTES
 * of them one throwaway ArrayBuffer of NUDGE_BYTES — counted as external memory, its pages
 * never touched, so it costs no resident memory — pushes the engine's marking on; a nudge
 * per 16 MiB allocated keeps the loop at 0.4 GiB (a nudge per 256 MiB only started marking,
 * which then finished too late to help: 2 GiB).
 */
export const NOTE_BYTES = 16 * 2 ** 20;
export const NUDGE_BYTES = 256 * 2 ** 20;

let sinceNudge = 0;
/** Byte length of the last throwaway buffer (kept so the allocation is observable). */
let lastNudge = 0;

/** Notes `bytes` of shared memory just allocated; nudges the collector every NOTE_BYTES. */
export function noteSharedAllocation(bytes: number): void {
  sinceNudge += bytes;
  if (sinceNudge < NOTE_BYTES) return;
  sinceNudge = 0;
  lastNudge = new ArrayBuffer(NUDGE_BYTES).byteLength;
}

/** How many bytes the last nudge reported (tests). */
export const lastNudgeBytes = (): number => lastNudge;
