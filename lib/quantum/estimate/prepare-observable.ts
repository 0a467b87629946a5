/**
 * The request's observable over the circuit's n qubits: a padded Pauli sum with its
 * measurement settings, or a validated Hermitian matrix (dimension 2^n) with its
 * eigendecomposition (computed once; needed for eigenbasis sampling and the spectrum).
 */
import { plural } from "../../format/plural";
import { EngineError } from "../errors";
import { groupQubitWise, type MeasurementSetting } from "../observable/grouping";
import { hermitianEigen } from "../observable/hermitian-eigen";
import { parseMatrixObservable, type HermitianMatrix } from "../observable/matrix-observable";
import { parsePauliSum } from "../observable/pauli-parse";
import { parsePauliTerms } from "../observable/pauli-terms";
import { highestQubit, padPauliSum } from "../observable/pauli-word";
import type { PreparedObservable } from "../sampling/sample-observable";
import type { EstimateRequest } from "../schemas";
import type { PauliSum } from "../types";

export type ObservableShape =
  | { kind: "pauli"; sum: PauliSum; settings: MeasurementSetting[] }
  | { kind: "matrix"; matrix: HermitianMatrix };

/** Parsed, checked observable without the (costly) eigendecomposition — for previews. */
export function parseObservableForCircuit(
  input: EstimateRequest["observable"],
  n: number,
): ObservableShape {
  if (input.format === "matrix") return { kind: "matrix", matrix: parseMatrixObservable(input, n) };
  if (input.format === "terms") return termsForCircuit(input.terms, n);
  return pauliForCircuit(input.terms, n);
}

/** A JSON term list over the circuit's n qubits; problems point at observable.terms[i].pauli. */
function termsForCircuit(terms: unknown, n: number): ObservableShape {
  const parsed = parsePauliTerms(terms);
  const fail = (entry: number, message: string): never => {
    throw new EngineError("observable_invalid", `observable.terms[${entry}].pauli: ${message}`, [
      {
        path: ["observable", "terms", entry, "pauli"],
        message: `observable.terms[${entry}].pauli: ${message}`,
      },
    ]);
  };
  if (parsed.denseLength !== null && parsed.denseLength !== n) {
    fail(
      parsed.denseEntry ?? 0,
      `dense Pauli words need one letter per qubit: they have ${parsed.denseLength} letters but the circuit has ${plural(n, "qubit")}`,
    );
  }
  if (parsed.numQubits > n) {
    let worst = 0;
    parsed.terms.forEach((t, i) => {
      if (highestQubit(t) > highestQubit(parsed.terms[worst])) worst = i;
    });
    fail(
      parsed.entries[worst],
      `observable acts on qubit ${highestQubit(parsed.terms[worst])} but the circuit has ${plural(n, "qubit")}`,
    );
  }
  const sum = padPauliSum(parsed, n);
  return { kind: "pauli", sum, settings: groupQubitWise(sum) };
}

/** The observable ready for estimation (matrix observables get their eigendecomposition). */
export function prepareObservable(
  input: EstimateRequest["observable"],
  n: number,
): PreparedObservable {
  const shape = parseObservableForCircuit(input, n);
  return shape.kind === "matrix" ? { ...shape, eigen: hermitianEigen(shape.matrix) } : shape;
}

function pauliForCircuit(terms: string, n: number): ObservableShape {
  const parsed = parsePauliSum(terms);
  if (parsed.denseLength !== null && parsed.denseLength !== n) {
    const at = parsed.denseAt ?? { line: 1, column: 1 };
    const message = `dense Pauli words need one letter per qubit: they have ${parsed.denseLength} letters but the circuit has ${plural(n, "qubit")}`;
    throw new EngineError("observable_invalid", message, [
      { path: ["observable", "terms"], message, line: at.line, column: at.column },
    ]);
  }
  if (parsed.numQubits > n) {
    let worst = 0;
    parsed.terms.forEach((t, i) => {
      if (highestQubit(t) > highestQubit(parsed.terms[worst])) worst = i;
    });
    const q = Math.max(highestQubit(parsed.terms[worst]), parsed.numQubits - 1);
    const at = parsed.origins[worst];
    const message = `observable acts on qubit ${q} but the circuit has ${plural(n, "qubit")}`;
    throw new EngineError("observable_invalid", message, [
      { path: ["observable", "terms"], message, line: at.line, column: at.column },
    ]);
  }
  const sum = padPauliSum(parsed, n);
  return { kind: "pauli", sum, settings: groupQubitWise(sum) };
}
