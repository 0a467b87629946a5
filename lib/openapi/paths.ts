/**
 * The API v1 operations for the OpenAPI document: one entry per route
 * handler under app/api/v1, with the same zod schemas the handlers use.
 */
import type { OpenAPIRegistry, RouteConfig } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import {
  circuitCreateSchema,
  circuitPageSchema,
  circuitSchema,
  libraryListQuerySchema,
  observableCreateSchema,
  observablePageSchema,
  observableSchema,
} from "@/lib/library/schemas";
import { RUN_FILES } from "@/lib/export/run-files";
import {
  circuitPreviewRequestSchema,
  circuitPreviewSchema,
  previewProblemSchema,
  previewQuerySchema,
  runCreateSchema,
  runGetQuerySchema,
  runListQuerySchema,
  runPageSchema,
  runPreviewSchema,
  runSchema,
} from "@/lib/runs/schemas";
import { usageReportSchema } from "@/lib/usage/schemas";
import { problemSchema } from "./common-schemas";
import { bellRunExample } from "./examples";

const PROBLEM_TEXT: Record<number, string> = {
  400: "Bad request: malformed JSON or query, or the engine rejected the circuit or observable (with line and column)",
  401: "No, malformed, unknown or revoked API key, or no session",
  402: "Over a plan limit (qubits for the method, monthly shots or simulation-seconds)",
  403: "The key's or member's role is too weak",
  404: "No such item in this organisation",
  409: "Conflict with the item's current state (for exports: the run has not finished yet)",
  413: "Request body larger than the limit",
  415: "Body is not JSON",
  422: "Body does not match the schema (each field error with its path)",
  429: "Rate limit, or too many unfinished runs (see Retry-After)",
  503: "The job queue is unavailable; nothing was created",
};

/** Problem answers whose document is `schema` (problemSchema with extension members). */
function problemsAs(schema: z.ZodType, ...codes: number[]): RouteConfig["responses"] {
  return Object.fromEntries(
    codes.map((code) => [
      code,
      {
        description: PROBLEM_TEXT[code],
        content: { "application/problem+json": { schema } },
      },
    ]),
  );
}

function problems(...codes: number[]): RouteConfig["responses"] {
  return problemsAs(problemSchema, ...codes);
}

const json = <T extends z.ZodType>(schema: T, description: string) => ({
  description,
  content: { "application/json": { schema } },
});

const idParams = z.object({ id: z.uuid().describe("The item's id") });
const security: Record<string, string[]>[] = [{ bearerKey: [] }, { session: [] }];
const common = [401, 403, 429];

/** RateLimit-* fields (draft-ietf-httpapi-ratelimit-headers-06) on every answer of an authenticated request. */
const rateLimitHeaders = z.object({
  "ratelimit-limit": z.string().describe("Requests allowed per window for this key or user"),
  "ratelimit-remaining": z.string().describe("Requests left in the current window"),
  "ratelimit-reset": z.string().describe("Seconds until the window restarts"),
  "ratelimit-policy": z
    .string()
    .describe('The quota policy, e.g. "300;w=60" (300 requests per 60 s)'),
});
const retryAfterHeader = z.object({
  "retry-after": z.string().describe("Seconds to wait before trying again"),
});

function route(registry: OpenAPIRegistry, config: RouteConfig) {
  const responses: RouteConfig["responses"] = {};
  for (const [status, response] of Object.entries(config.responses)) {
    if (status === "401" || "$ref" in response) {
      responses[status] = response;
      continue;
    }
    const own = response.headers instanceof z.ZodObject ? response.headers.shape : {};
    const extra = status === "429" || status === "503" ? retryAfterHeader.shape : {};
    responses[status] = {
      ...response,
      headers: z.object({ ...rateLimitHeaders.shape, ...extra, ...own }),
    };
  }
  registry.registerPath({ security, ...config, responses });
}

const fileMedia: Record<string, { type: string; what: string }> = {
  "terms.csv": {
    type: "text/csv",
    what: "One row per Pauli term: pauli, coefficient, exact, sampled_mean, std_err, setting, setting_bases, ci95_low, ci95_high",
  },
  "counts.csv": {
    type: "text/csv",
    what: "One row per (measurement setting, bitstring): setting, setting_bases, bitstring (qubit 0 first), count, setting_shots",
  },
  "points.csv": {
    type: "text/csv",
    what: "One row per sweep grid point or `points` entry, in request order: the inputs, then ideal, exact, sampled_mean, std_err, shots; with `gradient`, d_exact_<input>, d_sampled_<input>, d_std_err_<input> per input and gradient_shots",
  },
  "circuits.zip": {
    type: "application/zip",
    what: "One OpenQASM 2.0 measurement circuit per Pauli setting (at the point the run's main figures describe) and a README.txt; 422 `export-too-large` when all circuits together would exceed 20 MB of text",
  },
};

export function registerPaths(registry: OpenAPIRegistry): void {
  route(registry, {
    method: "post",
    path: "/api/v1/runs",
    operationId: "createRun",
    tags: ["Runs"],
    summary: "Queue a run",
    description:
      "Validates the request, checks the plan's limits, stores the run as `queued` and answers 202 with its `Location`. " +
      "With an `Idempotency-Key`, a repeated request answers the original run; the same key with another body is 422.",
    request: {
      headers: z.object({
        "idempotency-key": z
          .string()
          .max(255)
          .optional()
          .describe("Makes retries safe: the same key returns the same run"),
      }),
      body: {
        required: true,
        content: { "application/json": { schema: runCreateSchema, example: bellRunExample } },
      },
    },
    responses: {
      202: {
        ...json(runSchema, "Queued (or the original run of a repeated Idempotency-Key)"),
        headers: z.object({ location: z.string().describe("URL of the run") }),
      },
      ...problems(400, 402, 413, 415, 422, 503, ...common),
    },
  });
  route(registry, {
    method: "get",
    path: "/api/v1/runs",
    operationId: "listRuns",
    tags: ["Runs"],
    summary: "List runs, newest first",
    request: { query: runListQuerySchema },
    responses: { 200: json(runPageSchema, "A page of runs"), ...problems(400, ...common) },
  });
  route(registry, {
    method: "post",
    path: "/api/v1/runs/preview",
    operationId: "previewRun",
    tags: ["Runs"],
    summary: "Preview a run without simulating it",
    description:
      "Parses the circuit and observable and answers at once: qubits, gate counts, depth, measurement settings, the shot plan for `targetPrecision`, whether the plan would accept the run now, and the circuit's `outline` (qubits, labels, inputs, the first 400 operations) for drawing it. " +
      "A failed preview's problem carries `outline` too whenever the circuit itself could be read, so a client can draw the circuit while the observable or the settings are still being written. " +
      "With `?only=circuit` the body is `{ circuit, parameters? }` and the answer is `{ outline }` alone; the circuit's errors answer 400 with line and column.",
    request: {
      query: previewQuerySchema,
      body: {
        required: true,
        content: {
          "application/json": {
            schema: z.union([runCreateSchema, circuitPreviewRequestSchema]),
            example: bellRunExample,
          },
        },
      },
    },
    responses: {
      200: json(
        z.union([runPreviewSchema, circuitPreviewSchema]),
        "The preview (with `?only=circuit`: the outline alone)",
      ),
      ...problemsAs(previewProblemSchema, 400, 422),
      ...problems(413, 415, ...common),
    },
  });
  route(registry, {
    method: "get",
    path: "/api/v1/runs/{id}",
    operationId: "getRun",
    tags: ["Runs"],
    summary: "Get a run; with ?wait=N, wait up to N seconds for it to finish",
    description:
      "With `wait`, the answer is held until the run is succeeded, failed or canceled (it is woken by the run's finish, not by polling) " +
      "or until N seconds have passed, then the run is answered as it is then. Loop on it instead of polling. " +
      "A server holds a bounded number of waiting requests; past that a wait answers at once.",
    request: { params: idParams, query: runGetQuerySchema },
    responses: { 200: json(runSchema, "The run"), ...problems(400, 404, ...common) },
  });
  for (const file of RUN_FILES) {
    const media = fileMedia[file];
    route(registry, {
      method: "get",
      path: `/api/v1/runs/{id}/${file}`,
      operationId: `getRun${file.replace(/\.(\w)/, (_m, c: string) => c.toUpperCase()).replace(/^\w/, (c) => c.toUpperCase())}`,
      tags: ["Runs"],
      summary: `Download ${file} of a succeeded run (the run page's file, same bytes)`,
      description: `${media.what}. 409 while the run is queued or running; 404 when it failed, was canceled or has no such data.`,
      request: { params: idParams },
      responses: {
        200: {
          description: `${file} (Content-Disposition: attachment)`,
          content: { [media.type]: { schema: z.string().describe(media.what) } },
        },
        ...(file === "circuits.zip"
          ? problems(404, 409, 422, ...common)
          : problems(404, 409, ...common)),
      },
    });
  }
  route(registry, {
    method: "post",
    path: "/api/v1/runs/{id}/cancel",
    operationId: "cancelRun",
    tags: ["Runs"],
    summary: "Cancel a queued or running run",
    request: { params: idParams },
    responses: { 200: json(runSchema, "The canceled run"), ...problems(404, 409, ...common) },
  });

  for (const kind of [
    {
      name: "circuits",
      tag: "Circuits",
      create: circuitCreateSchema,
      item: circuitSchema,
      page: circuitPageSchema,
      one: "circuit",
    },
    {
      name: "observables",
      tag: "Observables",
      create: observableCreateSchema,
      item: observableSchema,
      page: observablePageSchema,
      one: "observable",
    },
  ] as const) {
    const op = kind.one[0].toUpperCase() + kind.one.slice(1);
    route(registry, {
      method: "get",
      path: `/api/v1/${kind.name}`,
      operationId: `list${op}s`,
      tags: [kind.tag],
      summary: `List saved ${kind.name}, newest first`,
      request: { query: libraryListQuerySchema },
      responses: { 200: json(kind.page, `A page of ${kind.name}`), ...problems(400, ...common) },
    });
    route(registry, {
      method: "post",
      path: `/api/v1/${kind.name}`,
      operationId: `create${op}`,
      tags: [kind.tag],
      summary: `Save a ${kind.one} in the library`,
      request: {
        body: { required: true, content: { "application/json": { schema: kind.create } } },
      },
      responses: {
        201: json(kind.item, `The saved ${kind.one}`),
        ...problems(400, 409, 413, 415, 422, ...common),
      },
    });
    route(registry, {
      method: "get",
      path: `/api/v1/${kind.name}/{id}`,
      operationId: `get${op}`,
      tags: [kind.tag],
      summary: `Get a saved ${kind.one}`,
      request: { params: idParams },
      responses: { 200: json(kind.item, `The ${kind.one}`), ...problems(404, ...common) },
    });
    route(registry, {
      method: "delete",
      path: `/api/v1/${kind.name}/{id}`,
      operationId: `delete${op}`,
      tags: [kind.tag],
      summary: `Delete a saved ${kind.one}`,
      request: { params: idParams },
      responses: { 204: { description: "Deleted" }, ...problems(404, ...common) },
    });
  }

  route(registry, {
    method: "get",
    path: "/api/v1/usage",
    operationId: "getUsage",
    tags: ["Usage"],
    summary: "This period's usage against the plan's quotas",
    responses: { 200: json(usageReportSchema, "The usage report"), ...problems(...common) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/openapi.json",
    operationId: "getOpenApiDocument",
    tags: ["Meta"],
    summary: "This document",
    security: [],
    responses: {
      200: {
        description: "OpenAPI 3.1 document",
        content: { "application/json": { schema: z.record(z.string(), z.unknown()) } },
      },
    },
  });
}
