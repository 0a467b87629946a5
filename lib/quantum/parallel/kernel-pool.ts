/**
 * Engine threads: a pool of kernel helper threads (worker_threads) that share a statevector
 * through SharedArrayBuffers and apply gates to it together with the calling thread.
 *
 * Split: with T = 2^s threads, thread i owns the contiguous slice i of the amplitudes (index
 * bits n−s … n−1 equal to i). A gate whose qubits all lie below n − s acts inside every
 * slice, so each thread applies it to its own slice with the ordinary kernels. A tiling stage
 * (statevector/tiling.ts: several gates applied tile by tile in cache) is shared by tiles
 * instead: thread i takes part i of the stage's tiles, whatever qubits the gates touch; a
 * lone gate on one of the top s qubits runs as a one-gate stage the same way. Either way every
 * amplitude sees the same arithmetic as on one thread: results are bit-identical for any T.
 * Synchronisation is one Atomics notify/wait pair per command. Helpers are started once per
 * process (lazily), kept idle between runs, and
 * `unref`'d so they never keep a process alive; terminating the engine thread that owns
 * them terminates them too (the worker's way to cancel a run).
 *
 * Pages: each thread first writes its own slice (a read first would map the shared zero page,
 * and replacing it on the first store flushes the TLB of every thread: measured 250 ms of
 * system time per 22-qubit run on two threads, 30 ms after).
 *
 * Pure computation: the helpers load their own module and touch only shared memory.
 */
import { noteSharedAllocation } from "./memory-pressure";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import type { MessageChannel, MessagePort, Worker } from "node:worker_threads";
import { applyToAmplitudes } from "../statevector/dispatch";
import {
  applyStageTiles,
  makeStage,
  MAX_STAGE_GATE_QUBITS,
  tileBitsFor,
  tileCount,
  tileTailBytes,
  type Stage,
} from "../statevector/tiling";
import { bindMemory, createKernelMemory, kernelMemoryOf, stateViews } from "../wasm/runtime";
import { engineWasm } from "./config";
import { shareOf } from "./shares";
import { STAGE_DOUBLES, writeStage } from "./stage-codec";
import {
  type AttachMessage,
  CMD_DETACH,
  CMD_GATE,
  CMD_JOB,
  CMD_STAGE,
  CONTROL_INTS,
  DONE,
  ERR,
  JOINED,
  K,
  KIND,
  MATRIX_DOUBLES,
  MAX_K,
  Q0,
  READY,
  SEQ,
} from "./protocol";

// Paths from the working directory (the repository root for the worker, the tests and the
// benches), and the Worker class fetched at run time: the web app's bundler imports the engine
// for previews and must see neither `new Worker(…)` nor a `new URL(…, import.meta.url)` it
// would try to bundle (the boot file loads tsx). The web app never starts kernel helpers.
const PARALLEL_DIR = ["lib", "quantum", "parallel"];
const bootPath = (): string => join(process.cwd(), ...PARALLEL_DIR, "helper-boot.mjs");
const entryUrl = (): string =>
  pathToFileURL(join(process.cwd(), ...PARALLEL_DIR, "kernel-helper.ts")).href;
const workerClass = (): typeof Worker => process.getBuiltinModule("node:worker_threads").Worker;
const channelClass = (): typeof MessageChannel =>
  process.getBuiltinModule("node:worker_threads").MessageChannel;
/** Longest wait for helpers to start or attach before the run falls back to one thread. */
const ATTACH_TIMEOUT_MS = 20_000;

let helpers: Worker[] = [];
/** Per helper: a shared word its boot file sets to −1 when loading the helper failed. */
let bootWords: Int32Array[] = [];
let broken = false;

function ensureHelpers(count: number): boolean {
  if (broken) return false;
  while (helpers.length < count) {
    const boot = new SharedArrayBuffer(4);
    const w = new (workerClass())(bootPath(), { workerData: { entry: entryUrl(), boot } });
    w.unref();
    w.on("error", () => {
      broken = true;
    });
    helpers.push(w);
    bootWords.push(new Int32Array(boot));
  }
  return true;
}

/** True once any helper reported a failed boot (seen without the event loop). */
function bootFailed(): boolean {
  if (bootWords.some((w) => Atomics.load(w, 0) < 0)) broken = true;
  return broken;
}

/** Helper threads started in this thread, and whether any failed (then runs stay on one thread). */
export function kernelPoolStatus(): { helpers: number; broken: boolean } {
  return { helpers: helpers.length, broken };
}

/** Terminates the helper threads (tests and shutdown; the next parallel run starts new ones). */
export async function closeKernelPool(): Promise<void> {
  const all = helpers;
  helpers = [];
  bootWords = [];
  broken = false;
  await Promise.all(all.map((w) => w.terminate()));
}

const isShared = (s: { re: Float64Array; im: Float64Array }): boolean =>
  s.re.buffer instanceof SharedArrayBuffer && s.im.buffer instanceof SharedArrayBuffer;

/** A statevector's amplitudes in shared memory, with the helpers attached to it. */
export class ParallelState {
  readonly re: Float64Array;
  readonly im: Float64Array;
  private readonly ctrl: Int32Array;
  private readonly mat: Float64Array;
  private readonly stageBuf: Float64Array;
  /** Gates on qubits below this bit act inside every thread's contiguous slice. */
  readonly splitBit: number;
  private readonly parts: number;
  private attached = false;
  /** Per helper: the port its jobs (payloads of CMD_JOB commands) arrive on. */
  private jobs: MessagePort[] = [];

  /**
   * 2^n amplitudes split over `threads` (a power of two ≥ 2) threads: a fresh |0…0⟩-ready
   * zero state, or the helpers attached to an `existing` state in shared memory (a kernel
   * memory or SharedArrayBuffers; else the instance stays on the calling thread). Jobs also
   * see a `companion` state of the same size in shared memory (the adjoint gradient's λ).
   */
  constructor(
    readonly n: number,
    threads: number,
    opts: {
      existing?: { re: Float64Array; im: Float64Array };
      companion?: { re: Float64Array; im: Float64Array };
      /** A fresh state's memory also holds a companion state (wasm/runtime.ts companionOf). */
      reserveCompanion?: boolean;
    } = {},
  ) {
    const { existing, companion } = opts;
    this.parts = threads;
    this.splitBit = n - Math.log2(threads);
    let memory: WebAssembly.Memory | null | undefined = null;
    if (existing) {
      ({ re: this.re, im: this.im } = existing);
      memory = kernelMemoryOf(this.re.buffer);
      if (![existing, companion].every((s) => s === undefined || isShared(s))) threads = 1;
    } else {
      // amplitudes in a kernel memory (WebAssembly SIMD kernels on every thread) when enabled,
      // else in two SharedArrayBuffers
      memory = engineWasm()
        ? createKernelMemory(n, tileTailBytes(n, threads), opts.reserveCompanion)
        : null;
      if (memory && bindMemory(memory, 0)) {
        ({ re: this.re, im: this.im } = stateViews(memory, n));
      } else {
        noteSharedAllocation(16 * 2 ** n);
        this.re = new Float64Array(new SharedArrayBuffer(8 * 2 ** n));
        this.im = new Float64Array(new SharedArrayBuffer(8 * 2 ** n));
      }
    }
    const reBuf = this.re.buffer as SharedArrayBuffer;
    const imBuf = this.im.buffer as SharedArrayBuffer;
    const control = new SharedArrayBuffer(4 * CONTROL_INTS);
    const matrix = new SharedArrayBuffer(8 * MATRIX_DOUBLES);
    const stage = new SharedArrayBuffer(8 * STAGE_DOUBLES);
    this.ctrl = new Int32Array(control);
    this.mat = new Float64Array(matrix);
    this.stageBuf = new Float64Array(stage);
    if (threads < 2 || !ensureHelpers(threads - 1)) return;
    this.jobs = [];
    for (let i = 1; i < threads; i++) {
      const channel = new (channelClass())();
      this.jobs.push(channel.port1);
      const m: AttachMessage = {
        type: "attach",
        re: reBuf,
        im: imBuf,
        reAt: this.re.byteOffset,
        imAt: this.im.byteOffset,
        dim: this.re.length,
        memory: memory ?? undefined,
        control,
        matrix,
        stage,
        jobs: channel.port2,
        fresh: !existing,
        companion: companion && {
          re: companion.re.buffer as SharedArrayBuffer,
          im: companion.im.buffer as SharedArrayBuffer,
          reAt: companion.re.byteOffset,
          imAt: companion.im.byteOffset,
          memory: kernelMemoryOf(companion.re.buffer),
        },
        n,
        index: i,
        parts: threads,
      };
      helpers[i - 1].postMessage(m, [channel.port2]);
    }
    if (!existing) {
      // the caller writes its own slice while the helpers write theirs (see kernel-helper.ts)
      const own = this.re.length / threads;
      this.re.fill(0, 0, own);
      this.im.fill(0, 0, own);
    }
    const deadline = performance.now() + ATTACH_TIMEOUT_MS;
    for (;;) {
      const ready = Atomics.load(this.ctrl, READY);
      if (ready >= threads - 1) break;
      const left = deadline - performance.now();
      if (left <= 0 || bootFailed()) {
        this.abandon(); // helpers unavailable: stay on one thread
        return;
      }
      Atomics.wait(this.ctrl, READY, ready, Math.min(left, 100));
    }
    this.attached = true;
  }

  /**
   * Gives up on the helpers that have not joined (a late one then leaves the state alone) and
   * releases those that did, once they are ready — before the caller uses the state alone.
   */
  private abandon(): void {
    const ctrl = this.ctrl;
    let joined: number;
    for (;;) {
      joined = Atomics.load(ctrl, JOINED);
      if (Atomics.compareExchange(ctrl, JOINED, joined, -1) === joined) break;
    }
    if (joined <= 0) return;
    const wait = (slot: number, want: number): void => {
      const deadline = performance.now() + ATTACH_TIMEOUT_MS;
      for (;;) {
        const v = Atomics.load(ctrl, slot);
        if (v >= want) return;
        if (performance.now() > deadline) {
          broken = true; // a joined helper stopped answering: no engine threads from now on
          throw new Error("an engine thread stopped answering");
        }
        Atomics.wait(ctrl, slot, v, 100);
      }
    };
    wait(READY, joined);
    Atomics.store(ctrl, DONE, 0);
    Atomics.store(ctrl, KIND, CMD_DETACH);
    Atomics.add(ctrl, SEQ, 1);
    Atomics.notify(ctrl, SEQ);
    wait(DONE, joined);
  }

  /** True when the helpers are attached (otherwise every gate runs on the calling thread). */
  get parallel(): boolean {
    return this.attached;
  }

  /**
   * ψ ← (U on `qubits`) ψ: shared by all threads, each on its slice when the gate lies below
   * the split bits, else as a one-gate tiling stage (each on its share of the tiles).
   */
  apply(qubits: readonly number[], matrix: Float64Array): void {
    const k = qubits.length;
    const high = qubits.some((q) => q >= this.splitBit);
    if (this.attached && high && k <= MAX_STAGE_GATE_QUBITS) {
      const name = "gate";
      this.applyStage(makeStage([{ name, qubits: [...qubits], matrix }], tileBitsFor(qubits)));
      return;
    }
    if (!this.attached || k > MAX_K || high) {
      applyToAmplitudes(this.re, this.im, qubits, matrix);
      return;
    }
    const ctrl = this.ctrl;
    this.mat.set(matrix);
    ctrl[K] = k;
    for (let j = 0; j < k; j++) ctrl[Q0 + j] = qubits[j];
    this.command(CMD_GATE, () => {
      const len = this.re.length / this.parts;
      applyToAmplitudes(this.re.subarray(0, len), this.im.subarray(0, len), qubits, matrix);
    });
  }

  /** Applies a tiling stage, the tiles shared by all threads (statevector/tiling.ts). */
  applyStage(stage: Stage): void {
    const tiles = tileCount(this.n, stage);
    if (!this.attached) {
      applyStageTiles(this.re, this.im, this.n, stage, 0, tiles);
      return;
    }
    writeStage(this.stageBuf, stage);
    this.command(CMD_STAGE, () => {
      const [from, to] = shareOf(tiles, 0, this.parts);
      applyStageTiles(this.re, this.im, this.n, stage, from, to, 0);
    });
  }

  /**
   * Runs job `kind` on every thread: helper i receives `payloads[i − 1]` (structured-cloned;
   * results go to shared memory the payload names) while the caller runs `own()`.
   */
  runJobs(kind: string, payloads: readonly unknown[], own: () => void): void {
    if (!this.attached) throw new Error("runJobs needs attached helpers");
    this.jobs.forEach((port, i) => port.postMessage({ kind, payload: payloads[i] }));
    this.command(CMD_JOB, own);
  }

  /** Number of threads sharing the work (1 when the helpers are not attached). */
  get threads(): number {
    return this.attached ? this.parts : 1;
  }

  /** The message a failing helper posted on its job port. */
  private helperError(): string {
    const receive = process.getBuiltinModule("node:worker_threads").receiveMessageOnPort;
    for (const port of this.jobs) {
      for (let got = receive(port); got; got = receive(port)) {
        const message = got.message as { error?: string };
        if (message.error) return `an engine thread failed its share: ${message.error}`;
      }
    }
    return "an engine thread failed its share";
  }

  /** Releases the helpers (they return to idle); the arrays stay valid. */
  detach(): void {
    if (!this.attached) return;
    this.command(CMD_DETACH, () => {});
    this.attached = false;
    for (const port of this.jobs) port.close();
    this.jobs = [];
  }

  private command(kind: number, own: () => void): void {
    const ctrl = this.ctrl;
    Atomics.store(ctrl, DONE, 0);
    Atomics.store(ctrl, ERR, 0);
    Atomics.store(ctrl, KIND, kind);
    Atomics.add(ctrl, SEQ, 1);
    Atomics.notify(ctrl, SEQ);
    let failed: { error: unknown } | null = null;
    try {
      own();
    } catch (error) {
      failed = { error }; // thrown once the helpers are done with the state
    }
    const want = this.parts - 1;
    for (;;) {
      const done = Atomics.load(ctrl, DONE);
      if (done >= want) {
        if (failed) throw failed.error;
        if (Atomics.load(ctrl, ERR) !== 0) throw new Error(this.helperError());
        return;
      }
      Atomics.wait(ctrl, DONE, done, 1000);
    }
  }
}
