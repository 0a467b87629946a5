/**
 * Shot statistics: standard error of a ±1 outcome √((1−m²)/N)
 * (binomial, common practice); 95 % normal intervals cover the exact value in about
 * 95 % of runs (common practice; over 600 fixed seeds the binomial spread of the
 * coverage is ±0.9 %, so 95 ± 2.5 % is a 2.8σ band); Var = Σ_g Var_g/N_g with the
 * optimal split N_g ∝ √Var_g (J. R. McClean et al., New J. Phys. 18, 023023 (2016)).
 */
import { describe, expect, it } from "vitest";
import { densityFromState } from "@/lib/quantum/density-matrix/state";
import { hermitianEigen } from "@/lib/quantum/observable/hermitian-eigen";
import { matrixExpectationOnState } from "@/lib/quantum/observable/matrix-expectation";
import { parseMatrixObservable } from "@/lib/quantum/observable/matrix-observable";
import { sampleObservable } from "@/lib/quantum/sampling/sample-observable";
import { Z95 } from "@/lib/quantum/sampling/normal";
import type { StateVector } from "@/lib/quantum/types";
import { mulberry32, randomDensity, randomState } from "../observable/random-states";
import { betaVariance, exactValue, options, pauliObservable } from "./sampling-helpers";

/** cos(θ/2)|0⟩ + sin(θ/2)|1⟩: ⟨Z⟩ = cos θ. */
function ryState(theta: number): StateVector {
  return {
    n: 1,
    re: new Float64Array([Math.cos(theta / 2), Math.sin(theta / 2)]),
    im: new Float64Array(2),
  };
}

describe("standard error of a ±1 outcome", () => {
  it("reported stdErr is the Beta(k + 1, N − k + 1) posterior's (jstat), close to √((1 − m²)/N) for the exact m", async () => {
    const state = ryState(1.1);
    const m = Math.cos(1.1);
    const N = 10_000;
    const out = await sampleObservable(
      { kind: "statevector", state },
      pauliObservable("Z0", 1),
      options({ shots: N, seed: 5 }),
    );
    const k = Math.round(((1 + out.sampled.mean) / 2) * N); // shots that read +1
    // ⟨Z⟩ = 2p − 1 with p ~ Beta(k + 1, N − k + 1): sd(⟨Z⟩) = 2·sd(p)
    expect(out.sampled.stdErr).toBeCloseTo(2 * Math.sqrt(betaVariance(k + 1, N - k + 1)), 12);
    expect(out.terms[0].stdErr).toBeCloseTo(out.sampled.stdErr, 14);
    expect(Math.abs(out.sampled.stdErr / Math.sqrt((1 - m * m) / N) - 1)).toBeLessThan(0.03);
    // many shots: the t quantile is close to the normal 1.96 (common practice)
    const half = (out.sampled.ci95[1] - out.sampled.ci95[0]) / 2;
    expect(Math.abs(half / (Z95 * out.sampled.stdErr) - 1)).toBeLessThan(1e-3);
  });

  it("the spread of means over 300 seeds matches √((1−m²)/N) within 12 %", async () => {
    const state = ryState(0.7);
    const m = Math.cos(0.7);
    const N = 400;
    const means: number[] = [];
    for (let seed = 1; seed <= 300; seed++) {
      const out = await sampleObservable(
        { kind: "statevector", state },
        pauliObservable("Z0", 1),
        options({ shots: N, seed }),
      );
      means.push(out.sampled.mean);
    }
    const avg = means.reduce((a, b) => a + b, 0) / means.length;
    const sd = Math.sqrt(means.reduce((a, b) => a + (b - avg) ** 2, 0) / (means.length - 1));
    expect(Math.abs(sd / Math.sqrt((1 - m * m) / N) - 1)).toBeLessThan(0.12);
    expect(Math.abs(avg - m)).toBeLessThan(4 * Math.sqrt((1 - m * m) / N / 300));
  });
});

describe("95 % interval coverage over 600 fixed seeds", () => {
  it("Pauli sum with several settings on a random 3-qubit state", { timeout: 60_000 }, async () => {
    const state = randomState(3, mulberry32(31));
    const obs = pauliObservable("0.5 Z0 Z1 + 0.3 X0 + 0.2 Y1 Y2 - 0.4 X0 X1 + 0.25 Z2 + 0.7", 3);
    const exact = exactValue({ kind: "statevector", state }, obs);
    let covered = 0;
    for (let seed = 1; seed <= 600; seed++) {
      const out = await sampleObservable(
        { kind: "statevector", state },
        obs,
        options({ shots: 1500, seed }),
      );
      if (out.sampled.ci95[0] <= exact && exact <= out.sampled.ci95[1]) covered++;
    }
    expect(covered / 600).toBeGreaterThanOrEqual(0.925);
    expect(covered / 600).toBeLessThanOrEqual(0.975);
  });
});

describe("readout error and mitigation (common practice)", () => {
  const e0 = 0.06;
  const e1 = 0.12;
  const theta = 2.2;
  const m = Math.cos(theta);
  const expectedRead = e1 - e0 + (1 - e0 - e1) * m;

  it("⟨Z⟩_read = (e1 − e0) + (1 − e0 − e1)⟨Z⟩ in expectation; mitigation recovers ⟨Z⟩", async () => {
    const N = 200_000;
    const out = await sampleObservable(
      { kind: "statevector", state: ryState(theta) },
      pauliObservable("Z0", 1),
      options({ shots: N, seed: 77, readout: { e0, e1 }, mitigate: true }),
    );
    expect(Math.abs(out.sampled.mean - expectedRead)).toBeLessThan(4 * out.sampled.stdErr);
    expect(Math.abs(out.mitigated!.mean - m)).toBeLessThan(4 * out.mitigated!.stdErr);
    expect(out.mitigated!.stdErr).toBeGreaterThan(out.sampled.stdErr);
    expect(out.terms[0].mitigatedMean).toBeCloseTo(out.mitigated!.mean, 9);
  });

  it("the per-setting exact variance is that of the read ±1 variable: 1 − ⟨Z⟩_read²", async () => {
    const out = await sampleObservable(
      { kind: "statevector", state: ryState(theta) },
      pauliObservable("Z0", 1),
      options({ shots: 10, readout: { e0, e1 } }),
    );
    expect(out.groups[0].variance).toBeCloseTo(1 - expectedRead ** 2, 12);
  });

  it("multi-qubit parities: mitigation is unbiased over seeds (mean of 200 runs within 4σ)", async () => {
    const state = randomState(3, mulberry32(4));
    const obs = pauliObservable("Z0 Z1 Z2 + 0.5 X0 Y2 - 0.3 Z1", 3);
    const exact = exactValue({ kind: "statevector", state }, obs);
    let sum = 0;
    let varSum = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const out = await sampleObservable(
        { kind: "statevector", state },
        obs,
        options({ shots: 2000, seed, readout: { e0: 0.03, e1: 0.08 }, mitigate: true }),
      );
      sum += out.mitigated!.mean;
      varSum += out.mitigated!.stdErr ** 2;
    }
    expect(Math.abs(sum / 200 - exact)).toBeLessThan((4 * Math.sqrt(varSum)) / 200);
  });

  it("p1Given0 + p0Given1 = 1 cannot be mitigated", async () => {
    await expect(
      sampleObservable(
        { kind: "statevector", state: ryState(1) },
        pauliObservable("Z0", 1),
        options({ readout: { e0: 0.5, e1: 0.5 }, mitigate: true }),
      ),
    ).rejects.toThrow(/mitigation is impossible/);
  });
});

describe("shot split, seeds, convergence", () => {
  const state = randomState(3, mulberry32(12));
  const obs = pauliObservable("2 Z0 Z1 + 0.1 X0 X1 + 0.5 Y2 + 0.3 X2 Z0", 3);

  it("the same seed reproduces every figure; another seed differs", async () => {
    const a = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 3000, seed: 9 }),
    );
    const b = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 3000, seed: 9 }),
    );
    const c = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 3000, seed: 10 }),
    );
    expect(b).toEqual(a);
    expect(c.sampled.mean).not.toBe(a.sampled.mean);
  });

  it("optimal split is close to √Var_g with many shots (the posterior split adds the pseudo-shot term D/N², posterior-allocation.ts); even split is even; totals are exact", async () => {
    const opt = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 10_000 }),
    );
    const sd = opt.groups.map((g) => Math.sqrt(g.variance!));
    const tot = sd.reduce((a, b) => a + b, 0);
    opt.groups.forEach((g, k) =>
      expect(
        Math.abs(g.shots - (1 + ((10_000 - opt.groups.length) * sd[k]) / tot)),
      ).toBeLessThanOrEqual(20),
    );
    expect(opt.groups.reduce((a, g) => a + g.shots, 0)).toBe(10_000);
    const even = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 10_001, split: "even" }),
    );
    const counts = even.groups.map((g) => g.shots);
    expect(Math.max(...counts) - Math.min(...counts)).toBeLessThanOrEqual(1);
  });

  it("fewer shots than settings is rejected", async () => {
    await expect(
      sampleObservable({ kind: "statevector", state }, obs, options({ shots: 2 })),
    ).rejects.toThrow(/settings need shots ≥ 3/);
  });

  it("targetPrecision picks shots whose standard error lands near the target", async () => {
    const out = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: null, targetPrecision: 0.01, seed: 3 }),
    );
    expect(out.plan!.stateAware!.totalShots).toBe(out.sampled.shots);
    expect(out.sampled.stdErr).toBeLessThan(0.0105);
    expect(out.sampled.stdErr).toBeGreaterThan(0.009);
  });

  it("convergence points are increasing prefixes that end at the final estimate", async () => {
    const out = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 50_000, seed: 4 }),
    );
    const c = out.sampled.convergence;
    expect(c.length).toBeGreaterThan(10);
    for (let k = 1; k < c.length; k++) expect(c[k].shots).toBeGreaterThan(c[k - 1].shots);
    expect(c[c.length - 1]).toEqual({
      shots: 50_000,
      mean: out.sampled.mean,
      stdErr: out.sampled.stdErr,
      ci95: out.sampled.ci95,
    });
    expect(c[0].stdErr).toBeGreaterThan(c[c.length - 1].stdErr);
  });
});

describe("running estimates use a random shot order", () => {
  it("|+⟩ measured in Z: every checkpoint prefix is an unbiased sample (within 4.5σ of 0), though outcomes are drawn sorted", async () => {
    const out = await sampleObservable(
      { kind: "statevector", state: ryState(Math.PI / 2) },
      pauliObservable("Z0", 1),
      options({ shots: 200_000, seed: 13 }),
    );
    for (const c of out.sampled.convergence)
      expect(Math.abs(c.mean)).toBeLessThan(4.5 / Math.sqrt(c.shots));
  });
});

describe("other observables and states", () => {
  it("matrix observable sampled in its eigenbasis: outcomes are eigenvalues, mean within 4σ", async () => {
    const h = parseMatrixObservable({
      real: [
        [1, 0.5, 0, 0],
        [0.5, -1, 0.2, 0],
        [0, 0.2, 0.3, 0.1],
        [0, 0, 0.1, 2],
      ],
      imag: [
        [0, 0.3, 0, 0],
        [-0.3, 0, 0, 0],
        [0, 0, 0, -0.4],
        [0, 0, 0.4, 0],
      ],
    });
    const eigen = hermitianEigen(h);
    const state = randomState(2, mulberry32(6));
    const out = await sampleObservable(
      { kind: "statevector", state },
      { kind: "matrix", matrix: h, eigen },
      options({ shots: 40_000, seed: 8 }),
    );
    const exact = matrixExpectationOnState(state, h);
    expect(Math.abs(out.sampled.mean - exact)).toBeLessThan(4 * out.sampled.stdErr);
    expect(out.groups[0].eigenvalues).toEqual(Array.from(eigen.values));
    expect(out.groups[0].bases).toBe("eigenbasis");
    // eigenbasis count keys: outcome index k in binary, most significant digit first
    const fromCounts =
      Object.entries(out.groups[0].counts!).reduce(
        (a, [bits, c]) => a + c * eigen.values[parseInt(bits, 2)],
        0,
      ) / 40_000;
    expect(fromCounts).toBeCloseTo(out.sampled.mean, 9);
  });

  it("density-matrix sampling equals statevector sampling for a pure state (same seed)", async () => {
    const state = randomState(2, mulberry32(21));
    const obs = pauliObservable("Z0 Z1 + 0.4 X0 + 0.2 Y0 Y1", 2);
    const a = await sampleObservable(
      { kind: "statevector", state },
      obs,
      options({ shots: 5000, seed: 2 }),
    );
    const b = await sampleObservable(
      { kind: "density_matrix", rho: densityFromState(state) },
      obs,
      options({ shots: 5000, seed: 2 }),
    );
    expect(b.groups.map((g) => g.counts)).toEqual(a.groups.map((g) => g.counts));
  });

  it("mixed state: the 95 % interval covers the exact value in at least 90 % of 200 seeded runs (coarse)", async () => {
    const rho = randomDensity(2, mulberry32(50));
    const obs = pauliObservable("Z0 + 0.5 X0 X1 - 0.3 Y1", 2);
    const exact = exactValue({ kind: "density_matrix", rho }, obs);
    let covered = 0;
    for (let seed = 1; seed <= 200; seed++) {
      const out = await sampleObservable(
        { kind: "density_matrix", rho },
        obs,
        options({ shots: 1000, seed }),
      );
      if (out.sampled.ci95[0] <= exact && exact <= out.sampled.ci95[1]) covered++;
    }
    expect(covered / 200).toBeGreaterThanOrEqual(0.9);
  });

  it("identity-only observable: exact constant, zero error, no settings", async () => {
    const out = await sampleObservable(
      { kind: "statevector", state: ryState(1) },
      pauliObservable("2.5", 1),
      options({ shots: 100 }),
    );
    expect(out.sampled).toMatchObject({ mean: 2.5, stdErr: 0, shots: 0, settings: 0 });
  });
});
