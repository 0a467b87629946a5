/**
 * Validation of a noise model: every given rate is a probability, a finite number in [0, 1];
 * per-qubit readout keys are qubit indices (non-negative integers, below the circuit's qubit
 * count when it is known). All bad fields are reported at once as EngineError
 * ("invalid_request") issues whose path names the field (e.g. ["noise", "gates", "cx",
 * "depolarizing"]).
 */
import { EngineError, type EngineIssue } from "../errors";
import type { NoiseModel } from "../types";
import { plural } from "../../format/plural";

const RATE_FIELDS = [
  "depolarizing1q",
  "depolarizing2q",
  "amplitudeDamping",
  "phaseDamping",
] as const;
const READOUT_FIELDS = ["p1Given0", "p0Given1"] as const;
const OVERRIDE_FIELDS = ["depolarizing", "amplitudeDamping", "phaseDamping"] as const;

function checkProbability(value: unknown, path: string[], issues: EngineIssue[]): void {
  if (value === undefined) return;
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0 || value > 1) {
    issues.push({
      path,
      message: `${path.join(".")} must be a probability between 0 and 1 (got ${String(value)})`,
    });
  }
}

/** Throws EngineError("invalid_request") naming every field that is not a probability or a valid qubit. */
export function validateNoiseModel(noise: NoiseModel | undefined, numQubits?: number): void {
  if (noise === undefined) return;
  const issues: EngineIssue[] = [];
  for (const f of RATE_FIELDS) checkProbability(noise[f], ["noise", f], issues);
  if (noise.readout !== undefined) {
    for (const f of READOUT_FIELDS)
      checkProbability(noise.readout[f], ["noise", "readout", f], issues);
    for (const [key, rates] of Object.entries(noise.readout.qubits ?? {})) {
      const path = ["noise", "readout", "qubits", key];
      if (!/^(0|[1-9][0-9]{0,5})$/.test(key)) {
        issues.push({
          path,
          message: `noise.readout.qubits: "${key}" is not a qubit index (write 0, 1, 2, …)`,
        });
      } else if (numQubits !== undefined && Number(key) >= numQubits) {
        issues.push({
          path,
          message: `noise.readout.qubits names qubit ${key} but the circuit has ${plural(numQubits, "qubit")}`,
        });
      }
      for (const f of READOUT_FIELDS) checkProbability(rates?.[f], [...path, f], issues);
    }
  }
  for (const [name, o] of Object.entries(noise.gates ?? {})) {
    for (const f of OVERRIDE_FIELDS) checkProbability(o?.[f], ["noise", "gates", name, f], issues);
  }
  for (const f of OVERRIDE_FIELDS) checkProbability(noise.idle?.[f], ["noise", "idle", f], issues);
  if (issues.length > 0) {
    throw new EngineError("invalid_request", issues.map((i) => i.message).join("; "), issues);
  }
}

/** The first field (as a path) of the model that acts on the state, or null (readout acts on outcomes only). */
export function stateNoiseField(noise: NoiseModel | undefined): string[] | null {
  if (!noise) return null;
  const global = RATE_FIELDS.find((f) => (noise[f] ?? 0) > 0);
  if (global) return ["noise", global];
  for (const [name, o] of Object.entries(noise.gates ?? {})) {
    const f = OVERRIDE_FIELDS.find((k) => (o?.[k] ?? 0) > 0);
    if (f) return ["noise", "gates", name, f];
  }
  const idle = OVERRIDE_FIELDS.find((k) => (noise.idle?.[k] ?? 0) > 0);
  return idle ? ["noise", "idle", idle] : null;
}

/** True when the model changes the state (readout error acts on outcomes only). */
export function hasStateNoise(noise: NoiseModel | undefined): boolean {
  return stateNoiseField(noise) !== null;
}
