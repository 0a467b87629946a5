/**
 * A kernel helper thread: attached to a shared state, it applies every gate command to its
 * chunk of the amplitudes (a contiguous slice: the gate's qubits lie below the split bits,
 * so the slice is a complete sub-state for it) until told to detach. Pure computation on
 * shared memory; no I/O.
 */
import { parentPort } from "node:worker_threads";
import { applyToAmplitudes } from "../statevector/dispatch";
import { bindMemory } from "../wasm/runtime";
import {
  type AttachMessage,
  CMD_DETACH,
  CMD_GATE,
  DONE,
  K,
  KIND,
  Q0,
  READY,
  SEQ,
} from "./protocol";

const port = parentPort;
if (!port) throw new Error("kernel-helper.ts must run in a worker thread");

function serve(m: AttachMessage): void {
  const ctrl = new Int32Array(m.control);
  const mat = new Float64Array(m.matrix);
  const len = m.dim / m.parts;
  if (m.memory) bindMemory(m.memory, m.index); // else (no SIMD here) the JavaScript kernels run
  const re = new Float64Array(m.re, m.reAt + m.index * len * 8, len);
  const im = new Float64Array(m.im, m.imAt + m.index * len * 8, len);
  let seen = Atomics.load(ctrl, SEQ);
  Atomics.add(ctrl, READY, 1);
  Atomics.notify(ctrl, READY);
  for (;;) {
    Atomics.wait(ctrl, SEQ, seen);
    seen = Atomics.load(ctrl, SEQ);
    const kind = Atomics.load(ctrl, KIND);
    if (kind === CMD_GATE) {
      const k = ctrl[K];
      const qubits = Array.from({ length: k }, (_, j) => ctrl[Q0 + j]);
      applyToAmplitudes(re, im, qubits, mat.subarray(0, 2 * 4 ** k));
    }
    Atomics.add(ctrl, DONE, 1);
    Atomics.notify(ctrl, DONE);
    if (kind === CMD_DETACH) return;
  }
}

port.on("message", (m: AttachMessage) => {
  if (m.type === "attach") serve(m);
});
port.postMessage({ type: "ready" });
