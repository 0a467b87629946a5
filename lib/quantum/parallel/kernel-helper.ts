/**
 * A kernel helper thread: attached to a shared state, it applies every gate command to its
 * chunk of the amplitudes (a contiguous slice: the gate's qubits lie below the split bits,
 * so the slice is a complete sub-state for it) and every stage command to its share of the
 * stage's tiles (with its own tile buffer), until told to detach. Pure computation on
 * shared memory; no I/O.
 */
import { type MessagePort, parentPort, receiveMessageOnPort } from "node:worker_threads";
import { applyToAmplitudes } from "../statevector/dispatch";
import { applyStageTiles, tileCount } from "../statevector/tiling";
import { bindMemory } from "../wasm/runtime";
import { KERNEL_JOBS } from "./kernel-jobs";
import { readStage } from "./stage-codec";
import { shareOf, sliceOf } from "./shares";
import {
  type AttachMessage,
  CMD_DETACH,
  CMD_GATE,
  CMD_JOB,
  CMD_STAGE,
  DONE,
  ERR,
  JOINED,
  K,
  KIND,
  Q0,
  READY,
  SEQ,
} from "./protocol";

/** Longest wait for a job's payload after its command (it is posted first: normally none). */
const JOB_WAIT_MS = 5_000;
const port = parentPort;
if (!port) throw new Error("kernel-helper.ts must run in a worker thread");

function serve(m: AttachMessage): void {
  const ctrl = new Int32Array(m.control);
  const mat = new Float64Array(m.matrix);
  if (m.memory) bindMemory(m.memory, m.index); // else (no SIMD here) the JavaScript kernels run
  const allRe = new Float64Array(m.re, m.reAt, m.dim);
  const allIm = new Float64Array(m.im, m.imAt, m.dim);
  const stageBuf = new Float64Array(m.stage);
  const re = sliceOf(allRe, m.index, m.parts);
  const im = sliceOf(allIm, m.index, m.parts);
  // join unless the caller already gave up on this state (then leave it alone)
  for (;;) {
    const joined = Atomics.load(ctrl, JOINED);
    if (joined < 0) return;
    if (Atomics.compareExchange(ctrl, JOINED, joined, joined + 1) === joined) break;
  }
  if (m.fresh) {
    // write (not read) every page of the slice first: a first read maps the shared zero page
    // and the kernel's store then replaces it, flushing the TLB of every thread on the state
    re.fill(0);
    im.fill(0);
  }
  const c = m.companion;
  if (c?.memory) bindMemory(c.memory, m.index);
  const ctx = {
    re: allRe,
    im: allIm,
    n: m.n,
    index: m.index,
    parts: m.parts,
    companion: c && {
      re: new Float64Array(c.re, c.reAt, m.dim),
      im: new Float64Array(c.im, c.imAt, m.dim),
    },
  };
  let seen = Atomics.load(ctrl, SEQ);
  Atomics.add(ctrl, READY, 1);
  Atomics.notify(ctrl, READY);
  for (;;) {
    Atomics.wait(ctrl, SEQ, seen);
    seen = Atomics.load(ctrl, SEQ);
    const kind = Atomics.load(ctrl, KIND);
    try {
      if (kind === CMD_GATE) {
        const k = ctrl[K];
        const qubits = Array.from({ length: k }, (_, j) => ctrl[Q0 + j]);
        applyToAmplitudes(re, im, qubits, mat.subarray(0, 2 * 4 ** k));
      } else if (kind === CMD_STAGE) {
        const stage = readStage(stageBuf);
        const [from, to] = shareOf(tileCount(m.n, stage), m.index, m.parts);
        applyStageTiles(allRe, allIm, m.n, stage, from, to, m.index);
      } else if (kind === CMD_JOB) {
        const job = nextJob(m.jobs);
        KERNEL_JOBS[job.kind](ctx, job.payload as never);
      }
    } catch (error) {
      // the caller throws with this message; this thread stays usable
      m.jobs.postMessage({ error: error instanceof Error ? error.message : String(error) });
      Atomics.store(ctrl, ERR, 1);
    }
    Atomics.add(ctrl, DONE, 1);
    Atomics.notify(ctrl, DONE);
    if (kind === CMD_DETACH) return;
  }
}

/** The job posted just before the command (the post happens before the wake-up). */
function nextJob(jobs: MessagePort): { kind: string; payload: unknown } {
  const pause = new Int32Array(new SharedArrayBuffer(4));
  for (let waited = 0; waited < JOB_WAIT_MS; waited++) {
    const got = receiveMessageOnPort(jobs);
    if (got) return got.message as { kind: string; payload: unknown };
    Atomics.wait(pause, 0, 0, 1);
  }
  throw new Error("kernel helper: a job command arrived without its payload");
}

port.on("message", (m: AttachMessage) => {
  if (m.type === "attach") serve(m);
});
port.postMessage({ type: "ready" });
