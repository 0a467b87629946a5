/**
 * Coverage of the sampled 95 % intervals: how often `ci95` contains the exact value over
 * seeded repetitions. Shared by the unit test (a few hundred seeds on a sub-grid) and
 * `npm run bench:coverage` (the full grid, more seeds).
 *
 * Families (a = the normalised exact value ⟨A⟩ / Σ|c_i|; amplitude index bit k = qubit k):
 * - "one term":    Z0 on cos(θ/2)|0⟩ + sin(θ/2)|1⟩, ⟨Z⟩ = cos θ = a (one setting).
 * - "correlated":  (Z0 + Z1 + Z0 Z1)/3 on the same product state on two qubits: one setting,
 *                  three terms on shared shots; value (2z + z²)/3 = a.
 * - "settings":    (X0 X1 − Y0 Y1 + Z0 Z1)/3 on cos ε|Φ+⟩ + sin ε|Φ−⟩: three settings, Z0 Z1
 *                  deterministic, value (1 + 2 cos 2ε)/3 = a.
 * - "mermin":      (X X X − X Y Y − Y X Y − Y Y X)/4 on cos ε|GHZ+⟩ + sin ε|GHZ−⟩, |GHZ±⟩ =
 *                  (|000⟩ ± |111⟩)/√2: four settings, value cos 2ε = a (N. D. Mermin, Phys. Rev.
 *                  Lett. 65, 1838 (1990): ⟨M⟩ = 4 on the GHZ state).
 * - "heisenberg":  the 6-term sum Σ_{(i,j)∈{(0,1),(2,3)}} (X_i X_j + Y_i Y_j + Z_i Z_j) on
 *                  (cos ε|S⟩ + sin ε|T⟩)^{⊗2}, |S⟩ the singlet and |T⟩ an equal mix of the three
 *                  triplets: ground energy −6 at ε = 0 (σ·σ = −3 on the singlet, +1 on a triplet;
 *                  textbook values), energy −6 + 8 sin²ε = −6a; three settings with two correlated
 *                  terms each, every term close to −1 (flip rates ≈ q, q/3, 2q/3, q = sin²ε).
 * "mitigated" runs add readout error (p1Given0 = 0.02, p0Given1 = 0.05) and check the
 * readout-mitigated interval against the exact (readout-free) value.
 */
import type {
  PreparedObservable,
  PreparedState,
  SamplingOptions,
} from "@/lib/quantum/sampling/sample-observable";
import { sampleObservable } from "@/lib/quantum/sampling/sample-observable";
import type { StateVector } from "@/lib/quantum/types";
import { groupQubitWise } from "@/lib/quantum/observable/grouping";
import {
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";

export type Family = "one term" | "correlated" | "settings" | "mermin" | "heisenberg";

export interface CoverageCase {
  family: Family;
  /** Normalised exact value a (see module doc); for "heisenberg" the energy is −6·a. */
  a: number;
  shots: number;
  mitigated: boolean;
}

export const READOUT = { e0: 0.02, e1: 0.05 };

function state(n: number, amps: [number, number][]): StateVector {
  const re = new Float64Array(2 ** n);
  for (const [i, v] of amps) re[i] += v;
  return { n, re, im: new Float64Array(2 ** n) };
}

function kron(a: StateVector, b: StateVector): StateVector {
  const re = new Float64Array(a.re.length * b.re.length);
  // qubits of a are the low bits, those of b the high bits
  for (let j = 0; j < b.re.length; j++)
    for (let i = 0; i < a.re.length; i++) re[j * a.re.length + i] = a.re[i] * b.re[j];
  return { n: a.n + b.n, re, im: new Float64Array(re.length) };
}

function pauli(text: string, n: number): PreparedObservable & { kind: "pauli" } {
  const sum = padPauliSum(parsePauliSum(text), n);
  return { kind: "pauli", sum, settings: groupQubitWise(sum) };
}

const S2 = Math.SQRT1_2;

/** The prepared state and observable of a family at normalised value a. */
export function caseSetup(
  family: Family,
  a: number,
): { state: StateVector; obs: PreparedObservable & { kind: "pauli" } } {
  switch (family) {
    case "one term": {
      const t = Math.acos(a);
      return {
        state: state(1, [
          [0, Math.cos(t / 2)],
          [1, Math.sin(t / 2)],
        ]),
        obs: pauli("Z0", 1),
      };
    }
    case "correlated": {
      const z = -1 + Math.sqrt(1 + 3 * a); // (2z + z²)/3 = a
      const t = Math.acos(z);
      const q = state(1, [
        [0, Math.cos(t / 2)],
        [1, Math.sin(t / 2)],
      ]);
      return {
        state: kron(q, q),
        obs: pauli("0.3333333333333333 Z0 + 0.3333333333333333 Z1 + 0.3333333333333333 Z0 Z1", 2),
      };
    }
    case "settings": {
      const e = 0.5 * Math.acos((3 * a - 1) / 2);
      const [c, s] = [Math.cos(e), Math.sin(e)];
      // |Φ±⟩ = (|00⟩ ± |11⟩)/√2
      return {
        state: state(2, [
          [0, S2 * (c + s)],
          [3, S2 * (c - s)],
        ]),
        obs: pauli(
          "0.3333333333333333 X0 X1 - 0.3333333333333333 Y0 Y1 + 0.3333333333333333 Z0 Z1",
          2,
        ),
      };
    }
    case "mermin": {
      const e = 0.5 * Math.acos(a);
      const [c, s] = [Math.cos(e), Math.sin(e)];
      return {
        state: state(3, [
          [0, S2 * (c + s)],
          [7, S2 * (c - s)],
        ]),
        obs: pauli("0.25 X0 X1 X2 - 0.25 X0 Y1 Y2 - 0.25 Y0 X1 Y2 - 0.25 Y0 Y1 X2", 3),
      };
    }
    case "heisenberg": {
      // per pair cos ε|S⟩ + sin ε|T⟩, |T⟩ = (|T+⟩ + |T0⟩ + |T−⟩)/√3: ⟨σ·σ⟩ = −3 + 4q, q = sin²ε;
      // energy −6 + 8q = −6a  →  q = 3(1 − a)/4
      const q = (3 * (1 - a)) / 4;
      const [c, s] = [Math.sqrt(1 - q), Math.sqrt(q)];
      const t = s / Math.sqrt(3);
      // index = b0 + 2·b1: |00⟩ = 0, |10⟩ (qubit 0 = 1) = 1, |01⟩ = 2, |11⟩ = 3
      // singlet (|01⟩ − |10⟩)/√2, T0 = (|01⟩ + |10⟩)/√2, T+ = |00⟩, T− = |11⟩
      const pair = state(2, [
        [0, t],
        [3, t],
        [2, S2 * (c + t)],
        [1, S2 * (t - c)],
      ]);
      return {
        state: kron(pair, pair),
        obs: pauli("X0 X1 + Y0 Y1 + Z0 Z1 + X2 X3 + Y2 Y3 + Z2 Z3", 4),
      };
    }
  }
}

export interface CoverageResult extends CoverageCase {
  seeds: number;
  covered: number;
  /** Mean interval half-width relative to the exact standard error of the mean. */
  widthRatio: number;
  exact: number;
}

/** Runs `seeds` seeded repetitions (seeds first, first + 1, …) and counts covering intervals. */
export async function coverage(
  c: CoverageCase,
  seeds: number,
  first = 1,
  split: SamplingOptions["split"] = "optimal",
): Promise<CoverageResult> {
  const { state: st, obs } = caseSetup(c.family, c.a);
  const prepared: PreparedState = { kind: "statevector", state: st };
  const exact = weightedTotal(obs.sum, pauliExpectationsOnState(st, obs.sum));
  let covered = 0;
  let width = 0;
  for (let seed = first; seed < first + seeds; seed++) {
    const out = await sampleObservable(prepared, obs, {
      shots: c.shots,
      targetPrecision: null,
      split,
      readout: c.mitigated ? READOUT : { e0: 0, e1: 0 },
      mitigate: c.mitigated,
      seed,
    });
    const e = c.mitigated ? out.mitigated! : out.sampled;
    if (e.ci95[0] <= exact && exact <= e.ci95[1]) covered++;
    width += (e.ci95[1] - e.ci95[0]) / 2;
  }
  return { ...c, seeds, covered, widthRatio: width / seeds, exact };
}

/** Binomial standard error of a coverage fraction p over `seeds` repetitions. */
export function coverageSe(p: number, seeds: number): number {
  return Math.sqrt((p * (1 - p)) / seeds);
}
