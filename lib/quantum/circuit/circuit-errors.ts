/**
 * Error constructors of the circuit front end. Every problem with a circuit becomes an
 * EngineError whose single issue points into the request at ["circuit", "source"] with
 * a 1-based line and column. The issue message is the plain sentence; the error
 * message repeats it with the location, e.g. "unknown gate 'foo' (line 3, column 1)".
 */
import { EngineError, type EngineErrorCode } from "../errors";

export const SOURCE_PATH: (string | number)[] = ["circuit", "source"];

export interface Location {
  line: number;
  column: number;
}

/** Builds the EngineError for a problem at `at` in the circuit source. */
export function circuitError(code: EngineErrorCode, message: string, at: Location): EngineError {
  const line = Number.isFinite(at.line) && at.line > 0 ? at.line : 1;
  const column = Number.isFinite(at.column) && at.column > 0 ? at.column : 1;
  return new EngineError(code, `${message} (line ${line}, column ${column})`, [
    { path: SOURCE_PATH, message, line, column },
  ]);
}

export function syntaxError(message: string, at: Location): EngineError {
  return circuitError("qasm_syntax", message, at);
}

export function semanticError(message: string, at: Location): EngineError {
  return circuitError("qasm_semantic", message, at);
}

/** Prefix of every rejection of an OpenQASM 3 feature outside Ketwise's subset. */
export const QASM3_UNSUPPORTED = "not supported in Ketwise's OpenQASM 3 subset:";

export function unsupported3(what: string, at: Location): EngineError {
  return circuitError("qasm_semantic", `${QASM3_UNSUPPORTED} ${what}`, at);
}

/** Error about a request parameter value (bind time), pointing at ["parameters", name]. */
export function parameterError(name: string, message: string): EngineError {
  return new EngineError("invalid_request", message, [{ path: ["parameters", name], message }]);
}

/** English plural of the product's one formatting module: plural(2, "qubit") = "2 qubits". */
export { plural } from "../../format/plural";
