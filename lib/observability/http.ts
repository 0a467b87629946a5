/**
 * `observeRequest(req, run)` — the edge of every API v1 request: a request id
 * (the client's `X-Request-Id` when it is a safe token, else a new UUID) bound to
 * every log line and queued job of the request and echoed in the answer, and the
 * request's latency recorded by route pattern.
 */
import "server-only";
import { editHeaders } from "@/lib/api/response-headers";
import { logger, requestIdFrom, withLogContext } from "./logger";
import { metrics, routeLabel } from "./metrics";

export async function observeRequest(
  req: Request,
  run: () => Promise<Response>,
): Promise<Response> {
  const requestId = requestIdFrom(req.headers.get("x-request-id"));
  const started = performance.now();
  const route = routeLabel(new URL(req.url).pathname);
  return withLogContext({ requestId }, async () => {
    const res = await run();
    const seconds = (performance.now() - started) / 1000;
    metrics().httpDuration.observe(
      { route, method: req.method, status: `${Math.floor(res.status / 100)}xx` },
      seconds,
    );
    if (res.status >= 500)
      logger().error({ route, method: req.method, status: res.status, seconds }, "request failed");
    else logger().debug({ route, method: req.method, status: res.status, seconds }, "request");
    return editHeaders(res, (h) => h.set("X-Request-Id", requestId));
  });
}
