/**
 * Request validation: the zod schema first (issues → EngineError "invalid_request" with
 * their paths), then the checks that need no parsing: method limits, gate noise only
 * with the density-matrix method, readout mitigation only with invertible assignment
 * matrices (p1Given0 + p0Given1 < 1). Defaults are applied here (statevector, 0 shots).
 */
import { EngineError, type EngineIssue } from "../errors";
import { stateNoiseField } from "../noise/validate";
import type { Readout } from "../sampling/readout";
import { estimateRequestSchema, type EstimateRequest } from "../schemas";
import type { NoiseModel } from "../types";

export interface NormalisedRequest {
  raw: EstimateRequest;
  method: "statevector" | "density_matrix";
  shots: number;
  targetPrecision: number | null;
  split: "optimal" | "even";
  noise: NoiseModel | undefined;
  readout: Readout;
  mitigate: boolean;
  parameters: Record<string, number>;
  sweep: Record<string, number[]> | null;
  points: Record<string, number>[] | null;
  gradient: boolean;
}

export function validateRequest(request: unknown): NormalisedRequest {
  const parsed = estimateRequestSchema.safeParse(request);
  if (!parsed.success) {
    const issues: EngineIssue[] = parsed.error.issues.flatMap((i) => {
      const path = i.path.map((p) => (typeof p === "number" ? p : String(p)));
      if (i.code === "unrecognized_keys")
        return i.keys.map((k) => ({ path: [...path, k], message: `unknown field "${k}"` }));
      if (i.code === "invalid_type" && /received undefined/.test(i.message))
        return [{ path, message: `${path.join(".") || "value"} is required` }];
      return [{ path, message: i.message }];
    });
    const first = issues[0];
    const where = first.path.length ? ` (at ${first.path.join(".")})` : "";
    throw new EngineError("invalid_request", `invalid request: ${first.message}${where}`, issues);
  }
  const raw = parsed.data;
  const method = raw.method ?? "statevector";
  const stateField = stateNoiseField(raw.noise);
  if (method === "statevector" && stateField !== null) {
    const message = `${stateField.join(".")} acts on the state and needs method "density_matrix" (the statevector method supports readout error only)`;
    throw new EngineError("unsupported", message, [{ path: stateField, message }]);
  }
  const readout = readoutOf(raw.noise?.readout);
  if (raw.mitigateReadout) checkInvertibleReadout(readout);
  return {
    raw,
    method,
    shots: raw.shots ?? 0,
    targetPrecision: raw.targetPrecision ?? null,
    split: raw.shotSplit ?? "optimal",
    noise: raw.noise,
    readout,
    mitigate: raw.mitigateReadout ?? false,
    parameters: raw.parameters ?? {},
    sweep: raw.sweep && Object.keys(raw.sweep).length > 0 ? raw.sweep : null,
    points: raw.points ?? null,
    gradient: raw.gradient ?? false,
  };
}

/** Readout rates: the defaults and, for qubits listed in `qubits`, their own (unset fields fall back). */
function readoutOf(r: NonNullable<EstimateRequest["noise"]>["readout"]): Readout {
  const e0 = r?.p1Given0 ?? 0;
  const e1 = r?.p0Given1 ?? 0;
  const entries = Object.entries(r?.qubits ?? {});
  if (entries.length === 0) return { e0, e1 };
  const qubits: ({ e0: number; e1: number } | undefined)[] = [];
  for (const [key, x] of entries)
    qubits[Number(key)] = { e0: x.p1Given0 ?? e0, e1: x.p0Given1 ?? e1 };
  return { e0, e1, qubits };
}

/**
 * Readout mitigation inverts each qubit's assignment matrix A = [[1−e0, e1], [e0, 1−e1]]
 * (determinant 1 − e0 − e1, readout.ts): refused ("infeasible", 422 at submission) when
 * p1Given0 + p0Given1 ≥ 1 for the default rates or any qubit's own.
 */
function checkInvertibleReadout(r: Readout): void {
  const rates: { e0: number; e1: number; path: (string | number)[] }[] = [
    { e0: r.e0, e1: r.e1, path: ["noise", "readout"] },
  ];
  r.qubits?.forEach((q, k) => {
    if (q) rates.push({ ...q, path: ["noise", "readout", "qubits", String(k)] });
  });
  const bad = rates.find((x) => x.e0 + x.e1 >= 1 - 1e-9);
  if (!bad) return;
  const why =
    Math.abs(bad.e0 + bad.e1 - 1) <= 1e-9
      ? "= 1: the assignment matrix is singular and the readout carries no information"
      : "> 1: the readout is more often wrong than right and the assignment matrix inverts the outcomes";
  const which = bad.path.length > 2 ? ` of qubit ${bad.path[3]}` : "";
  const message = `readout mitigation needs p1Given0 + p0Given1 < 1; here${which} ${bad.e0} + ${bad.e1} ${why}`;
  throw new EngineError("infeasible", message, [
    { path: ["mitigateReadout"], message },
    { path: [...bad.path, "p0Given1"], message },
  ]);
}
