/**
 * The worker's own small HTTP server (WORKER_METRICS_PORT; off when unset):
 * `GET /health` answers 200 while the worker takes jobs (503 once it is
 * shutting down) — the container health check — and `GET /metrics` serves its
 * Prometheus metrics behind `Authorization: Bearer $METRICS_TOKEN`. A port that
 * cannot be bound is logged; the worker keeps taking jobs (its health check fails).
 */
import { createServer, type Server } from "node:http";
import { metricsTokenMatches } from "@/lib/observability/metrics-token";
import { metrics } from "@/lib/observability/metrics";

/**
 * Starts the server and resolves once it listens (port 0 = any free port; the
 * bound address is returned). A port already taken rejects with a clear error.
 */
export async function startMetricsServer(
  port: number,
  host: string,
  state: { busyRatio: () => number; stopping: () => boolean },
): Promise<{ server: Server; port: number }> {
  const server = createServer((req, res) => {
    void (async () => {
      const path = (req.url ?? "/").split("?")[0];
      if (path === "/health") {
        const ok = !state.stopping();
        res.writeHead(ok ? 200 : 503, { "content-type": "application/json" });
        res.end(JSON.stringify({ status: ok ? "ok" : "stopping" }));
        return;
      }
      if (path === "/metrics") {
        if (!metricsTokenMatches(req.headers.authorization ?? null)) {
          res.writeHead(401, { "content-type": "application/problem+json" });
          res.end(
            JSON.stringify({
              type: "/problems/unauthorized",
              title: "Unauthorized",
              status: 401,
              detail: "Send the metrics token as `Authorization: Bearer …`.",
            }),
          );
          return;
        }
        const m = metrics();
        m.workerBusy.set(state.busyRatio());
        res.writeHead(200, { "content-type": m.registry.contentType });
        res.end(await m.registry.metrics());
        return;
      }
      res.writeHead(404, { "content-type": "application/problem+json" });
      res.end(JSON.stringify({ type: "/problems/not-found", title: "Not found", status: 404 }));
    })().catch(() => {
      res.writeHead(500);
      res.end();
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", (error: NodeJS.ErrnoException) =>
      reject(
        new Error(
          `the metrics server cannot listen on ${host}:${port}: ${error.code ?? error.message}`,
        ),
      ),
    );
    server.listen(port, host, () => resolve());
  });
  const address = server.address();
  return { server, port: typeof address === "object" && address ? address.port : port };
}
