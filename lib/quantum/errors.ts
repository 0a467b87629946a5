/**
 * The engine's one typed error. Every bad input becomes an EngineError with a
 * machine code, a plain message and optional field issues (path, line, column),
 * which the API turns into an RFC 9457 problem (status 400 unless stated).
 */
export interface EngineIssue {
  /** JSON path into the request, e.g. ["circuit", "source"] or ["observable", "terms"]. */
  path: (string | number)[];
  message: string;
  line?: number;
  column?: number;
}

export type EngineErrorCode =
  | "qasm_syntax"
  | "qasm_semantic"
  | "observable_syntax"
  | "observable_invalid"
  | "not_hermitian"
  | "invalid_request"
  | "too_large"
  | "unsupported"
  /** Well-formed but impossible to carry out (unreachable precision, singular mitigation): 422. */
  | "infeasible"
  | "canceled";

export class EngineError extends Error {
  readonly code: EngineErrorCode;
  readonly issues: EngineIssue[];

  constructor(code: EngineErrorCode, message: string, issues: EngineIssue[] = []) {
    super(message);
    this.name = "EngineError";
    this.code = code;
    this.issues = issues;
  }
}

export function isEngineError(e: unknown): e is EngineError {
  return e instanceof EngineError;
}
