/**
 * The worker's metrics server on a port that is already taken: the failure is
 * logged and the process goes on (no uncaught EADDRINUSE).
 */
import { createServer, type Server } from "node:http";
import { afterAll, describe, expect, it, vi } from "vitest";

const logged = vi.hoisted(() => {
  let resolve: (line: string) => void = () => {};
  const first = new Promise<string>((r) => (resolve = r));
  return { first, log: (message: string) => resolve(message) };
});
vi.mock("@/worker/log", () => ({ log: logged.log }));

const { startMetricsServer } = await import("@/worker/metrics-server");

const servers: Server[] = [];
afterAll(() => servers.forEach((s) => s.close()));

describe("worker metrics server", () => {
  it("logs a port it cannot bind instead of ending the worker", async () => {
    const taken = createServer();
    servers.push(taken);
    await new Promise<void>((resolve) => taken.listen(0, "127.0.0.1", resolve));
    const address = taken.address();
    const port = typeof address === "object" && address ? address.port : 0;
    servers.push(
      startMetricsServer(port, "127.0.0.1", { busyRatio: () => 0, stopping: () => false }),
    );
    expect(await logged.first).toMatch(new RegExp(`127\\.0\\.0\\.1:${port} is not serving`));
  });
});
