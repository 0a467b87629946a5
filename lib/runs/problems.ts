/**
 * Problems a run can end with (stored on the run and answered by the API):
 * the engine's own errors (400, with its message and field issues), the plan's
 * time limit, unreadable stored requests and exhausted infrastructure retries.
 */
import { formatFieldPath } from "@/lib/api/problem";
import type { EngineError } from "@/lib/quantum/errors";
import type { StoredProblem } from "@/db/schema";
import { plural } from "@/lib/format";

const ENGINE_TITLES: Record<string, string> = {
  qasm_syntax: "Circuit syntax error",
  qasm_semantic: "Circuit error",
  observable_syntax: "Observable syntax error",
  observable_invalid: "Invalid observable",
  not_hermitian: "Observable is not Hermitian",
  invalid_request: "Invalid request",
  too_large: "Too large to simulate",
  unsupported: "Not supported",
  infeasible: "Request cannot be carried out",
  canceled: "Canceled",
};

/**
 * The engine's error as a problem: its message, and each issue with dotted path and
 * line/column. 400, except 422 for a well-formed request that cannot be carried out
 * (`infeasible`: a precision no plan reaches, singular readout mitigation).
 */
export function engineProblem(
  error: Pick<EngineError, "code" | "message" | "issues">,
): StoredProblem {
  const errors = error.issues.map((issue) => ({
    path: formatFieldPath(issue.path),
    message: issue.message,
    ...(issue.line !== undefined ? { line: issue.line } : {}),
    ...(issue.column !== undefined ? { column: issue.column } : {}),
  }));
  return {
    type: `/problems/engine/${error.code.replace(/_/g, "-")}`,
    title: ENGINE_TITLES[error.code] ?? "Invalid request",
    status: error.code === "infeasible" ? 422 : 400,
    detail: error.message,
    ...(errors.length > 0 ? { errors } : {}),
  };
}

export function timeLimitProblem(planName: string, seconds: number): StoredProblem {
  return {
    type: "/problems/run-time-limit",
    title: "Run time limit reached",
    status: 422,
    detail: `The run was stopped after ${seconds} s, the longest a run may take on the ${planName} plan. Use fewer qubits, shots or sweep points, or a larger plan.`,
  };
}

export function malformedRunProblem(detail: string): StoredProblem {
  return {
    type: "/problems/run-malformed",
    title: "Run cannot be executed",
    status: 422,
    detail: `The stored request of this run is not valid any more (${detail}). Submit it again.`,
  };
}

export function infrastructureProblem(attempts: number, cause: string): StoredProblem {
  return {
    type: "/problems/run-infrastructure",
    title: "Run could not be completed",
    status: 503,
    detail: `The run could not be completed after ${plural(attempts, "attempt")}, for a reason on our side (${cause}). It used no quota; submit it again.`,
  };
}
