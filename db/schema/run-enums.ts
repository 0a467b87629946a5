/**
 * The stored values of the runs table's enum columns. Dependency-free (no drizzle, no
 * lib/): the schema builds its columns from these, and lib/runs/constants.ts re-exports
 * them with their labels for the zod schemas, the worker and the UI.
 *
 * Lifecycle: queued → running → succeeded | failed | canceled; a queued run may also be
 * canceled (or failed, when it can never start).
 */
export const RUN_STATUSES = ["queued", "running", "succeeded", "failed", "canceled"] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export const RUN_METHODS = ["statevector", "density_matrix"] as const;
export type RunMethod = (typeof RUN_METHODS)[number];

/**
 * Where a run's planned shots come from: the request's `shots` ("fixed"), or the shot
 * plan for `targetPrecision` from the state's exact variances ("state_aware", the preview
 * simulated the state within its budget) or from worst-case bounds ("worst_case").
 */
export const SHOT_PLAN_SOURCES = ["fixed", "state_aware", "worst_case"] as const;
export type ShotPlanSource = (typeof SHOT_PLAN_SOURCES)[number];

/** Longest run name; the API, the form and the column agree on it. */
export const RUN_NAME_MAX = 120;
