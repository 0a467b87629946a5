/**
 * The figures the public pages print about the invented three-spin cluster, computed by
 * the engine from the fixed, seeded requests of `three-spin-cluster.ts`.
 * `scripts/marketing-figures.ts` writes them to `example-figures.json`, which the pages
 * import; the unit test recomputes them and compares, so the printed numbers are the
 * engine's.
 */
import { estimate, type EstimateResult } from "@/lib/quantum";
import {
  FIGURE_REQUESTS,
  SHOWN_NOISE,
  SHOWN_READOUT,
  SHOWN_SHOTS,
  SHOWN_THETA,
} from "./three-spin-cluster";

export type ExampleFigures = {
  theta: number;
  qubits: number;
  terms: number;
  settings: number;
  shots: number;
  noise: { depolarizing2q: number; readout: { p1Given0: number; p0Given1: number } };
  exact: number;
  sampled: { mean: number; stdErr: number };
  noisy: { exact: number; mean: number; stdErr: number };
  mitigated: { mean: number; stdErr: number };
  /** Exact E(θ) on a fine grid over [−π, π]. */
  curve: { theta: number; exact: number }[];
  /** Sampled points with their standard errors over the same range. */
  points: { theta: number; mean: number; stdErr: number; shots: number }[];
};

function sampledOf(r: EstimateResult): { mean: number; stdErr: number } {
  if (!r.sampled) throw new Error("an example request asked for shots but got no sampled value");
  return { mean: r.sampled.mean, stdErr: r.sampled.stdErr };
}

export async function computeExampleFigures(): Promise<ExampleFigures> {
  const [sampled, noisy, mitigated, curve, points] = await Promise.all([
    estimate(FIGURE_REQUESTS.sampled),
    estimate(FIGURE_REQUESTS.noisy),
    estimate(FIGURE_REQUESTS.mitigated),
    estimate(FIGURE_REQUESTS.curve),
    estimate(FIGURE_REQUESTS.points),
  ]);
  if (!mitigated.mitigated) throw new Error("the mitigated example got no mitigated value");
  return {
    theta: SHOWN_THETA,
    qubits: sampled.qubits,
    terms: sampled.terms.length,
    settings: sampled.groups.length,
    shots: SHOWN_SHOTS,
    noise: { depolarizing2q: SHOWN_NOISE.depolarizing2q, readout: { ...SHOWN_READOUT } },
    exact: sampled.exact.value,
    sampled: sampledOf(sampled),
    noisy: { exact: noisy.exact.value, ...sampledOf(noisy) },
    mitigated: { mean: mitigated.mitigated.mean, stdErr: mitigated.mitigated.stdErr },
    curve: (curve.sweep?.points ?? []).map((p) => ({ theta: p.params.theta, exact: p.exact })),
    points: (points.sweep?.points ?? []).map(({ params, sampled: s }) => {
      if (!s) throw new Error("a sampled sweep point of the example has no sampled value");
      return { theta: params.theta, mean: s.mean, stdErr: s.stdErr, shots: s.shots };
    }),
  };
}
