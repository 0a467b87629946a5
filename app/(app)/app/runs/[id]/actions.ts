"use server";
/**
 * `measurementCircuitsAction(runId)`: the OpenQASM 2.0 circuit of every measurement
 * setting of a succeeded run (the run's circuit, then the basis rotations and the
 * measurements), one file per setting, for the zip download. For a sweep the circuits
 * are those of the first grid point, which the run page's main figures describe.
 */
import { requireCurrentOrg } from "@/lib/auth/guards";
import { isProblemError } from "@/lib/api/problem";
import { measurementCircuitQasm, parseProgram } from "@/lib/quantum/circuit";
import { isEngineError } from "@/lib/quantum/errors";
import type { EstimateRequest, EstimateResult } from "@/lib/quantum/schemas";
import { getRunOrThrow } from "@/lib/runs/queries";

export type CircuitFile = { name: string; text: string };
export type CircuitFilesAnswer =
  { ok: true; files: CircuitFile[] } | { ok: false; message: string };

export async function measurementCircuitsAction(runId: string): Promise<CircuitFilesAnswer> {
  try {
    const access = await requireCurrentOrg("viewer");
    const run = await getRunOrThrow(access.org.id, String(runId));
    const request = run.request as EstimateRequest;
    const result = run.result as EstimateResult | null;
    if (run.status !== "succeeded" || !result)
      return { ok: false, message: "The run has no result yet." };
    const program = parseProgram(request.circuit.format, request.circuit.source);
    const params: Record<string, number> = { ...(request.parameters ?? {}) };
    for (const [name, values] of Object.entries(request.sweep ?? {})) params[name] = values[0];
    const settings = result.groups
      .map((g, i) => ({ ...g, index: i }))
      .filter((g) => /^[IXYZ]+$/.test(g.bases));
    if (!settings.length) {
      return {
        ok: false,
        message:
          "This observable is measured in its eigenbasis; there are no Pauli measurement circuits to export.",
      };
    }
    const width = String(settings.length - 1).length;
    return {
      ok: true,
      files: settings.map((g) => ({
        name: `setting-${String(g.index).padStart(width, "0")}-${g.bases}.qasm`,
        text: measurementCircuitQasm(program, params, g.bases),
      })),
    };
  } catch (error) {
    if (isProblemError(error)) return { ok: false, message: error.problem.detail };
    if (isEngineError(error)) return { ok: false, message: error.message };
    console.error("[ketwise] measurement circuit export failed", error);
    return { ok: false, message: "The circuits could not be exported." };
  }
}
