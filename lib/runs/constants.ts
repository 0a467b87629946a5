/**
 * Run vocabulary shared by the zod schemas, the worker and the UI: the stored values
 * (defined beside the table, db/schema/run-enums.ts) and the one set of labels the
 * pages show for them. Dependency-free so client components may import it.
 */
import type { RunMethod, RunStatus } from "@/db/schema/run-enums";

export {
  RUN_METHODS,
  RUN_NAME_MAX,
  RUN_STATUSES,
  SHOT_PLAN_SOURCES,
  type RunMethod,
  type RunStatus,
  type ShotPlanSource,
} from "@/db/schema/run-enums";

export const TERMINAL_RUN_STATUSES = [
  "succeeded",
  "failed",
  "canceled",
] as const satisfies readonly RunStatus[];
export type TerminalRunStatus = (typeof TERMINAL_RUN_STATUSES)[number];

export function isTerminalStatus(status: RunStatus): status is TerminalRunStatus {
  return (TERMINAL_RUN_STATUSES as readonly string[]).includes(status);
}

/** How the pages name each status (badges, filters, messages). */
export const RUN_STATUS_LABELS: Record<RunStatus, string> = {
  queued: "Queued",
  running: "Running",
  succeeded: "Succeeded",
  failed: "Failed",
  canceled: "Canceled",
};

/** How the pages name each simulation method (form, lists, run page, quota messages). */
export const RUN_METHOD_LABELS: Record<RunMethod, string> = {
  statevector: "Statevector",
  density_matrix: "Density matrix",
};

/** Most runs the compare page shows side by side (the runs list's selection and the page's own limit). */
export const MAX_COMPARE = 6;
