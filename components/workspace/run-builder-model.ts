/**
 * The run builder's form values and their translation into an engine request.
 *
 * Numbers stay text while the user types (so "0." or an empty field are not lost and
 * drafts round-trip exactly); `toRequest` converts them and reports a field-level issue
 * for text that is not a number. Field names mirror the request's paths (circuit.source,
 * noise.readout.p1Given0, parameters.theta, …) so the shared schema's issues land on the
 * right field; `formPath` maps the few that differ.
 */
import { pauliTermsToText } from "@/lib/quantum/observable/pauli-terms-text";
import {
  advancedNoiseFromRequest,
  advancedNoiseToRequest,
  EMPTY_ADVANCED_NOISE,
  type AdvancedNoiseValues,
} from "./noise-advanced-model";
import type { EstimateRequest } from "@/lib/quantum/schemas";

export type Budget = "exact" | "shots" | "precision";

export type SweepAxis = { name: string; from: string; to: string; points: string };

export type RunBuilderValues = {
  name: string;
  circuit: { format: "qasm2" | "qasm3"; source: string };
  observable: { format: "pauli" | "matrix"; terms: string; matrixText: string };
  method: "statevector" | "density_matrix";
  budget: Budget;
  shots: string;
  targetPrecision: string;
  shotSplit: "optimal" | "even";
  seed: string;
  mitigateReadout: boolean;
  noiseEnabled: boolean;
  noise: {
    depolarizing1q: string;
    depolarizing2q: string;
    amplitudeDamping: string;
    phaseDamping: string;
    readout: { p1Given0: string; p0Given1: string };
  } & AdvancedNoiseValues;
  parameters: Record<string, string>;
  sweepAxes: SweepAxis[];
  /** Explicit bindings as JSON, `[{"theta": 0.1}, …]` (blank: none); exclusive with sweepAxes. */
  pointsText: string;
  gradient: boolean;
};

export const STARTER_QASM = `OPENQASM 2.0;
include "qelib1.inc";
qreg q[2];
h q[0];
cx q[0], q[1];
ry(0.6) q[1];
`;

export const DEFAULT_VALUES: RunBuilderValues = {
  name: "",
  circuit: { format: "qasm2", source: STARTER_QASM },
  observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X0 X1", matrixText: "" },
  method: "statevector",
  budget: "shots",
  shots: "4000",
  targetPrecision: "0.0016",
  shotSplit: "optimal",
  seed: "",
  mitigateReadout: false,
  noiseEnabled: false,
  noise: {
    depolarizing1q: "",
    depolarizing2q: "",
    amplitudeDamping: "",
    phaseDamping: "",
    readout: { p1Given0: "", p0Given1: "" },
    ...EMPTY_ADVANCED_NOISE,
  },
  parameters: {},
  sweepAxes: [],
  pointsText: "",
  gradient: false,
};

/** Reads the points text: a JSON array of objects mapping input names to numbers. */
export function parsePointsText(text: string): Record<string, number>[] | string {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    return `not valid JSON (${e instanceof Error ? e.message : "parse error"})`;
  }
  if (!Array.isArray(data) || data.some((p) => !p || typeof p !== "object" || Array.isArray(p)))
    return 'expected a list of bindings, e.g. [{"theta": 0.1}, {"theta": 0.2}]';
  return data as Record<string, number>[];
}

export type FormIssue = { path: string; message: string };

/** Evenly spaced values from `from` to `to` inclusive (n ≥ 2), or [from] when n = 1. */
export function linspace(from: number, to: number, n: number): number[] {
  if (n <= 1) return [from];
  return Array.from({ length: n }, (_, i) =>
    i === n - 1 ? to : from + ((to - from) * i) / (n - 1),
  );
}

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

/** Text → number; null for blank; NaN for anything that is not a plain decimal number. */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\u2212/g, "-");
  if (t === "") return null;
  return NUMBER.test(t) ? Number(t) : Number.NaN;
}

type Build = { request: EstimateRequest; name: string; issues: FormIssue[] };

/** Reads the matrix observable text: JSON `{ "real": [[…]], "imag": [[…]] }` or a bare real matrix `[[…]]`. */
export function parseMatrixText(text: string): { real: number[][]; imag?: number[][] } | string {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    return `not valid JSON (${e instanceof Error ? e.message : "parse error"})`;
  }
  if (Array.isArray(data)) return { real: data as number[][] };
  if (data && typeof data === "object" && "real" in data) {
    const d = data as { real: number[][]; imag?: number[][] };
    return d.imag === undefined ? { real: d.real } : { real: d.real, imag: d.imag };
  }
  return 'expected { "real": [[…]], "imag": [[…]] } or a real matrix [[…]]';
}

/**
 * Form values → engine request (not yet schema-checked) plus the issues found while
 * converting text to numbers. Fields that do not apply (noise when off, the budget not
 * chosen, swept parameters) are left out.
 */
export function toRequest(v: RunBuilderValues, inputNames?: readonly string[]): Build {
  const issues: FormIssue[] = [];
  const num = (path: string, text: string, kind: "int" | "real" = "real"): number | undefined => {
    const x = parseNumber(text);
    if (x === null) return undefined;
    if (Number.isNaN(x)) {
      issues.push({ path, message: "not a number" });
      return undefined;
    }
    if (kind === "int" && !Number.isInteger(x)) {
      issues.push({ path, message: "must be a whole number" });
      return undefined;
    }
    return x;
  };

  const observable: EstimateRequest["observable"] =
    v.observable.format === "pauli"
      ? { format: "pauli", terms: v.observable.terms }
      : (() => {
          const m = parseMatrixText(v.observable.matrixText);
          if (typeof m === "string") {
            issues.push({ path: "observable.matrixText", message: m });
            return { format: "matrix" as const, real: [[0]] };
          }
          return { format: "matrix" as const, ...m };
        })();

  const request: EstimateRequest = {
    circuit: { format: v.circuit.format, source: v.circuit.source },
    observable,
  };
  if (v.method !== "statevector") request.method = v.method;

  if (v.budget === "shots") {
    const shots = num("shots", v.shots, "int");
    if (shots === undefined && !issues.some((i) => i.path === "shots"))
      issues.push({ path: "shots", message: "give the number of shots" });
    if (shots !== undefined) request.shots = shots;
  } else if (v.budget === "precision") {
    const eps = num("targetPrecision", v.targetPrecision);
    if (eps === undefined && !issues.some((i) => i.path === "targetPrecision")) {
      issues.push({ path: "targetPrecision", message: "give the target standard error" });
    }
    if (eps !== undefined) request.targetPrecision = eps;
  }
  if (v.budget !== "exact") {
    if (v.shotSplit !== "optimal") request.shotSplit = v.shotSplit;
    const seed = num("seed", v.seed, "int");
    if (seed !== undefined) request.seed = seed;
    if (v.mitigateReadout) request.mitigateReadout = true;
  }

  if (v.noiseEnabled) {
    const n = v.noise;
    const noise: NonNullable<EstimateRequest["noise"]> = {};
    const keys = ["depolarizing1q", "depolarizing2q", "amplitudeDamping", "phaseDamping"] as const;
    for (const k of keys) {
      const x = num(`noise.${k}`, n[k]);
      if (x !== undefined && x !== 0) noise[k] = x;
    }
    const p10 = num("noise.readout.p1Given0", n.readout.p1Given0);
    const p01 = num("noise.readout.p0Given1", n.readout.p0Given1);
    if ((p10 ?? 0) !== 0 || (p01 ?? 0) !== 0) {
      noise.readout = {};
      if (p10 !== undefined && p10 !== 0) noise.readout.p1Given0 = p10;
      if (p01 !== undefined && p01 !== 0) noise.readout.p0Given1 = p01;
    }
    advancedNoiseToRequest(n, noise, num, issues);
    if (Object.keys(noise).length) request.noise = noise;
  }

  const swept = new Set(v.sweepAxes.map((a) => a.name).filter(Boolean));
  const names = inputNames ?? Object.keys(v.parameters);
  if (v.circuit.format === "qasm3" && names.length) {
    const params: Record<string, number> = {};
    for (const name of names) {
      if (swept.has(name)) continue;
      const x = num(`parameters.${name}`, v.parameters[name] ?? "");
      if (x === undefined) {
        if (!issues.some((i) => i.path === `parameters.${name}`))
          issues.push({ path: `parameters.${name}`, message: "give a value" });
      } else params[name] = x;
    }
    if (Object.keys(params).length) request.parameters = params;
  }
  if (v.circuit.format === "qasm3" && v.sweepAxes.length) {
    const sweep: Record<string, number[]> = {};
    v.sweepAxes.forEach((a, i) => {
      const from = num(`sweepAxes.${i}.from`, a.from);
      const to = num(`sweepAxes.${i}.to`, a.to);
      const points = num(`sweepAxes.${i}.points`, a.points, "int");
      if (!a.name) issues.push({ path: `sweepAxes.${i}.name`, message: "choose a parameter" });
      if (from === undefined || to === undefined || points === undefined) {
        for (const [k, x] of [
          ["from", from],
          ["to", to],
          ["points", points],
        ] as const) {
          if (x === undefined && !issues.some((j) => j.path === `sweepAxes.${i}.${k}`))
            issues.push({ path: `sweepAxes.${i}.${k}`, message: "required" });
        }
        return;
      }
      if (points < 1 || points > 200) {
        issues.push({ path: `sweepAxes.${i}.points`, message: "between 1 and 200 points" });
        return;
      }
      if (a.name) sweep[a.name] = linspace(from, to, points);
    });
    if (Object.keys(sweep).length) request.sweep = sweep;
  }
  if (v.circuit.format === "qasm3" && v.pointsText.trim()) {
    const points = parsePointsText(v.pointsText);
    if (typeof points === "string") issues.push({ path: "pointsText", message: points });
    else request.points = points;
  }
  if (v.circuit.format === "qasm3" && v.gradient) request.gradient = true;
  return { request, name: v.name.trim(), issues };
}

/** Maps a request path (from the shared schema or the API) to the form field showing it. */
export function formPath(requestPath: string, sweptNames: readonly string[] = []): string {
  if (requestPath.startsWith("observable.real") || requestPath.startsWith("observable.imag"))
    return "observable.matrixText";
  if (requestPath === "observable" || requestPath.startsWith("observable.format"))
    return "observable.terms";
  if (
    requestPath === "points" ||
    requestPath.startsWith("points.") ||
    requestPath.startsWith("points[")
  )
    return "pointsText";
  if (requestPath === "gradient") return "gradient";
  if (requestPath.startsWith("sweep")) {
    const name = requestPath.split(".")[1];
    const i = sweptNames.indexOf(name);
    return i >= 0 ? `sweepAxes.${i}.name` : "sweepAxes";
  }
  const m = /^parameters\.([^.]+)/.exec(requestPath);
  if (m) {
    const i = sweptNames.indexOf(m[1]);
    return i >= 0 ? `sweepAxes.${i}.name` : `parameters.${m[1]}`;
  }
  if (requestPath.startsWith("noise.readout.qubits")) return "noise.perQubit";
  if (requestPath.startsWith("noise.gates")) return "noise.gates";
  if (requestPath.startsWith("noise.idle.")) return requestPath.split(".").slice(0, 3).join(".");
  if (requestPath.startsWith("noise.readout.")) return requestPath.split(".").slice(0, 3).join(".");
  if (requestPath.startsWith("noise.")) return requestPath.split(".").slice(0, 2).join(".");
  if (requestPath === "(root)" || requestPath === "") return "root";
  return requestPath;
}

const str = (x: number | undefined | null) =>
  typeof x === "number" && Number.isFinite(x) ? String(x) : "";

/**
 * A request (e.g. of an earlier run) → form values, for "run again with changes".
 * A sweep becomes ranges when its values are evenly spaced; otherwise its first and last
 * values with the same number of points.
 */
export function fromRequest(req: EstimateRequest, name = ""): RunBuilderValues {
  const noise = req.noise;
  const sweepAxes: SweepAxis[] = Object.entries(req.sweep ?? {})
    .slice(0, 2)
    .map(([n, values]) => ({
      name: n,
      from: str(values[0]),
      to: str(values[values.length - 1]),
      points: String(values.length),
    }));
  const budget: Budget =
    req.targetPrecision !== undefined ? "precision" : (req.shots ?? 0) > 0 ? "shots" : "exact";
  return {
    ...DEFAULT_VALUES,
    name,
    circuit: { format: req.circuit.format, source: req.circuit.source },
    observable:
      req.observable.format === "pauli"
        ? { format: "pauli", terms: req.observable.terms, matrixText: "" }
        : req.observable.format === "terms"
          ? { format: "pauli", terms: pauliTermsToText(req.observable.terms), matrixText: "" }
          : {
              format: "matrix",
              terms: DEFAULT_VALUES.observable.terms,
              matrixText: JSON.stringify(
                req.observable.imag
                  ? { real: req.observable.real, imag: req.observable.imag }
                  : { real: req.observable.real },
              ),
            },
    method: req.method ?? "statevector",
    budget,
    shots: budget === "shots" ? String(req.shots) : DEFAULT_VALUES.shots,
    targetPrecision:
      budget === "precision" ? String(req.targetPrecision) : DEFAULT_VALUES.targetPrecision,
    shotSplit: req.shotSplit ?? "optimal",
    seed: str(req.seed),
    mitigateReadout: !!req.mitigateReadout,
    noiseEnabled: !!noise && Object.keys(noise).length > 0,
    noise: {
      depolarizing1q: str(noise?.depolarizing1q),
      depolarizing2q: str(noise?.depolarizing2q),
      amplitudeDamping: str(noise?.amplitudeDamping),
      phaseDamping: str(noise?.phaseDamping),
      readout: { p1Given0: str(noise?.readout?.p1Given0), p0Given1: str(noise?.readout?.p0Given1) },
      ...advancedNoiseFromRequest(noise),
    },
    parameters: Object.fromEntries(
      Object.entries(req.parameters ?? {}).map(([k, v]) => [k, String(v)]),
    ),
    sweepAxes,
    pointsText: req.points ? JSON.stringify(req.points) : "",
    gradient: !!req.gradient,
  };
}
