/**
 * Plain-language help for each noise probability (semantics in DEVELOPERS.md, "Noise model"; channel
 * forms from Nielsen & Chuang ch. 8) and a few starting profiles. The profiles are
 * invented round numbers for trying things out, not data of any device.
 */
import type { AdvancedNoiseValues } from "./noise-advanced-model";

export type NoiseKey =
  | "depolarizing1q"
  | "depolarizing2q"
  | "amplitudeDamping"
  | "phaseDamping"
  | "p1Given0"
  | "p0Given1";

export const NOISE_FIELDS: {
  key: NoiseKey;
  label: string;
  symbol: string;
  help: string;
  gate: boolean;
}[] = [
  {
    key: "depolarizing1q",
    label: "Depolarizing, 1-qubit gates",
    symbol: "p₁",
    help: "After every one-qubit gate (once per gate as written), with this probability the qubit is replaced by a completely random state: ρ → (1−p)ρ + p·I/2. Applied first, before damping.",
    gate: true,
  },
  {
    key: "depolarizing2q",
    label: "Depolarizing, multi-qubit gates",
    symbol: "p₂",
    help: "After every gate on two or more qubits (ccx or your own gate counts once), its qubits are replaced TOGETHER by a completely random joint state with this probability — one channel on the pair, not one per qubit. Applied first.",
    gate: true,
  },
  {
    key: "amplitudeDamping",
    label: "Amplitude damping",
    symbol: "γ",
    help: "Energy loss: after each gate (after depolarizing), every qubit it touches decays from 1 towards 0 with this probability. Untouched qubits do not decay (no idle noise).",
    gate: true,
  },
  {
    key: "phaseDamping",
    label: "Phase damping",
    symbol: "λ",
    help: "Loss of phase: after each gate (last of the three channels), superpositions on the touched qubits fade (coherences shrink by √(1−λ)).",
    gate: true,
  },
  {
    key: "p1Given0",
    label: "Readout: 1 when it was 0",
    symbol: "e₀",
    help: "Chance that a qubit in 0 is read as 1, the same for every qubit. Affects sampled outcomes only, never the exact value. Mitigation needs e₀ + e₁ < 1.",
    gate: false,
  },
  {
    key: "p0Given1",
    label: "Readout: 0 when it was 1",
    symbol: "e₁",
    help: "Chance that a qubit in 1 is read as 0, the same for every qubit. Affects sampled outcomes only, never the exact value. Mitigation needs e₀ + e₁ < 1.",
    gate: false,
  },
];

export type NoiseProfileValues = Record<NoiseKey, string>;

export type NoiseProfile = {
  id: string;
  name: string;
  values: NoiseProfileValues;
  /** Per-qubit readout, per-gate overrides and idle noise (saved profiles; none when absent). */
  advanced?: AdvancedNoiseValues;
  builtIn?: boolean;
};

/** Help for the per-qubit / per-gate part of the card (semantics: README "Noise model"). */
export const ADVANCED_NOISE_HELP = {
  perQubit:
    "Readout rates of one qubit (0 = the first qubit declared); blank fields use the rates above. Sampled outcomes only.",
  gates:
    "After every call of this gate, as written in the circuit (cx, a user gate, ctrl @ x), these rates replace the ones above: depolarizing of all its qubits together, then damping on each. Blank keeps the rate above.",
  idle: "Off unless set: after every gate, each qubit the gate does not touch gets the one-qubit depolarizing channel, then amplitude and phase damping, with these rates.",
};

export const BUILT_IN_PROFILES: NoiseProfile[] = [
  {
    id: "builtin:readout-only",
    name: "Readout only (2 % / 4 %)",
    builtIn: true,
    values: {
      depolarizing1q: "",
      depolarizing2q: "",
      amplitudeDamping: "",
      phaseDamping: "",
      p1Given0: "0.02",
      p0Given1: "0.04",
    },
  },
  {
    id: "builtin:light",
    name: "Light gate noise",
    builtIn: true,
    values: {
      depolarizing1q: "0.001",
      depolarizing2q: "0.01",
      amplitudeDamping: "0.0005",
      phaseDamping: "0.001",
      p1Given0: "0.01",
      p0Given1: "0.02",
    },
  },
  {
    id: "builtin:heavy",
    name: "Heavy gate noise",
    builtIn: true,
    values: {
      depolarizing1q: "0.005",
      depolarizing2q: "0.04",
      amplitudeDamping: "0.002",
      phaseDamping: "0.005",
      p1Given0: "0.03",
      p0Given1: "0.06",
    },
  },
];
