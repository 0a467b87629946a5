/**
 * Form ⇄ request for the per-qubit and per-gate parts of the noise model
 * (`noise.readout.qubits`, `noise.gates`, `noise.idle`; semantics in README "Noise model").
 * Text fields like the rest of the run builder; blank means "not set".
 */
import type { EstimateRequest } from "@/lib/quantum/schemas";

type Noise = NonNullable<EstimateRequest["noise"]>;

export type ReadoutRow = { qubit: string; p1Given0: string; p0Given1: string };
export type GateNoiseRow = {
  name: string;
  depolarizing: string;
  amplitudeDamping: string;
  phaseDamping: string;
};
export type IdleNoiseValues = {
  depolarizing: string;
  amplitudeDamping: string;
  phaseDamping: string;
};

export type AdvancedNoiseValues = {
  perQubit: ReadoutRow[];
  gates: GateNoiseRow[];
  idle: IdleNoiseValues;
};

export const EMPTY_ADVANCED_NOISE: AdvancedNoiseValues = {
  perQubit: [],
  gates: [],
  idle: { depolarizing: "", amplitudeDamping: "", phaseDamping: "" },
};

const CHANNELS = ["depolarizing", "amplitudeDamping", "phaseDamping"] as const;
const str = (x: number | undefined) => (typeof x === "number" ? String(x) : "");

type Num = (path: string, text: string, kind?: "int" | "real") => number | undefined;
type Issue = { path: string; message: string };

/** Adds readout.qubits, gates and idle to `noise` (form paths in issues, e.g. noise.gates.0.name). */
export function advancedNoiseToRequest(
  v: AdvancedNoiseValues,
  noise: Noise,
  num: Num,
  issues: Issue[],
): void {
  const qubits: NonNullable<NonNullable<Noise["readout"]>["qubits"]> = {};
  v.perQubit.forEach((row, i) => {
    const q = num(`noise.perQubit.${i}.qubit`, row.qubit, "int");
    if (row.qubit.trim() === "")
      issues.push({ path: `noise.perQubit.${i}.qubit`, message: "give the qubit (0, 1, …)" });
    const rates: { p1Given0?: number; p0Given1?: number } = {};
    const a = num(`noise.perQubit.${i}.p1Given0`, row.p1Given0);
    const b = num(`noise.perQubit.${i}.p0Given1`, row.p0Given1);
    if (a !== undefined) rates.p1Given0 = a;
    if (b !== undefined) rates.p0Given1 = b;
    if (q !== undefined) qubits[String(q)] = rates;
  });
  if (Object.keys(qubits).length > 0) noise.readout = { ...noise.readout, qubits };
  const gates: NonNullable<Noise["gates"]> = {};
  v.gates.forEach((row, i) => {
    const name = row.name.trim();
    if (name === "")
      issues.push({
        path: `noise.gates.${i}.name`,
        message: "give the gate name as written (e.g. cx)",
      });
    const o: { depolarizing?: number; amplitudeDamping?: number; phaseDamping?: number } = {};
    for (const k of CHANNELS) {
      const x = num(`noise.gates.${i}.${k}`, row[k]);
      if (x !== undefined) o[k] = x;
    }
    if (name !== "") gates[name] = o;
  });
  if (Object.keys(gates).length > 0) noise.gates = gates;
  const idle: { depolarizing?: number; amplitudeDamping?: number; phaseDamping?: number } = {};
  for (const k of CHANNELS) {
    const x = num(`noise.idle.${k}`, v.idle[k]);
    if (x !== undefined && x !== 0) idle[k] = x;
  }
  if (Object.keys(idle).length > 0) noise.idle = idle;
}

export function advancedNoiseFromRequest(noise: Noise | undefined): AdvancedNoiseValues {
  return {
    perQubit: Object.entries(noise?.readout?.qubits ?? {}).map(([qubit, r]) => ({
      qubit,
      p1Given0: str(r.p1Given0),
      p0Given1: str(r.p0Given1),
    })),
    gates: Object.entries(noise?.gates ?? {}).map(([name, o]) => ({
      name,
      depolarizing: str(o.depolarizing),
      amplitudeDamping: str(o.amplitudeDamping),
      phaseDamping: str(o.phaseDamping),
    })),
    idle: {
      depolarizing: str(noise?.idle?.depolarizing),
      amplitudeDamping: str(noise?.idle?.amplitudeDamping),
      phaseDamping: str(noise?.idle?.phaseDamping),
    },
  };
}

/** True when the advanced part acts on the state (per-gate or idle rates above 0). */
export function advancedStateNoise(v: AdvancedNoiseValues): boolean {
  const pos = (t: string) => Number(t) > 0;
  return (
    v.gates.some((g) => CHANNELS.some((k) => pos(g[k]))) || CHANNELS.some((k) => pos(v.idle[k]))
  );
}
