/**
 * Ketwise's own worked example: an invented three-spin cluster (a chain of three spins
 * with Ising coupling, a longitudinal field, a transverse field and two three-body
 * terms; every coefficient made up for Ketwise) and a one-parameter ansatz for it.
 *
 * The ansatz `ry(θ) q[0]; cx q[0], q[1]; cx q[1], q[2]` prepares
 * cos(θ/2)|000⟩ + sin(θ/2)|111⟩ (qubit 0 first), on which ⟨Zᵢ⟩ = cos θ, ⟨ZᵢZⱼ⟩ = 1,
 * ⟨Xᵢ⟩ = 0, ⟨X0X1X2⟩ = sin θ and ⟨Y0Y1X2⟩ = −sin θ (Pauli algebra, common practice), so
 * along the ansatz E(θ) = c0 + 2J + 3h·cos θ + (k − m)·sin θ with the numbers below.
 *
 * The landing page, the sign-in panel, the new-run placeholder and the demo library all
 * show this model; `scripts/marketing-figures.ts` computes every figure they print with
 * the engine (requests below), and a unit test recomputes them.
 */
import type { EstimateRequest } from "@/lib/quantum";

export const CLUSTER = {
  /** Constant offset. */
  c0: 0.12,
  /** Ising coupling on the bonds 0–1 and 1–2. */
  J: -0.55,
  /** Longitudinal field on every spin. */
  h: 0.4,
  /** Transverse field on every spin. */
  g: 0.25,
  /** Three-body X0 X1 X2. */
  k: 0.7,
  /** Three-body Y0 Y1 X2. */
  m: -0.2,
} as const;

const n = (v: number) => (v < 0 ? `- ${-v}` : `+ ${v}`);
const { c0, J, h, g, k, m } = CLUSTER;

/** The cluster as Pauli-sum text (sparse words, qubit indices from 0). */
export const CLUSTER_TERMS = [
  `${c0}`,
  `${n(J)} Z0 Z1 ${n(J)} Z1 Z2`,
  `${n(h)} Z0 ${n(h)} Z1 ${n(h)} Z2`,
  `${n(g)} X0 ${n(g)} X1 ${n(g)} X2`,
  `${n(k)} X0 X1 X2 ${n(m)} Y0 Y1 X2`,
].join(" ");

/** The one-parameter ansatz (OpenQASM 3 with an `input angle`). */
export const CLUSTER_ANSATZ = [
  "OPENQASM 3.0;",
  'include "stdgates.inc";',
  "qubit[3] q;",
  "input angle theta;",
  "",
  "ry(theta) q[0];",
  "cx q[0], q[1];",
  "cx q[1], q[2];",
  "",
].join("\n");

/** The angle the landing page shows: near the ansatz minimum (θ ≈ −2.498), two decimals. */
export const SHOWN_THETA = -2.5;
export const SHOWN_SHOTS = 8192;
export const SHOWN_NOISE = { depolarizing2q: 0.01 } as const;
export const SHOWN_READOUT = { p1Given0: 0.02, p0Given1: 0.03 } as const;

const base = {
  circuit: { format: "qasm3", source: CLUSTER_ANSATZ },
  observable: { format: "pauli", terms: CLUSTER_TERMS },
} as const satisfies Partial<EstimateRequest>;

/** Every request whose answer the public pages print. Seeds fixed: same figures every time. */
export const FIGURE_REQUESTS = {
  /** Exact value and shot estimate at θ = SHOWN_THETA. */
  sampled: { ...base, parameters: { theta: SHOWN_THETA }, shots: SHOWN_SHOTS, seed: 2417 },
  /** The same under 1 % two-qubit depolarizing noise (density matrix). */
  noisy: {
    ...base,
    method: "density_matrix",
    parameters: { theta: SHOWN_THETA },
    noise: SHOWN_NOISE,
    shots: SHOWN_SHOTS,
    seed: 2417,
  },
  /** Noise plus readout error, read out with mitigation. */
  mitigated: {
    ...base,
    method: "density_matrix",
    parameters: { theta: SHOWN_THETA },
    noise: { ...SHOWN_NOISE, readout: SHOWN_READOUT },
    mitigateReadout: true,
    shots: SHOWN_SHOTS,
    seed: 2417,
  },
  /** The landscape: exact values on a fine grid of θ over [−π, π]. */
  curve: {
    ...base,
    sweep: { theta: Array.from({ length: 121 }, (_, i) => -Math.PI + (i * 2 * Math.PI) / 120) },
  },
  /** Thirteen sampled points across the same range (2,000 shots each). */
  points: {
    ...base,
    sweep: {
      theta: Array.from({ length: 13 }, (_, i) => -Math.PI + ((i + 0.5) * 2 * Math.PI) / 13),
    },
    shots: 2000,
    seed: 905,
  },
} satisfies Record<string, EstimateRequest>;
