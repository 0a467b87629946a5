/**
 * Browser client of Ketwise's REST API v1 (client only). Every request names the
 * organisation in `X-Ketwise-Org` — the session cookie authenticates, the header makes
 * the tenant explicit, so a cached SWR key (which includes the org id) can never be
 * answered for another organisation. Failures arrive as RFC 9457 problem documents and
 * are thrown as `ApiError` with the field errors (path, message, line, column) intact.
 */

import {
  problemSchema,
  type ProblemDocument,
  type ProblemFieldError,
} from "@/lib/api/problem-schema";

export type ApiFieldError = ProblemFieldError;

export class ApiError extends Error {
  readonly status: number;
  readonly title: string;
  readonly type: string;
  readonly errors: ApiFieldError[];
  /** The parsed JSON body of the answer (extension members of a problem, e.g. the preview's outline). */
  readonly body: unknown;
  constructor(p: Omit<ProblemDocument, "type"> & { type?: string }, body: unknown = null) {
    super(p.detail || p.title);
    this.name = "ApiError";
    this.status = p.status;
    this.title = p.title;
    this.type = p.type ?? "about:blank";
    this.errors = p.errors ?? [];
    this.body = body;
  }
  /** Field errors whose dotted path equals `path` or lies under it. */
  errorsAt(path: string): ApiFieldError[] {
    return this.errors.filter((e) => e.path === path || e.path.startsWith(`${path}.`));
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

/** A failed answer as ApiError: its problem document when the body is one, else a generic message. */
async function toApiError(res: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // Not JSON (proxy page, crash): fall through to a generic message.
  }
  const problem = problemSchema.safeParse(body);
  if (problem.success) return new ApiError({ ...problem.data, status: res.status }, body);
  return new ApiError(
    {
      status: res.status,
      title: res.statusText || "Request failed",
      detail: `The server answered ${res.status}.`,
    },
    body,
  );
}

export type ApiInit = Omit<RequestInit, "body"> & { json?: unknown };

/** fetch → parsed JSON, or throws ApiError (also for network failures, status 0). */
export async function apiFetch<T>(orgId: string, path: string, init: ApiInit = {}): Promise<T> {
  const headers = new Headers(init.headers);
  headers.set("accept", "application/json");
  if (orgId) headers.set("x-ketwise-org", orgId);
  let body: BodyInit | undefined;
  if (init.json !== undefined) {
    headers.set("content-type", "application/json");
    body = JSON.stringify(init.json);
  }
  let res: Response;
  try {
    res = await fetch(path, { ...init, headers, body, credentials: "same-origin" });
  } catch (e) {
    if (e instanceof DOMException && e.name === "AbortError") throw e;
    throw new ApiError({
      status: 0,
      title: "Network error",
      detail: "Could not reach Ketwise. Check your connection and try again.",
    });
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

/** fetch → the answer's bytes and its `Content-Disposition` file name (exports), or throws ApiError. */
export async function apiFetchFile(
  orgId: string,
  path: string,
): Promise<{ bytes: ArrayBuffer; type: string; fileName: string | null }> {
  const headers = new Headers();
  if (orgId) headers.set("x-ketwise-org", orgId);
  let res: Response;
  try {
    res = await fetch(path, { headers, credentials: "same-origin" });
  } catch {
    throw new ApiError({
      status: 0,
      title: "Network error",
      detail: "Could not reach Ketwise. Check your connection and try again.",
    });
  }
  if (!res.ok) throw await toApiError(res);
  const fileName =
    /filename="([^"]+)"/.exec(res.headers.get("content-disposition") ?? "")?.[1] ?? null;
  return {
    bytes: await res.arrayBuffer(),
    type: res.headers.get("content-type") ?? "application/octet-stream",
    fileName,
  };
}

/** SWR fetcher for keys of the form [orgId, path]. */
export function orgFetcher<T>([orgId, path]: readonly [string, string, ...unknown[]]): Promise<T> {
  return apiFetch<T>(orgId, path);
}

/** Builds "/path?x=1&y=2", skipping empty values. */
export function withQuery(
  path: string,
  params: Record<string, string | number | null | undefined>,
): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params))
    if (v !== null && v !== undefined && v !== "") q.set(k, String(v));
  const s = q.toString();
  return s ? `${path}?${s}` : path;
}
