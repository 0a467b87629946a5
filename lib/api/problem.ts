/**
 * RFC 9457 "Problem Details for HTTP APIs": the one error shape Ketwise answers
 * with — `{ type, title, status, detail, errors? }`, media type
 * `application/problem+json`. `type` is a relative URI `/problems/<slug>`.
 *
 * Expected failures are thrown as `ProblemError` anywhere in the service layer
 * and turned into a response (route handlers) or form state (server actions)
 * at the edge. Anything else is logged with an id and answered generically.
 */
import { ZodError } from "zod";
import { applyRateLimitHeaders, type RateLimitState } from "@/lib/rate-limit/headers";
import type { ProblemDocument, ProblemFieldError } from "./problem-schema";

export type { ProblemDocument, ProblemFieldError } from "./problem-schema";

/** The document (lib/api/problem-schema.ts) plus what the response carries beside it. */
export type Problem = ProblemDocument & {
  /** Extension members (RFC 9457 §3.2) sent in the body beside the common fields. */
  extensions?: Record<string, unknown>;
  /** Seconds, for 429 answers; sent as the Retry-After header, not in the body. */
  retryAfter?: number;
  /** The rate budget that refused the request (429s); sent as RateLimit-* headers, not in the body. */
  rateLimit?: RateLimitState;
};

export const PROBLEM_CONTENT_TYPE = "application/problem+json";

/** A typed, expected failure that carries its problem document. */
export class ProblemError extends Error {
  readonly problem: Problem;
  constructor(problem: Problem) {
    super(problem.detail);
    this.name = "ProblemError";
    this.problem = problem;
  }
  get status(): number {
    return this.problem.status;
  }
}

export function isProblemError(error: unknown): error is ProblemError {
  return error instanceof ProblemError;
}

function make(
  status: number,
  slug: string,
  title: string,
  detail: string,
  errors?: ProblemFieldError[],
) {
  return new ProblemError({
    type: `/problems/${slug}`,
    title,
    status,
    detail,
    ...(errors ? { errors } : {}),
  });
}

export const badRequest = (detail: string, errors?: ProblemFieldError[]) =>
  make(400, "bad-request", "Bad request", detail, errors);
export const validationFailed = (detail: string, errors: ProblemFieldError[]) =>
  make(422, "validation-failed", "Validation failed", detail, errors);
export const unauthorized = (
  detail = "Sign in, or send an API key as `Authorization: Bearer kw_…`.",
) => make(401, "unauthorized", "Not signed in", detail);
export const sessionExpired = () =>
  make(
    401,
    "session-expired",
    "Session expired",
    "Your session has expired. Sign in again to continue.",
  );
export const forbidden = (detail: string) => make(403, "forbidden", "Not allowed", detail);
export const notFound = (detail = "No such resource in this organisation.") =>
  make(404, "not-found", "Not found", detail);
export const conflict = (detail: string, errors?: ProblemFieldError[]) =>
  make(409, "conflict", "Conflict", detail, errors);
export function tooManyRequests(detail: string, retryAfterSeconds: number): ProblemError {
  const error = make(429, "rate-limited", "Too many requests", detail);
  error.problem.retryAfter = Math.max(1, Math.ceil(retryAfterSeconds));
  return error;
}
export const internalError = (errorId: string) =>
  make(
    500,
    "internal",
    "Internal error",
    `Something went wrong on our side (error id ${errorId}). Try again.`,
  );

/**
 * A field path as shown in problems: names joined by dots, list indices in brackets
 * (`observable.terms[3].pauli`, `noise.readout`); "(root)" for the whole body.
 */
export function formatFieldPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const seg of path) {
    if (typeof seg === "number") out += `[${seg}]`;
    else out += out === "" ? String(seg) : `.${String(seg)}`;
  }
  return out || "(root)";
}

/**
 * Field errors from a zod failure — the one converter, for API answers and form state
 * alike. `path` as formatFieldPath writes it; an unknown key gets an entry of its own
 * at its own path, so the client can point at it.
 */
export function zodFieldErrors(error: ZodError): ProblemFieldError[] {
  return error.issues.flatMap((issue) =>
    issue.code === "unrecognized_keys"
      ? issue.keys.map((key) => ({
          path: formatFieldPath([...issue.path, key]),
          message: "unknown field",
        }))
      : [{ path: formatFieldPath(issue.path), message: issue.message }],
  );
}

/** Serialises a problem as a Response with the right status, media type and headers. */
export function problemResponse(problem: Problem, init?: { headers?: HeadersInit }): Response {
  const { retryAfter, rateLimit, extensions, ...document } = problem;
  const body = { ...extensions, ...document };
  const headers = new Headers(init?.headers);
  headers.set("content-type", PROBLEM_CONTENT_TYPE);
  if (retryAfter !== undefined) headers.set("retry-after", String(retryAfter));
  if (rateLimit) applyRateLimitHeaders(headers, rateLimit);
  return new Response(JSON.stringify(body), { status: problem.status, headers });
}

/** A short random id that ties a generic 500 answer to its server log line. */
export function newErrorId(): string {
  return crypto.randomUUID().slice(0, 8);
}

/**
 * Maps any thrown value to a problem: ProblemError as is, ZodError as 422 with
 * field errors, anything else logged with an id and answered as a generic 500.
 */
export function toProblem(error: unknown, context = "request"): Problem {
  if (isProblemError(error)) return error.problem;
  if (error instanceof ZodError) {
    return validationFailed("The request does not match the schema.", zodFieldErrors(error))
      .problem;
  }
  const id = newErrorId();
  console.error(`[ketwise] unexpected error in ${context} (error id ${id})`, error);
  return internalError(id).problem;
}
