/** Database rows → the API's run representations (lib/runs/schemas.ts). */
import type { Run } from "@/db/schema";
import type { EstimateRequest, EstimateResult } from "@/lib/quantum/schemas";
import type { RunListRow } from "./queries";
import type { RunSummaryView, RunView } from "./schemas";

type Common = Pick<
  Run,
  | "id"
  | "name"
  | "status"
  | "progress"
  | "phase"
  | "method"
  | "qubits"
  | "shots"
  | "shotsPlan"
  | "shotsDrawn"
  | "seed"
  | "createdByUserId"
  | "createdByApiKeyId"
  | "queuedAt"
  | "startedAt"
  | "finishedAt"
  | "parseMs"
  | "simulateMs"
  | "sampleMs"
  | "error"
>;

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const diff = (a: Date | null, b: Date | null) =>
  a && b ? Math.max(0, b.getTime() - a.getTime()) : null;

function common(row: Common) {
  return {
    id: row.id,
    name: row.name,
    status: row.status,
    progress: row.progress,
    phase: row.phase,
    method: row.method,
    qubits: row.qubits,
    shots: row.shots,
    shotsPlan: row.shotsPlan,
    shotsDrawn: row.shotsDrawn,
    seed: row.seed,
    createdBy: row.createdByApiKeyId
      ? { type: "api_key" as const, id: row.createdByApiKeyId }
      : row.createdByUserId
        ? { type: "user" as const, id: row.createdByUserId }
        : null,
    queuedAt: row.queuedAt.toISOString(),
    startedAt: iso(row.startedAt),
    finishedAt: iso(row.finishedAt),
    timings: {
      queueMs: diff(row.queuedAt, row.startedAt),
      runMs: diff(row.startedAt, row.finishedAt),
      parseMs: row.parseMs,
      simulateMs: row.simulateMs,
      sampleMs: row.sampleMs,
    },
    error: row.error ?? null,
  };
}

export function toRunView(row: Run): RunView {
  return {
    ...common(row),
    request: row.request as EstimateRequest,
    result: (row.result as EstimateResult | null) ?? null,
  };
}

const num = (v: string | number | null) => (v === null || v === undefined ? null : Number(v));

export function toRunSummary(row: RunListRow): RunSummaryView {
  const ideal = num(row.ideal);
  const exact = num(row.exact);
  return {
    ...common(row),
    summary:
      row.status === "succeeded" && ideal !== null && exact !== null
        ? { ideal, exact, sampledMean: num(row.sampledMean), sampledStdErr: num(row.sampledStdErr) }
        : null,
  };
}

/** Path of a run in the API (the `Location` of a submission). */
export const runPath = (id: string) => `/api/v1/runs/${id}`;
