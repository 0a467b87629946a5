/**
 * A kernel helper thread: attached to a shared state, it applies every gate command to its
 * chunk of the amplitudes (a contiguous slice: the gate's qubits lie below the split bits,
 * so the slice is a complete sub-state for it) and every stage command to its share of the
 * stage's tiles (with its own tile buffer), until told to detach. Pure computation on
 * shared memory; no I/O.
 */
import { parentPort } from "node:worker_threads";
import { applyToAmplitudes } from "../statevector/dispatch";
import { applyStageTiles, tileCount } from "../statevector/tiling";
import { bindMemory } from "../wasm/runtime";
import { readStage } from "./stage-codec";
import { shareOf } from "./shares";
import {
  type AttachMessage,
  CMD_DETACH,
  CMD_GATE,
  CMD_STAGE,
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
  const allRe = new Float64Array(m.re, m.reAt, m.dim);
  const allIm = new Float64Array(m.im, m.imAt, m.dim);
  const stageBuf = new Float64Array(m.stage);
  const re = allRe.subarray(m.index * len, (m.index + 1) * len);
  const im = allIm.subarray(m.index * len, (m.index + 1) * len);
  // write (not read) every page of the slice first: a first read maps the shared zero page and
  // the kernel's store then replaces it, flushing the TLB of every thread on the state
  re.fill(0);
  im.fill(0);
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
    } else if (kind === CMD_STAGE) {
      const stage = readStage(stageBuf);
      const [from, to] = shareOf(tileCount(m.n, stage), m.index, m.parts);
      applyStageTiles(allRe, allIm, m.n, stage, from, to, m.index);
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
