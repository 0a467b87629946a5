/**
 * Calls the API v1 route handlers in-process with real `Request` objects (the
 * handlers are exactly what Next.js serves), e.g.
 *   const res = await api("POST", "/api/v1/runs", { key, body });
 * Every response is recorded so the contract test can check them all against
 * the OpenAPI document.
 */
type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response> | Response;
type Module = Record<string, Handler | unknown>;

const ROUTES: { pattern: RegExp; template: string; load: () => Promise<Module> }[] = [
  {
    pattern: /^\/api\/v1\/runs$/,
    template: "/api/v1/runs",
    load: () => import("@/app/api/v1/runs/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/preview$/,
    template: "/api/v1/runs/preview",
    load: () => import("@/app/api/v1/runs/preview/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/(?<id>[^/]+)$/,
    template: "/api/v1/runs/{id}",
    load: () => import("@/app/api/v1/runs/[id]/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/(?<id>[^/]+)\/cancel$/,
    template: "/api/v1/runs/{id}/cancel",
    load: () => import("@/app/api/v1/runs/[id]/cancel/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/(?<id>[^/]+)\/terms\.csv$/,
    template: "/api/v1/runs/{id}/terms.csv",
    load: () => import("@/app/api/v1/runs/[id]/terms.csv/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/(?<id>[^/]+)\/counts\.csv$/,
    template: "/api/v1/runs/{id}/counts.csv",
    load: () => import("@/app/api/v1/runs/[id]/counts.csv/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/(?<id>[^/]+)\/points\.csv$/,
    template: "/api/v1/runs/{id}/points.csv",
    load: () => import("@/app/api/v1/runs/[id]/points.csv/route"),
  },
  {
    pattern: /^\/api\/v1\/runs\/(?<id>[^/]+)\/circuits\.zip$/,
    template: "/api/v1/runs/{id}/circuits.zip",
    load: () => import("@/app/api/v1/runs/[id]/circuits.zip/route"),
  },
  {
    pattern: /^\/api\/v1\/circuits$/,
    template: "/api/v1/circuits",
    load: () => import("@/app/api/v1/circuits/route"),
  },
  {
    pattern: /^\/api\/v1\/circuits\/(?<id>[^/]+)$/,
    template: "/api/v1/circuits/{id}",
    load: () => import("@/app/api/v1/circuits/[id]/route"),
  },
  {
    pattern: /^\/api\/v1\/observables$/,
    template: "/api/v1/observables",
    load: () => import("@/app/api/v1/observables/route"),
  },
  {
    pattern: /^\/api\/v1\/observables\/(?<id>[^/]+)$/,
    template: "/api/v1/observables/{id}",
    load: () => import("@/app/api/v1/observables/[id]/route"),
  },
  {
    pattern: /^\/api\/v1\/usage$/,
    template: "/api/v1/usage",
    load: () => import("@/app/api/v1/usage/route"),
  },
  {
    pattern: /^\/api\/v1\/openapi\.json$/,
    template: "/api/v1/openapi.json",
    load: () => import("@/app/api/v1/openapi.json/route"),
  },
];

/** A JSON body as the tests read it (loosely typed on purpose: tests assert on its shape). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type Json = any;

export type ApiResponse = {
  status: number;
  headers: Headers;
  body: Json;
  bytes: Uint8Array;
  method: string;
  template: string;
};

/** Every response this process has seen (for the OpenAPI contract check). */
export const recorded: ApiResponse[] = [];

export async function api(
  method: string,
  path: string,
  options: {
    key?: string;
    cookie?: string;
    body?: unknown;
    rawBody?: string;
    headers?: Record<string, string>;
    signal?: AbortSignal;
  } = {},
): Promise<ApiResponse> {
  const pathname = path.split("?")[0];
  const route = ROUTES.find((r) => r.pattern.test(pathname));
  if (!route) throw new Error(`no route for ${path}`);
  const params = route.pattern.exec(pathname)!.groups ?? {};
  const handler = (await route.load())[method] as Handler | undefined;
  if (!handler) throw new Error(`${method} is not exported by ${route.template}`);
  const headers: Record<string, string> = { ...options.headers };
  if (options.key) headers.authorization = `Bearer ${options.key}`;
  if (options.cookie) headers.cookie = options.cookie;
  let body: string | undefined = options.rawBody;
  if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers["content-type"] ??= "application/json";
  }
  const request = new Request(`http://localhost${path}`, {
    method,
    headers,
    body,
    signal: options.signal,
  });
  const res = await handler(request, { params: Promise.resolve(params) });
  const type = res.headers.get("content-type") ?? "";
  const bytes = new Uint8Array(await res.arrayBuffer());
  const text = new TextDecoder().decode(bytes);
  const parsed = text && /json/.test(type) ? JSON.parse(text) : text;
  const out = {
    status: res.status,
    headers: res.headers,
    body: parsed,
    bytes,
    method,
    template: route.template,
  };
  recorded.push(out);
  return out;
}

const TERMINAL = new Set(["succeeded", "failed", "canceled"]);

/** Polls GET /runs/:id until the run is terminal (or `until` holds). */
export async function pollRun(
  key: string,
  id: string,
  options: { timeoutMs?: number; until?: (run: Json) => boolean; intervalMs?: number } = {},
): Promise<Json> {
  const deadline = Date.now() + (options.timeoutMs ?? 30_000);
  const until = options.until ?? ((run: Json) => TERMINAL.has(run.status));
  let polls = 0;
  for (;;) {
    const res = await api("GET", `/api/v1/runs/${id}`, { key });
    if (res.status !== 200)
      throw new Error(`GET run ${id} answered ${res.status}: ${JSON.stringify(res.body)}`);
    if (until(res.body)) return res.body;
    if (Date.now() > deadline)
      throw new Error(
        `run ${id} still ${res.body.status} (progress ${res.body.progress}) after timeout`,
      );
    // Back off from 50 ms to 250 ms: a slow run on a busy machine must not spend the key's rate budget.
    polls++;
    await new Promise((r) => setTimeout(r, options.intervalMs ?? Math.min(50 * polls, 250)));
  }
}
