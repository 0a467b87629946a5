/**
 * Prometheus metrics (prom-client), one registry per process.
 *
 * App process (scraped at GET /api/metrics): HTTP latency by route, rate-limit
 * refusals, and — computed at scrape time from the queue — queue depth and the
 * age of the oldest waiting job. Worker process (its own small server, see
 * worker/metrics-server.ts): run latency by method and size, engine seconds,
 * busy ratio. Names follow Prometheus conventions (`_seconds`, `_total`).
 */
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from "prom-client";

type Metrics = ReturnType<typeof create>;
const holder = ((globalThis as { __ketwiseMetrics?: { metrics?: Metrics } }).__ketwiseMetrics ??=
  {});

function create() {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry, prefix: "ketwise_process_" });
  return {
    registry,
    httpDuration: new Histogram({
      name: "ketwise_http_request_duration_seconds",
      help: "API request latency by route pattern, method and status class.",
      labelNames: ["route", "method", "status"] as const,
      buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30],
      registers: [registry],
    }),
    rateLimitRefusals: new Counter({
      name: "ketwise_rate_limit_refusals_total",
      help: "Requests refused with 429 by a rate-limit budget.",
      labelNames: ["budget"] as const,
      registers: [registry],
    }),
    queueDepth: new Gauge({
      name: "ketwise_queue_jobs",
      help: "Jobs in the run queue by state (sampled at scrape time).",
      labelNames: ["state"] as const,
      registers: [registry],
    }),
    queueOldestAge: new Gauge({
      name: "ketwise_queue_oldest_waiting_seconds",
      help: "Age of the oldest job waiting in the run queue (0 when none waits).",
      registers: [registry],
    }),
    runDuration: new Histogram({
      name: "ketwise_run_duration_seconds",
      help: "Worker time from claiming a run to its terminal state, by method and size class.",
      labelNames: ["method", "size", "outcome"] as const,
      buckets: [0.01, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30, 60, 300, 1800],
      registers: [registry],
    }),
    engineSeconds: new Counter({
      name: "ketwise_engine_seconds_total",
      help: "Engine (simulation) seconds spent by this worker.",
      labelNames: ["method"] as const,
      registers: [registry],
    }),
    workerBusy: new Gauge({
      name: "ketwise_worker_busy_ratio",
      help: "Fraction of this worker's job slots busy (sampled at scrape time).",
      registers: [registry],
    }),
  };
}

export function metrics(): Metrics {
  holder.metrics ??= create();
  return holder.metrics;
}

/** Size class of a run for metric labels: qubits in bands, so label cardinality stays small. */
export function sizeClass(qubits: number): string {
  if (qubits <= 8) return "le8";
  if (qubits <= 16) return "le16";
  if (qubits <= 22) return "le22";
  return "gt22";
}

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;

/** Static names that sit where an API v1 resource id would (`/api/v1/runs/preview`). */
const STATIC_V1_ITEMS = new Set(["preview"]);

/**
 * A route label from a path: ids replaced by `:id` (bounded cardinality). Under
 * `/api/v1/<collection>/` the next segment is always the id, whatever the client
 * sent (`/api/v1/runs/not-a-uuid` is labelled like a real id), so made-up ids
 * cannot grow the number of label values.
 */
export function routeLabel(pathname: string): string {
  const segments = pathname.split("/");
  if (segments[1] === "api" && segments[2] === "v1" && segments.length > 4) {
    if (!STATIC_V1_ITEMS.has(segments[4])) segments[4] = ":id";
  }
  return segments
    .join("/")
    .replace(UUID, ":id")
    .replace(/\/\d+(?=\/|$)/g, "/:n");
}
