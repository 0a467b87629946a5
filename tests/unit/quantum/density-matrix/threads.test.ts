/**
 * The density matrix on engine threads: ρ of n qubits is split by its top row bits, steps on
 * the lower qubits run on every thread's slice, the others on the whole ρ, in the original
 * order — so 2 and 4 threads give the same entries as one thread, bit for bit, with gate noise,
 * per-gate overrides, idle noise, mid-circuit measurements, resets and 3-qubit gates. The
 * single-thread path itself is checked against dense references in reference.test.ts.
 */
import { afterAll, describe, expect, it } from "vitest";
import { simulateDensityMatrix } from "@/lib/quantum/density-matrix/simulate";
import { splitForSlices, type DensityStep } from "@/lib/quantum/density-matrix/steps";
import { closeKernelPool, kernelPoolStatus, PARALLEL_MIN_QUBITS } from "@/lib/quantum/parallel";
import type { NoiseModel } from "@/lib/quantum/types";
import { makeRng, randomCircuit } from "../statevector/support/random-gates";

afterAll(() => closeKernelPool());

const n = PARALLEL_MIN_QUBITS / 2;

describe("density matrix on several engine threads", () => {
  it(
    "random noisy circuits with idle noise, measurements and resets: 2 and 4 threads equal 1",
    {
      timeout: 120_000,
    },
    () => {
      const rng = makeRng(808);
      const models: NoiseModel[] = [
        { depolarizing1q: 0.01, depolarizing2q: 0.03, amplitudeDamping: 0.02, phaseDamping: 0.01 },
        {
          depolarizing1q: 0.002,
          amplitudeDamping: 0.01,
          gates: { g3: { depolarizing: 0.2 } },
          idle: { depolarizing: 0.001, amplitudeDamping: 0.003, phaseDamping: 0.002 },
        },
        {},
      ];
      for (const noise of models) {
        const circuit = randomCircuit(rng, n, 40, true);
        const one = simulateDensityMatrix(circuit, noise, { threads: 1 });
        for (const threads of [2, 4]) {
          const many = simulateDensityMatrix(circuit, noise, { threads });
          expect(many.re.buffer).toBeInstanceOf(SharedArrayBuffer);
          let same = true;
          for (let i = 0; i < one.re.length && same; i++)
            same = one.re[i] === many.re[i] && one.im[i] === many.im[i];
          expect(same).toBe(true);
        }
      }
      expect(kernelPoolStatus()).toMatchObject({ broken: false });
      expect(kernelPoolStatus().helpers).toBeGreaterThanOrEqual(3);
    },
  );

  it("splits idle noise into runs on each side of the limit, order kept", () => {
    const idle = { qubits: [0, 1, 6, 7, 2], p: 0.1, gamma: 0, lambda: 0 };
    const step: DensityStep = {
      kind: "noisy-gate",
      qubits: [3],
      matrix: null,
      noise: { qubits: [3], gate: { p: 0.1, gamma: [0], lambda: [0] }, idle },
    };
    const parts = splitForSlices(step, 6);
    expect(parts.map((p) => p.low)).toEqual([true, true, false, true]);
    expect(parts[0].step).toMatchObject({ kind: "noisy-gate", noise: { idle: null } });
    expect(parts.slice(1).map((p) => (p.step.kind === "idle" ? p.step.idle.qubits : []))).toEqual([
      [0, 1],
      [6, 7],
      [2],
    ]);
  });
});
