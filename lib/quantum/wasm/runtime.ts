/**
 * The engine's WebAssembly kernels (AssemblyScript with SIMD, sources in ./assembly, bytes in
 * ./kernels-binary.ts). A statevector whose amplitudes live in a kernel memory (a shared
 * WebAssembly.Memory: a reserved head, re, a small gap, im) is bound to an instance of the module
 * on that memory; the dispatcher runs the wasm kernels on bound arrays and the JavaScript
 * kernels (the reference) on every other array. Pure: the module is compiled synchronously
 * from the bytes, once per thread; an instance is made per memory and thread.
 *
 * Memory head (RESERVED_BYTES): 16 scratch slots of SLOT_BYTES (gate matrices and the 2-qubit
 * kernel's coefficient table; slot i belongs to engine thread i of the state), then one Pauli
 * area per slot (term tables and sums of that thread's Pauli passes).
 */
import { KERNELS_WASM_BASE64 } from "./kernels-binary";
import { noteSharedAllocation } from "../parallel/memory-pressure";

export interface KernelExports {
  general1q(re: number, im: number, len: number, q: number, m: number): void;
  real1q(re: number, im: number, len: number, q: number, m: number): void;
  general2q(re: number, im: number, len: number, first: number, second: number, m: number): void;
  twoBlock(re: number, im: number, len: number, ctrl: number, tgt: number, m: number): void;
  pauliDiagonal(re: number, im: number, len: number, z: number): number;
  pauliTerm(
    re: number,
    im: number,
    x: number,
    run: number,
    stride: number,
    len: number,
    z: number,
    odd: number,
  ): number;
  pauliPair(
    re: number,
    im: number,
    xA: number,
    xB: number,
    run: number,
    stride: number,
    len: number,
    zA: number,
    zB: number,
    oddA: number,
    oddB: number,
    area: number,
  ): void;
  pauliTerms4(
    re: number,
    im: number,
    x: number,
    run: number,
    stride: number,
    len: number,
    table: number,
    out: number,
  ): void;
  copyTile(
    re: number,
    im: number,
    tileRe: number,
    tileIm: number,
    runAt: number,
    runs: number,
    runBytes: number,
    gather: number,
  ): void;
  cross1q(
    lre: number,
    lim: number,
    pre: number,
    pim: number,
    len: number,
    q: number,
    out: number,
    acc: number,
  ): void;
  lambdaTerm(
    lre: number,
    lim: number,
    pre: number,
    pim: number,
    from: number,
    to: number,
    x: number,
    z: number,
    cr: number,
    ci: number,
  ): void;
  noisy1q(re: number, im: number, len: number, n: number, q: number, m: number, real: number): void;
  twoBlockStep(
    lre: number,
    lim: number,
    pre: number,
    pim: number,
    len: number,
    ctrl: number,
    tgt: number,
    m: number,
    out: number,
    lambda: number,
  ): void;
  cross2q(
    lre: number,
    lim: number,
    pre: number,
    pim: number,
    len: number,
    first: number,
    second: number,
    needed: number,
    out: number,
    acc: number,
  ): void;
}

const PAGE = 65536;
export const SLOT_BYTES = 2048;
export const MAX_SLOTS = 16;
/**
 * Pauli area of each slot (engine thread), after the scratch slots: at +0 four (z, odd) pairs
 * and their lane patterns, at PAULI_OUT four sums, at PAULI_PAIR the two-mask kernel's sums.
 */
export const PAULI_AREA_AT = SLOT_BYTES * MAX_SLOTS;
export const PAULI_OUT = 512;
export const PAULI_PAIR = 576;
export const PAULI_AREA_BYTES = 1024;
/** The head: scratch slots and Pauli areas (48 KiB) in one page. */
export const RESERVED_BYTES = PAGE;
/**
 * Gap between re and im: 17 cache lines, so re[i] and im[i] never share their low 12 address
 * bits (a store to one and a load of the other would alias in the core's 4 KiB load/store
 * disambiguation; measured: the 1-qubit kernel on a middle qubit speeds up by ~20 %).
 */
export const IM_GAP_BYTES = 1088;
/** Largest state a kernel memory holds (wasm32 addresses: 16·2^n + head ≤ 4 GiB). */
export const WASM_MAX_QUBITS = 27;

/** A kernel instance on one memory, seen from one thread. */
export interface WasmBinding {
  readonly k: KernelExports;
  /** Byte offset and view of this thread's scratch slot. */
  readonly scratchAt: number;
  /** Byte offset of this thread's Pauli area. */
  readonly pauliAt: number;
  readonly scratch: Float64Array;
  /** The memory's bytes (Pauli tables are written through views of it). */
  readonly buffer: ArrayBufferLike;
}

let compiled: WebAssembly.Module | null | undefined;

/** The compiled module, or null where WebAssembly SIMD or shared memory is unavailable. */
export function kernelModule(): WebAssembly.Module | null {
  if (compiled === undefined) {
    try {
      const bin = atob(KERNELS_WASM_BASE64);
      const bytes = new Uint8Array(bin.length);
      for (let i = 0; i < bin.length; i++) bytes[i] = bin.charCodeAt(i);
      compiled = new WebAssembly.Module(bytes);
    } catch {
      compiled = null;
    }
  }
  return compiled;
}

const bindings = new WeakMap<ArrayBufferLike, WasmBinding>();

/** Instantiates the kernels on `memory` for this thread (scratch slot `slot`). */
export function bindMemory(memory: WebAssembly.Memory, slot: number): WasmBinding | null {
  const mod = kernelModule();
  if (!mod) return null;
  const buffer = memory.buffer;
  const found = bindings.get(buffer);
  if (found) return found;
  const inst = new WebAssembly.Instance(mod, { env: { memory } });
  const scratchAt = slot * SLOT_BYTES;
  const b: WasmBinding = {
    k: inst.exports as unknown as KernelExports,
    scratchAt,
    pauliAt: PAULI_AREA_AT + slot * PAULI_AREA_BYTES,
    scratch: new Float64Array(buffer, scratchAt, SLOT_BYTES / 8),
    buffer,
  };
  bindings.set(buffer, b);
  return b;
}

/** The binding of amplitude arrays that both live in one kernel memory, else undefined. */
export function wasmBinding(re: Float64Array, im: Float64Array): WasmBinding | undefined {
  const buf = re.buffer;
  return buf === im.buffer ? bindings.get(buf) : undefined;
}

const memories = new WeakMap<ArrayBufferLike, WebAssembly.Memory>();

/** The kernel memory (made in this thread) whose bytes `buffer` is, else undefined. */
export function kernelMemoryOf(buffer: ArrayBufferLike): WebAssembly.Memory | undefined {
  return memories.get(buffer);
}

/** End (bytes) of the state part of a kernel memory of 2^n amplitudes: the tail starts here. */
export function stateEndByte(n: number): number {
  return RESERVED_BYTES + 16 * 2 ** n + IM_GAP_BYTES;
}

/** Bytes of a companion state (re, gap, im) after a kernel memory's tail. */
export function companionBytes(n: number): number {
  return 16 * 2 ** n + IM_GAP_BYTES;
}

const companions = new WeakMap<ArrayBufferLike, { re: Float64Array; im: Float64Array }>();

/**
 * The companion state of the kernel memory whose bytes hold `re` (made in this thread with
 * `companion`): a second 2^n-amplitude state in the same memory, so kernels that read two
 * states at once (the adjoint sweep's cross matrix) can run on both. Not zero-filled.
 */
export function companionOf(re: Float64Array): { re: Float64Array; im: Float64Array } | undefined {
  return companions.get(re.buffer);
}

/**
 * A kernel memory holding a 2^n-amplitude state (zero-filled) and `tailBytes` more after it
 * (the per-thread tile buffers of statevector/tiling.ts), then a companion state when asked
 * (companionOf), or null when it cannot exist.
 */
export function createKernelMemory(
  n: number,
  tailBytes = 0,
  companion = false,
): WebAssembly.Memory | null {
  if (n > WASM_MAX_QUBITS || !kernelModule()) return null;
  const bytes = stateEndByte(n) + tailBytes + (companion ? companionBytes(n) : 0);
  if (bytes > 2 ** 32) return null;
  const pages = Math.ceil(bytes / PAGE);
  try {
    const memory = new WebAssembly.Memory({ initial: pages, maximum: pages, shared: true });
    noteSharedAllocation(pages * PAGE);
    memories.set(memory.buffer, memory);
    if (companion) {
      const at = stateEndByte(n) + tailBytes;
      const dim = 2 ** n;
      companions.set(memory.buffer, {
        re: new Float64Array(memory.buffer, at, dim),
        im: new Float64Array(memory.buffer, at + 8 * dim + IM_GAP_BYTES, dim),
      });
    }
    return memory;
  } catch {
    return null; // no address space (or no shared memory): the caller uses plain arrays
  }
}

/** The re and im views of a kernel memory's state of 2^n amplitudes. */
export function stateViews(
  memory: WebAssembly.Memory,
  n: number,
): { re: Float64Array; im: Float64Array } {
  const dim = 2 ** n;
  const buf = memory.buffer;
  return {
    re: new Float64Array(buf, RESERVED_BYTES, dim),
    im: new Float64Array(buf, RESERVED_BYTES + 8 * dim + IM_GAP_BYTES, dim),
  };
}
