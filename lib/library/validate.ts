/**
 * Library items are checked by the engine before they are saved (a saved
 * circuit always parses, a saved observable is always Hermitian) and the
 * qubit count is kept for lists. Engine errors become 400 problems whose
 * field paths point into the library request (`source`, `terms`, `real`…).
 */
import { ProblemError } from "@/lib/api/problem";
import {
  isEngineError,
  parseMatrixObservable,
  parsePauliSum,
  parsePauliTerms,
  parseProgram,
} from "@/lib/quantum";
import { engineProblem } from "@/lib/runs/problems";
import type { CircuitCreateInput, ObservableCreateInput } from "./schemas";

function engineChecked<T>(work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (!isEngineError(error)) throw error;
    // Request paths are ["circuit", "source"] / ["observable", "terms"]; library bodies are flat.
    const issues = error.issues.map((i) => ({
      ...i,
      path: i.path[0] === "circuit" || i.path[0] === "observable" ? i.path.slice(1) : i.path,
    }));
    throw new ProblemError(engineProblem({ code: error.code, message: error.message, issues }));
  }
}

export function circuitQubits(input: Pick<CircuitCreateInput, "format" | "source">): number {
  return engineChecked(() => parseProgram(input.format, input.source).numQubits);
}

export function observableQubits(input: ObservableCreateInput): number {
  return engineChecked(() =>
    input.format === "pauli"
      ? parsePauliSum(input.terms).numQubits
      : input.format === "terms"
        ? parsePauliTerms(input.terms).numQubits
        : parseMatrixObservable({ real: input.real, imag: input.imag }).n,
  );
}
