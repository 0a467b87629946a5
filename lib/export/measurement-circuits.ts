/**
 * The measurement circuits of a succeeded run as a zip: one OpenQASM 2.0 file per
 * Pauli measurement setting (the run's circuit, then the basis rotations and the
 * measurements) and a README. For a sweep or a list of points the circuits are
 * those of the point the run page's main figures describe (`sweep.topLevel`: the
 * lowest exact value; the first point on runs stored before that field).
 *
 * The archive's file times are the run's finish time, so the same run always
 * zips to the same bytes (the run page and `GET /api/v1/runs/:id/circuits.zip`
 * both serve this function's output). The circuit body is emitted once for all
 * settings, and the text of all files together is capped at `MAX_EXPORT_CHARS`:
 * 2,000 settings of a 100,000-gate circuit would otherwise be gigabytes.
 */
import { measurementCircuitsQasm, parseProgram } from "@/lib/quantum/circuit";
import type { EstimateRequest, EstimateResult } from "@/lib/quantum/schemas";
import { zipTextFiles, type TextFile } from "./zip";

/** Most text (all files together) a circuits export may hold: 20 MB. */
export const MAX_EXPORT_CHARS = 20_000_000;

/** The run's input bindings at its first point: `parameters`, then the first sweep value / first `points` entry. */
export function firstPointParams(request: EstimateRequest): Record<string, number> {
  const params: Record<string, number> = { ...(request.parameters ?? {}) };
  for (const [name, values] of Object.entries(request.sweep ?? {})) params[name] = values[0];
  const points = (request as { points?: Record<string, number>[] }).points;
  if (points?.length) Object.assign(params, points[0]);
  return params;
}

/** One file per Pauli setting; an empty list when the observable is measured in its eigenbasis. */
export function measurementCircuitFiles(
  request: EstimateRequest,
  result: EstimateResult,
): TextFile[] {
  const settings = result.groups
    .map((g, index) => ({ bases: g.bases, index }))
    .filter((g) => /^[IXYZ]+$/.test(g.bases));
  if (!settings.length) return [];
  const program = parseProgram(request.circuit.format, request.circuit.source);
  // the point the top-level figures describe (`sweep.topLevel`; point 0 on older runs)
  const top = result.sweep?.topLevel ? result.sweep.points[result.sweep.topLevel.index] : undefined;
  const params = top ? { ...(request.parameters ?? {}), ...top.params } : firstPointParams(request);
  const width = String(settings.length - 1).length;
  const texts = measurementCircuitsQasm(
    program,
    params,
    settings.map((g) => g.bases),
    MAX_EXPORT_CHARS,
  );
  return settings.map((g, k) => ({
    name: `setting-${String(g.index).padStart(width, "0")}-${g.bases}.qasm`,
    text: texts[k],
  }));
}

export function circuitsReadme(run: { id: string; name: string }): TextFile {
  return {
    name: "README.txt",
    text:
      `Measurement circuits of Ketwise run ${run.id} (${run.name}).\n` +
      `One OpenQASM 2.0 file per measurement setting; the file name carries the setting's bases, qubit 0 first.\n` +
      `Each circuit prepares the run's state, rotates every measured qubit into its basis (X: h; Y: sdg then h) and measures it.\n`,
  };
}

/** The zip bytes; null when there are no Pauli settings to export. */
export function measurementCircuitsZip(
  run: { id: string; name: string; finishedAt: Date | null },
  request: EstimateRequest,
  result: EstimateResult,
): Uint8Array | null {
  const files = measurementCircuitFiles(request, result);
  if (!files.length) return null;
  return zipTextFiles(
    [circuitsReadme(run), ...files],
    run.finishedAt ?? new Date(Date.UTC(1980, 0, 2)),
  );
}
