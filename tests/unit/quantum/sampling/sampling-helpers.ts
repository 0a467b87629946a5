/** Helpers for the sampling tests: prepared observables and exact values. */
import { createRequire } from "node:module";
import { groupQubitWise } from "@/lib/quantum/observable/grouping";
import {
  pauliExpectationsOnDensity,
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import type {
  PreparedObservable,
  PreparedState,
  SamplingOptions,
} from "@/lib/quantum/sampling/sample-observable";

/** jstat (statistics reference library) has no type declarations. */
const jstat = createRequire(import.meta.url)("jstat") as {
  jStat: {
    chisquare: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
    beta: { variance(a: number, b: number): number };
  };
};
export const chiSquareInv = (p: number, dof: number): number => jstat.jStat.chisquare.inv(p, dof);
/** Variance of the Beta(a, b) distribution (jstat). */
export const betaVariance = (a: number, b: number): number => jstat.jStat.beta.variance(a, b);

export function pauliObservable(text: string, n: number): PreparedObservable & { kind: "pauli" } {
  const sum = padPauliSum(parsePauliSum(text), n);
  return { kind: "pauli", sum, settings: groupQubitWise(sum) };
}

export function exactValue(
  prepared: PreparedState,
  obs: PreparedObservable & { kind: "pauli" },
): number {
  const v =
    prepared.kind === "statevector"
      ? pauliExpectationsOnState(prepared.state, obs.sum)
      : pauliExpectationsOnDensity(prepared.rho, obs.sum);
  return weightedTotal(obs.sum, v);
}

export function options(over: Partial<SamplingOptions>): SamplingOptions {
  return {
    shots: 1000,
    targetPrecision: null,
    split: "optimal",
    readout: { e0: 0, e1: 0 },
    mitigate: false,
    seed: 1,
    ...over,
  };
}

/** Pearson's χ² statistic of observed counts against expected probabilities. */
export function chiSquare(counts: number[], probs: number[], total: number): number {
  let s = 0;
  probs.forEach((p, i) => {
    const e = p * total;
    s += (counts[i] - e) ** 2 / e;
  });
  return s;
}
