/**
 * Engine threads: the same circuit on 1, 2 and 4 threads gives bit-identical amplitudes
 * (every amplitude goes through the same kernel arithmetic whichever thread owns it), and
 * the thread count follows KETWISE_ENGINE_THREADS.
 */
import { afterAll, afterEach, describe, expect, it } from "vitest";
import {
  PARALLEL_MIN_QUBITS,
  ParallelState,
  closeKernelPool,
  engineThreads,
  kernelPoolStatus,
  threadsFor,
} from "@/lib/quantum/parallel";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { makeRng, randomCircuit } from "./support/random-gates";

afterAll(() => closeKernelPool());

describe("statevector on several engine threads", () => {
  it(
    "random circuits at the crossover size: 2 and 4 threads equal 1 thread exactly",
    { timeout: 120_000 },
    () => {
      const rng = makeRng(1604);
      const n = PARALLEL_MIN_QUBITS;
      for (let trial = 0; trial < 3; trial++) {
        const circuit = randomCircuit(rng, n, 40);
        const one = simulateStatevector(circuit, { threads: 1 });
        for (const threads of [2, 4]) {
          const many = simulateStatevector(circuit, { threads });
          expect(many.re.buffer).toBeInstanceOf(SharedArrayBuffer);
          let same = true;
          for (let i = 0; i < one.re.length && same; i++)
            same = one.re[i] === many.re[i] && one.im[i] === many.im[i];
          expect(same).toBe(true);
        }
      }
      // the helpers really ran (no silent fall-back to one thread)
      expect(kernelPoolStatus()).toEqual({ helpers: 3, broken: false });
    },
  );

  it("a helper's failure reaches the caller with its message; the state stays usable", () => {
    const shared = new ParallelState(PARALLEL_MIN_QUBITS, 2);
    try {
      expect(shared.parallel).toBe(true);
      expect(() => shared.runJobs("no-such-job", [null], () => {})).toThrow(
        /an engine thread failed its share: .+/,
      );
      shared.re[0] = 1;
      const h = Math.SQRT1_2;
      shared.apply([0], Float64Array.of(h, 0, h, 0, h, 0, -h, 0));
      expect(shared.re[0]).toBeCloseTo(h, 15);
      expect(shared.re[1]).toBeCloseTo(h, 15);
    } finally {
      shared.detach();
    }
  });

  it("a canceled run still releases the helpers (the next run works)", { timeout: 60_000 }, () => {
    const rng = makeRng(77);
    const circuit = randomCircuit(rng, PARALLEL_MIN_QUBITS, 30);
    const ac = new AbortController();
    let ticks = 0;
    expect(() =>
      simulateStatevector(circuit, {
        threads: 2,
        onProgress: () => {
          if (++ticks === 1) ac.abort();
        },
        signal: ac.signal,
      }),
    ).toThrow(/canceled/);
    const again = simulateStatevector(circuit, { threads: 2 });
    const ref = simulateStatevector(circuit, { threads: 1 });
    expect(Array.from(again.re.subarray(0, 64))).toEqual(Array.from(ref.re.subarray(0, 64)));
  });
});

describe("thread count", () => {
  const saved = process.env.KETWISE_ENGINE_THREADS;
  afterEach(() => {
    if (saved === undefined) delete process.env.KETWISE_ENGINE_THREADS;
    else process.env.KETWISE_ENGINE_THREADS = saved;
  });

  it("KETWISE_ENGINE_THREADS overrides the default, rounded down to a power of two", () => {
    process.env.KETWISE_ENGINE_THREADS = "1";
    expect(engineThreads()).toBe(1);
    process.env.KETWISE_ENGINE_THREADS = "6";
    expect(engineThreads()).toBe(4);
  });

  it("small states stay on one thread; never more slices than amplitude pairs", () => {
    expect(threadsFor(PARALLEL_MIN_QUBITS - 1, 8)).toBe(1);
    expect(threadsFor(PARALLEL_MIN_QUBITS, 8)).toBe(8);
    expect(threadsFor(24, 1)).toBe(1);
    // never more threads than kernel-memory slots (16)
    expect(threadsFor(24, 64)).toBe(16);
  });
});
