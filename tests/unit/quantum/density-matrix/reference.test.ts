/**
 * Noisy density-matrix simulation vs an independent mathjs reference that applies every
 * channel through its Kraus operators on the full 2^n space (textbook tensor order; the
 * index mapping is explained in statevector/support/dense-reference.ts).
 *
 * Kraus operators (Nielsen & Chuang, ch. 8; values from memory):
 * - amplitude damping: K0 = [[1,0],[0,√(1−γ)]], K1 = [[0,√γ],[0,0]]  (§8.3.5)
 * - phase damping:     K0 = [[1,0],[0,√(1−λ)]], K1 = [[0,0],[0,√λ]]  (§8.3.6)
 * - depolarizing on k qubits: (1−p)ρ + p·T(ρ) with T = T_1∘…∘T_k and the one-qubit twirl
 *   T_j(ρ) = ¼(ρ + XρX + YρY + ZρZ) = I/2 ⊗ Tr_j ρ (§8.3.4, eq. 8.102 for one qubit; the
 *   product of twirls giving I/2^k ⊗ Tr ρ is common practice).
 * - non-selective Z measurement: P0 = |0⟩⟨0|, P1 = |1⟩⟨1|; reset: |0⟩⟨0|, |0⟩⟨1|.
 * Semantics (DEVELOPERS.md, "Noise model"): noise once after each top-level gate op on its qubits
 * (depolarizing1q for k = 1, depolarizing2q for k ≥ 2), then damping per qubit; final
 * measurements (nothing later on that qubit) are not applied.
 */
import { describe, expect, it } from "vitest";
import type { Matrix } from "mathjs";
import { simulateDensityMatrix } from "@/lib/quantum/density-matrix/simulate";
import type { Circuit, NoiseModel } from "@/lib/quantum/types";
import {
  applyKraus,
  dagger,
  densityDistance,
  fullOperator,
  math,
  zeroDensity,
} from "../statevector/support/dense-reference";
import { makeRng, randomCircuit } from "../statevector/support/random-gates";

const TOL = 1e-10;
const f64 = (...v: number[]): Float64Array => Float64Array.from(v);
/** 2×2 interleaved matrices [[a,b],[c,d]] from (re, im) pairs. */
const I2 = f64(1, 0, 0, 0, 0, 0, 1, 0);
const X = f64(0, 0, 1, 0, 1, 0, 0, 0);
const Y = f64(0, 0, 0, -1, 0, 1, 0, 0);
const Z = f64(1, 0, 0, 0, 0, 0, -1, 0);

function twirl(rho: Matrix, q: number, n: number): Matrix {
  const ops = [I2, X, Y, Z].map((p) => math.multiply(0.5, fullOperator(p, [q], n)) as Matrix);
  return applyKraus(rho, ops);
}

function depolarizingRef(rho: Matrix, qubits: number[], p: number, n: number): Matrix {
  if (p === 0) return rho;
  let mixed = rho;
  for (const q of qubits) mixed = twirl(mixed, q, n);
  return math.add(math.multiply(1 - p, rho), math.multiply(p, mixed)) as Matrix;
}

function krausOn(rho: Matrix, q: number, n: number, ks: Float64Array[]): Matrix {
  return applyKraus(rho, ks.map((k) => fullOperator(k, [q], n)));
}

function referenceDensity(circuit: Circuit, noise: NoiseModel): Matrix {
  const n = circuit.numQubits;
  const g = noise.amplitudeDamping ?? 0;
  const l = noise.phaseDamping ?? 0;
  let rho = zeroDensity(n);
  circuit.ops.forEach((op, i) => {
    if (op.kind === "gate") {
      for (const part of op.parts) {
        const f = fullOperator(part.matrix, part.qubits, n);
        rho = math.multiply(math.multiply(f, rho), dagger(f)) as Matrix;
      }
      const p = op.qubits.length === 1 ? (noise.depolarizing1q ?? 0) : (noise.depolarizing2q ?? 0);
      rho = depolarizingRef(rho, op.qubits, p, n);
      for (const q of op.qubits) {
        rho = krausOn(rho, q, n, [f64(1, 0, 0, 0, 0, 0, Math.sqrt(1 - g), 0), f64(0, 0, Math.sqrt(g), 0, 0, 0, 0, 0)]);
        rho = krausOn(rho, q, n, [f64(1, 0, 0, 0, 0, 0, Math.sqrt(1 - l), 0), f64(0, 0, 0, 0, 0, 0, Math.sqrt(l), 0)]);
      }
    } else if (op.kind === "measure") {
      const later = circuit.ops.slice(i + 1).some((o) =>
        o.kind === "gate" ? o.qubits.includes(op.qubit) : o.kind === "measure" || o.kind === "reset" ? o.qubit === op.qubit : false,
      );
      if (later) rho = krausOn(rho, op.qubit, n, [f64(1, 0, 0, 0, 0, 0, 0, 0), f64(0, 0, 0, 0, 0, 0, 1, 0)]);
    } else if (op.kind === "reset") {
      rho = krausOn(rho, op.qubit, n, [f64(1, 0, 0, 0, 0, 0, 0, 0), f64(0, 0, 1, 0, 0, 0, 0, 0)]);
    }
  });
  return rho;
}

describe("density matrix vs mathjs Kraus reference (independent library, N&C ch. 8)", () => {
  it("matches on 60 seeded random noisy circuits (1–4 qubits, measure/reset included) to 1e-10", () => {
    for (let i = 0; i < 60; i++) {
      const seed = 4200 + i;
      const rng = makeRng(seed);
      const n = 1 + (i % 4);
      const circuit = randomCircuit(rng, n, rng.int(1, 6), true);
      const noiseless = i % 5 === 0; // exercises fusion across ops
      const rate = (): number => (rng.float() < 0.2 ? 0 : rng.float());
      const noise: NoiseModel = noiseless
        ? { readout: { p1Given0: 0.1 } }
        : { depolarizing1q: rate(), depolarizing2q: rate(), amplitudeDamping: rate(), phaseDamping: rate() };
      const rho = simulateDensityMatrix(circuit, noise);
      const ref = referenceDensity(circuit, noise);
      expect({ seed, ok: densityDistance(rho.re, rho.im, ref, n) < TOL }).toEqual({ seed, ok: true });
    }
  }, 60_000);
});
