/**
 * Validation of a noise model: every given rate is a probability, a finite number in [0, 1].
 * All bad fields are reported at once as EngineError("invalid_request") issues whose path
 * names the field (e.g. ["noise", "depolarizing1q"]).
 */
import { EngineError, type EngineIssue } from "../errors";
import type { NoiseModel } from "../types";

const RATE_FIELDS = ["depolarizing1q", "depolarizing2q", "amplitudeDamping", "phaseDamping"] as const;
const READOUT_FIELDS = ["p1Given0", "p0Given1"] as const;

function checkProbability(value: unknown, path: string[], issues: EngineIssue[]): void {
  if (value === undefined) return;
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0 || value > 1) {
    issues.push({ path, message: `${path.join(".")} must be a probability between 0 and 1 (got ${String(value)})` });
  }
}

/** Throws EngineError("invalid_request") naming every field that is not a probability. */
export function validateNoiseModel(noise: NoiseModel | undefined): void {
  if (noise === undefined) return;
  const issues: EngineIssue[] = [];
  for (const f of RATE_FIELDS) checkProbability(noise[f], ["noise", f], issues);
  if (noise.readout !== undefined) {
    for (const f of READOUT_FIELDS) checkProbability(noise.readout[f], ["noise", "readout", f], issues);
  }
  if (issues.length > 0) {
    throw new EngineError("invalid_request", issues.map((i) => i.message).join("; "), issues);
  }
}

/** True when the model changes the state (readout error acts on outcomes only). */
export function hasStateNoise(noise: NoiseModel | undefined): boolean {
  if (!noise) return false;
  return RATE_FIELDS.some((f) => (noise[f] ?? 0) > 0);
}
