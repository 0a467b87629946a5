/**
 * Client-side shapes of the REST API v1 resources the workspace reads: the runs
 * resource's and the engine's own zod-inferred types, imported as types only so no
 * schema or engine code is pulled into the browser bundle by this module.
 */
import type { EstimateRequest, EstimateResult, PreviewResult } from "@/lib/quantum/schemas";
import type { ProblemDocument } from "@/lib/api/problem-schema";
import type { pageSchema } from "@/lib/openapi/common-schemas";
import type {
  CircuitPreview,
  CircuitPreviewRequest,
  QuotaVerdict,
  RunCreateInput,
  RunPreview,
  RunListQuery,
  RunSummaryView,
  RunView,
} from "@/lib/runs/schemas";
import type {
  CircuitView,
  LibraryListQuery,
  ObservableView,
  circuitSummarySchema,
  observableSummarySchema,
} from "@/lib/library/schemas";
import type { UsageReport } from "@/lib/usage/schemas";
import type { z } from "zod";
import {
  RUN_STATUSES,
  TERMINAL_RUN_STATUSES,
  isTerminalStatus,
  type RunMethod,
  type RunStatus,
} from "@/lib/runs/constants";

export type {
  EstimateRequest,
  EstimateResult,
  PreviewResult,
  QuotaVerdict,
  RunCreateInput,
  RunMethod,
  RunStatus,
};
export { RUN_STATUSES, TERMINAL_RUN_STATUSES };

export const isTerminal = isTerminalStatus;

export type ApiProblem = ProblemDocument;

/** A run as `GET /api/v1/runs/:id` returns it. */
export type Run = RunView;

/** A row of `GET /api/v1/runs`. */
export type RunSummary = RunSummaryView;

/** A page of a list endpoint (`pageSchema` of the server). */
export type Page<T> = z.infer<ReturnType<typeof pageSchema<z.ZodType<T>>>>;

/** A list query as the client builds it: the server schema's fields, each optional; "" or null leaves one out. */
export type ClientQuery<Q> = { [K in keyof Q]?: Q[K] | "" | null };
/** `GET /api/v1/runs` query (runListQuerySchema). */
export type RunsQuery = ClientQuery<RunListQuery>;
/** `GET /api/v1/circuits` and `GET /api/v1/observables` query (libraryListQuerySchema). */
export type LibraryQuery = ClientQuery<LibraryListQuery>;

/** Library list rows (no source / terms) and full items (`GET /api/v1/circuits/:id` …). */
export type LibraryCircuitSummary = z.infer<typeof circuitSummarySchema>;
export type LibraryCircuit = CircuitView;
export type LibraryObservableSummary = z.infer<typeof observableSummarySchema>;
export type LibraryObservable = ObservableView;

/** `POST /api/v1/runs/preview`: the engine's preview, the plan's verdict and the circuit's outline. */
export type Preview = RunPreview;
/** `POST /api/v1/runs/preview?only=circuit`: the body and the answer. */
export type { CircuitPreview, CircuitPreviewRequest };

export type Usage = UsageReport;
