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
  return applyKraus(
    rho,
    ks.map((k) => fullOperator(k, [q], n)),
  );
}

function referenceDensity(circuit: Circuit, noise: NoiseModel): Matrix {
  const n = circuit.numQubits;
  let rho = zeroDensity(n);
  const damp = (q: number, g: number, l: number) => {
    rho = krausOn(rho, q, n, [
      f64(1, 0, 0, 0, 0, 0, Math.sqrt(1 - g), 0),
      f64(0, 0, Math.sqrt(g), 0, 0, 0, 0, 0),
    ]);
    rho = krausOn(rho, q, n, [
      f64(1, 0, 0, 0, 0, 0, Math.sqrt(1 - l), 0),
      f64(0, 0, 0, 0, 0, 0, Math.sqrt(l), 0),
    ]);
  };
  circuit.ops.forEach((op, i) => {
    if (op.kind === "gate") {
      for (const part of op.parts) {
        const f = fullOperator(part.matrix, part.qubits, n);
        rho = math.multiply(math.multiply(f, rho), dagger(f)) as Matrix;
      }
      // Per-gate overrides replace the model's rates field by field (README "Noise model").
      const o = noise.gates?.[op.name] ?? {};
      const p =
        o.depolarizing ??
        (op.qubits.length === 1 ? (noise.depolarizing1q ?? 0) : (noise.depolarizing2q ?? 0));
      rho = depolarizingRef(rho, op.qubits, p, n);
      for (const q of op.qubits)
        damp(
          q,
          o.amplitudeDamping ?? noise.amplitudeDamping ?? 0,
          o.phaseDamping ?? noise.phaseDamping ?? 0,
        );
      // Idle noise: every other qubit, 1-qubit depolarizing then damping.
      if (noise.idle) {
        for (let q = 0; q < n; q++) {
          if (op.qubits.includes(q)) continue;
          rho = depolarizingRef(rho, [q], noise.idle.depolarizing ?? 0, n);
          damp(q, noise.idle.amplitudeDamping ?? 0, noise.idle.phaseDamping ?? 0);
        }
      }
    } else if (op.kind === "measure") {
      const later = circuit.ops
        .slice(i + 1)
        .some((o) =>
          o.kind === "gate"
            ? o.qubits.includes(op.qubit)
            : o.kind === "measure" || o.kind === "reset"
              ? o.qubit === op.qubit
              : false,
        );
      if (later)
        rho = krausOn(rho, op.qubit, n, [f64(1, 0, 0, 0, 0, 0, 0, 0), f64(0, 0, 0, 0, 0, 0, 1, 0)]);
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
        : {
            depolarizing1q: rate(),
            depolarizing2q: rate(),
            amplitudeDamping: rate(),
            phaseDamping: rate(),
          };
      const rho = simulateDensityMatrix(circuit, noise);
      const ref = referenceDensity(circuit, noise);
      expect({ seed, ok: densityDistance(rho.re, rho.im, ref, n) < TOL }).toEqual({
        seed,
        ok: true,
      });
    }
  }, 60_000);
});

describe("per-gate overrides and idle noise vs the same reference", () => {
  it("matches on 40 seeded random circuits with overrides on some gate names and idle noise on other qubits", () => {
    for (let i = 0; i < 40; i++) {
      const seed = 9100 + i;
      const rng = makeRng(seed);
      const n = 2 + (i % 3);
      const circuit = randomCircuit(rng, n, rng.int(2, 6), false);
      const rate = (): number => (rng.float() < 0.3 ? 0 : 0.5 * rng.float());
      const names = [
        ...new Set(circuit.ops.flatMap((op) => (op.kind === "gate" ? [op.name] : []))),
      ];
      const gates: NonNullable<NoiseModel["gates"]> = {};
      for (const name of names) {
        if (rng.float() < 0.5) continue;
        gates[name] =
          rng.float() < 0.5
            ? { depolarizing: rate() }
            : { amplitudeDamping: rate(), phaseDamping: rate() };
      }
      const noise: NoiseModel = {
        depolarizing1q: rate(),
        depolarizing2q: rate(),
        amplitudeDamping: rate(),
        gates,
        ...(i % 2 === 0
          ? { idle: { depolarizing: rate(), amplitudeDamping: rate(), phaseDamping: rate() } }
          : {}),
      };
      const rho = simulateDensityMatrix(circuit, noise);
      const ref = referenceDensity(circuit, noise);
      expect({ seed, ok: densityDistance(rho.re, rho.im, ref, n) < TOL }).toEqual({
        seed,
        ok: true,
      });
    }
  }, 60_000);

  it("idle amplitude damping decays an untouched excited qubit as (1−γ)^m (N&C §8.3.5: p1 → (1−γ)p1)", () => {
    const circuit = randomCircuit(makeRng(1), 2, 0, false);
    const x = f64(0, 0, 1, 0, 1, 0, 0, 0);
    const h = f64(Math.SQRT1_2, 0, Math.SQRT1_2, 0, Math.SQRT1_2, 0, -Math.SQRT1_2, 0);
    circuit.ops = [
      {
        kind: "gate",
        name: "x",
        qubits: [1],
        params: [],
        parts: [{ name: "x", qubits: [1], matrix: x }],
        line: 1,
      },
      ...[2, 3, 4].map((line) => ({
        kind: "gate" as const,
        name: "h",
        qubits: [0],
        params: [],
        parts: [{ name: "h", qubits: [0], matrix: h }],
        line,
      })),
    ];
    const gamma = 0.1;
    const rho = simulateDensityMatrix(circuit, { idle: { amplitudeDamping: gamma } });
    // P(qubit 1 = 1): index bit 1 set (entries 2 and 3 on the diagonal, d = 4).
    const p1 = rho.re[2 * 4 + 2] + rho.re[3 * 4 + 3];
    expect(p1).toBeCloseTo((1 - gamma) ** 3, 12);
    // Without the idle field nothing decays (idle noise is off by default).
    const quiet = simulateDensityMatrix(circuit, { depolarizing1q: 0 });
    expect(quiet.re[2 * 4 + 2] + quiet.re[3 * 4 + 3]).toBeCloseTo(1, 12);
  });
});
