/**
 * A run's export files as the API serves them (`GET /api/v1/runs/:id/<file>`) and
 * the run page downloads them: terms.csv, counts.csv, points.csv (sweep grid or
 * list of points) and circuits.zip. The bytes come from the same functions the
 * page uses (./run-export.ts, ./measurement-circuits.ts).
 *
 * A run that is still queued or running answers 409 (the file will exist once it
 * has succeeded); a run that failed or was canceled, or that has no such data
 * (no shots → no counts, no sweep → no points, an eigenbasis-measured matrix →
 * no Pauli circuits), answers 404 — each with a problem naming the reason.
 *
 * A finished run never changes, so circuits.zip (the one export that costs real work: every
 * setting's circuit text, deflated) is kept per run and finish time in a cache bounded by bytes.
 */
import "server-only";
import { LRUCache } from "lru-cache";
import type { Run } from "@/db/schema";
import { ProblemError } from "@/lib/api/problem";
import { isEngineError } from "@/lib/quantum/errors";
import type { EstimateRequest, EstimateResult } from "@/lib/quantum/schemas";
import { MIME } from "./download";
import { measurementCircuitsZip } from "./measurement-circuits";
import { countsCsv, fileStem, sweepCsv, termsCsv } from "./run-export";

export const RUN_FILES = ["terms.csv", "counts.csv", "points.csv", "circuits.zip"] as const;
export type RunFileName = (typeof RUN_FILES)[number];

export type RunFile = { fileName: string; contentType: string; body: string | Uint8Array };

const notYet = (run: Run) =>
  new ProblemError({
    type: "/problems/run-not-finished",
    title: "Run not finished",
    status: 409,
    detail: `The run is ${run.status}; its exports exist once it has succeeded. Wait for it (GET /api/v1/runs/${run.id}?wait=30) and ask again.`,
  });

const unavailable = (detail: string) =>
  new ProblemError({
    type: "/problems/export-unavailable",
    title: "No such export for this run",
    status: 404,
    detail,
  });

const zipCache = new LRUCache<string, Uint8Array>({
  maxSize: 64 * 1024 * 1024,
  sizeCalculation: (bytes) => Math.max(1, bytes.length),
});

function circuitsZip(run: Run, result: EstimateResult): Uint8Array | null {
  const key = `${run.id}:${run.finishedAt?.getTime() ?? 0}`;
  const hit = zipCache.get(key);
  if (hit) return hit;
  const zip = measurementCircuitsZip(run, run.request as EstimateRequest, result);
  if (zip) zipCache.set(key, zip);
  return zip;
}

export function buildRunFile(run: Run, file: RunFileName): RunFile {
  if (run.status === "queued" || run.status === "running") throw notYet(run);
  const result = run.result as EstimateResult | null;
  if (run.status !== "succeeded" || !result)
    throw unavailable(`The run ${run.status}; only succeeded runs have exports.`);
  const stem = fileStem(run.name, run.id);
  switch (file) {
    case "terms.csv":
      return { fileName: `${stem}-terms.csv`, contentType: MIME.csv, body: termsCsv(result) };
    case "counts.csv":
      if (!result.groups.some((g) => g.counts && Object.keys(g.counts).length)) {
        throw unavailable(
          "The run drew no shots at its main point, so it has no counts (submit it with `shots` > 0).",
        );
      }
      return { fileName: `${stem}-counts.csv`, contentType: MIME.csv, body: countsCsv(result) };
    case "points.csv":
      if (!result.sweep)
        throw unavailable(
          "The run has no sweep or list of points; points.csv is for runs with `sweep` or `points`.",
        );
      return {
        fileName: `${stem}-points.csv`,
        contentType: MIME.csv,
        body: sweepCsv(result.sweep),
      };
    case "circuits.zip": {
      let zip: Uint8Array | null;
      try {
        zip = circuitsZip(run, result);
      } catch (error) {
        if (isEngineError(error) && error.code === "too_large")
          throw new ProblemError({
            type: "/problems/export-too-large",
            title: "Export too large",
            status: 422,
            detail: `The circuits cannot be exported as one archive: ${error.message}. Export fewer settings by grouping the observable's terms, or rebuild the circuits from terms.csv.`,
          });
        if (isEngineError(error))
          throw unavailable(`The circuits could not be exported: ${error.message}`);
        throw error;
      }
      if (!zip)
        throw unavailable(
          "This observable is measured in its eigenbasis; there are no Pauli measurement circuits to export.",
        );
      return { fileName: `${stem}-circuits.zip`, contentType: MIME.zip, body: zip };
    }
  }
}

/** The file as an HTTP answer: its media type and `Content-Disposition: attachment` with the page's file name. */
export function runFileResponse(file: RunFile): Response {
  const body = typeof file.body === "string" ? file.body : new Uint8Array(file.body);
  return new Response(body, {
    status: 200,
    headers: {
      "content-type": file.contentType,
      "content-disposition": `attachment; filename="${file.fileName}"`,
      "cache-control": "private, no-store",
    },
  });
}
