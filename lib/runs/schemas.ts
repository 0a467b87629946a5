/**
 * Zod schemas of the runs resource — ONE schema per request shape, shared by
 * the REST API, the browser forms and the OpenAPI document.
 *
 * The body of `POST /api/v1/runs` (and of `/runs/preview`) is the engine
 * request (lib/quantum/schemas.ts, strict: unknown fields are errors) plus an
 * optional `name`.
 */
import { z } from "zod";
import {
  estimateRequestSchema,
  estimateResultSchema,
  previewResultSchema,
  circuitOutlineSchema,
  type EstimateRequest,
} from "@/lib/quantum/schemas";
import { problemWith } from "@/lib/api/problem-schema";
import {
  cursorParamSchema,
  limitParamSchema,
  pageSchema,
  problemSchema,
  timestampSchema,
} from "@/lib/openapi/common-schemas";
import { nameSchema } from "@/lib/validation/names";
import { RUN_METHODS, RUN_NAME_MAX, RUN_STATUSES, SHOT_PLAN_SOURCES } from "./constants";

export const runNameSchema = nameSchema({
  max: RUN_NAME_MAX,
  empty: "the name is empty",
  tooLong: `at most ${RUN_NAME_MAX} characters`,
}).describe("A label for the run (default: derived from the circuit)");

export const runCreateSchema = estimateRequestSchema
  .safeExtend({ name: runNameSchema.optional() })
  .describe("A run to queue: the engine request plus an optional name");
export type RunCreateInput = z.infer<typeof runCreateSchema>;

/** The engine request inside a run body (everything but `name`). */
export function engineRequestOf(input: RunCreateInput): EstimateRequest {
  const request: Partial<RunCreateInput> = { ...input };
  delete request.name;
  return request as EstimateRequest;
}

/** `Idempotency-Key` header: printable ASCII, at most 255 characters. */
export const idempotencyKeySchema = z
  .string()
  .min(1)
  .max(255)
  .regex(/^[\x21-\x7e]+$/, "printable ASCII without spaces");

export const runStatusSchema = z.enum(RUN_STATUSES);
export const runMethodSchema = z.enum(RUN_METHODS);

export const runCreatorSchema = z
  .object({ type: z.enum(["user", "api_key"]), id: z.string() })
  .nullable()
  .describe("Who submitted the run (null once that user or key is deleted)");

export const runTimingsSchema = z.object({
  queueMs: z.number().nullable().describe("Queued → started"),
  runMs: z.number().nullable().describe("Started → finished"),
  parseMs: z.number().nullable(),
  simulateMs: z.number().nullable(),
  sampleMs: z.number().nullable(),
});

const runBase = {
  id: z.uuid(),
  name: z.string(),
  status: runStatusSchema,
  progress: z.number().min(0).max(1).describe("Fraction done, 0–1"),
  phase: z.string().nullable().describe("What the engine is doing now"),
  method: runMethodSchema,
  qubits: z.int(),
  shots: z
    .int()
    .describe(
      "Planned total shots over all sweep points (0 = exact only); the quota check reserved these",
    ),
  shotsPlan: z
    .enum(SHOT_PLAN_SOURCES)
    .nullable()
    .describe(
      'Where `shots` comes from: "fixed" (the request\'s shots), "state_aware" (targetPrecision planned from the state\'s exact variances at submission: what the run draws) or "worst_case" (targetPrecision planned from variance bounds: the run usually draws fewer); null for runs submitted before this was recorded',
    ),
  shotsDrawn: z
    .int()
    .nullable()
    .describe(
      "Shots the engine drew, once succeeded (billed; may differ from `shots` when planned from worst-case bounds)",
    ),
  seed: z
    .int()
    .describe("Seed of every sampled figure (the request's, or one chosen at submission)"),
  createdBy: runCreatorSchema,
  queuedAt: timestampSchema,
  startedAt: timestampSchema.nullable(),
  finishedAt: timestampSchema.nullable(),
  timings: runTimingsSchema,
  error: problemSchema.nullable().describe("Why the run failed or was canceled"),
};

export const runSummarySchema = z
  .object({
    ...runBase,
    summary: z
      .object({
        ideal: z.number(),
        exact: z.number(),
        sampledMean: z.number().nullable(),
        sampledStdErr: z.number().nullable(),
      })
      .nullable()
      .describe("Headline values of a succeeded run"),
  })
  .meta({ id: "RunSummary", description: "A run without its request and full result" });

export const runSchema = z
  .object({
    ...runBase,
    request: estimateRequestSchema,
    result: estimateResultSchema.nullable().describe("The engine's result once succeeded"),
  })
  .meta({ id: "Run", description: "A run with its request and, once succeeded, its result" });

export type RunView = z.infer<typeof runSchema>;
export type RunSummaryView = z.infer<typeof runSummarySchema>;

export const runListQuerySchema = z.strictObject({
  status: runStatusSchema.optional().describe("Only runs in this status"),
  method: runMethodSchema.optional().describe("Only runs of this simulation method"),
  q: z
    .string()
    .trim()
    .min(1)
    .max(120)
    .optional()
    .describe("Only runs whose name contains this text (case-insensitive)"),
  createdBy: z
    .string()
    .min(1)
    .max(36)
    .optional()
    .describe("Only runs submitted by this user id (or API key id)"),
  from: z.iso.date().optional().describe("Only runs queued on or after this day (YYYY-MM-DD, UTC)"),
  to: z.iso.date().optional().describe("Only runs queued on or before this day (YYYY-MM-DD, UTC)"),
  cursor: cursorParamSchema.optional(),
  limit: limitParamSchema,
});
export type RunListQuery = z.infer<typeof runListQuerySchema>;

/** `GET /api/v1/runs/:id?wait=N`: hold the answer up to N seconds until the run is terminal. */
export const runGetQuerySchema = z.strictObject({
  wait: z.coerce
    .number({ error: "a number of seconds, e.g. 20" })
    .min(0, "at least 0 seconds")
    .max(30, "at most 30 seconds")
    .optional()
    .describe(
      "Seconds (0–30) to hold the answer until the run is succeeded, failed or canceled; it answers as soon as the run finishes, " +
        "or with the run as it is when the time is up. Without it the run is answered at once.",
    ),
});
export type RunGetQuery = z.infer<typeof runGetQuerySchema>;

export const runPageSchema = pageSchema(runSummarySchema).describe("Runs, newest first");

export const quotaRefusalSchema = z.object({
  limit: z.enum(["max_qubits", "monthly_shots", "monthly_simulation_seconds", "unfinished_runs"]),
  status: z.union([z.literal(402), z.literal(429)]).describe("The status a submission would get"),
  detail: z.string(),
});

export const quotaVerdictSchema = z
  .object({
    allowed: z.boolean(),
    plan: z.object({ id: z.string(), name: z.string() }),
    period: z.string().describe("Billing period, YYYY-MM (UTC)"),
    shots: z.int().describe("Total shots the run would draw (all sweep points)"),
    refusals: z.array(quotaRefusalSchema),
  })
  .meta({
    id: "QuotaVerdict",
    description: "Whether the organisation's plan would accept this run now",
  });
export type QuotaVerdict = z.infer<typeof quotaVerdictSchema>;

export const runPreviewSchema = previewResultSchema
  .extend({
    quota: quotaVerdictSchema,
    outline: circuitOutlineSchema
      .nullable()
      .describe(
        "The circuit's outline, for drawing it (null when the circuit cannot be bound with its inputs that have no value set to 0)",
      ),
  })
  .describe(
    "Preview of a run (state-aware shot plan within a work budget) with the quota verdict and the circuit's outline",
  );
export type RunPreview = z.infer<typeof runPreviewSchema>;

/** `POST /api/v1/runs/preview?only=circuit`: check and outline the circuit alone. */
export const previewQuerySchema = z.strictObject({
  only: z
    .enum(["circuit"])
    .optional()
    .describe(
      'With "circuit": the body is `{ circuit, parameters? }` and the answer is the circuit\'s outline alone (for drawing a circuit before the rest of the run is written)',
    ),
});

export const circuitPreviewRequestSchema = z
  .strictObject({
    circuit: estimateRequestSchema.shape.circuit,
    parameters: estimateRequestSchema.shape.parameters,
  })
  .describe("A circuit to outline, with values for (some of) its inputs");
export type CircuitPreviewRequest = z.infer<typeof circuitPreviewRequestSchema>;

export const circuitPreviewSchema = z
  .object({ outline: circuitOutlineSchema })
  .describe("The circuit's outline (answer of ?only=circuit)");
export type CircuitPreview = z.infer<typeof circuitPreviewSchema>;

/** A failed preview: the problem, plus the outline whenever the circuit itself could be read. */
export const previewProblemSchema = problemWith({
  outline: circuitOutlineSchema
    .optional()
    .describe(
      "The circuit's outline, when the circuit itself is fine and the problem lies elsewhere (the observable, the shots, …)",
    ),
}).meta({
  id: "PreviewProblem",
  description:
    "RFC 9457 problem details of a preview, with the circuit's outline when it could be read",
});
