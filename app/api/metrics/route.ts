/**
 * GET /api/metrics — Prometheus metrics of this app process behind
 * `Authorization: Bearer $METRICS_TOKEN` (404 when METRICS_TOKEN is unset).
 * Queue depth and the oldest waiting job's age are read from the queue now.
 */
import { problemResponse } from "@/lib/api/problem";
import { metricsToken, metricsTokenMatches } from "@/lib/observability/metrics-token";
import { metrics } from "@/lib/observability/metrics";
import { sampleQueue } from "@/lib/ops/queue-sample";

export const dynamic = "force-dynamic";

export async function GET(req: Request): Promise<Response> {
  if (!metricsToken())
    return problemResponse({
      type: "/problems/not-found",
      title: "Not found",
      status: 404,
      detail: "Metrics are off (METRICS_TOKEN is not set).",
    });
  if (!metricsTokenMatches(req.headers.get("authorization"))) {
    return problemResponse({
      type: "/problems/unauthorized",
      title: "Unauthorized",
      status: 401,
      detail: "Send the metrics token as `Authorization: Bearer …`.",
    });
  }
  await sampleQueue();
  const m = metrics();
  return new Response(await m.registry.metrics(), {
    headers: { "content-type": m.registry.contentType, "cache-control": "no-store" },
  });
}
