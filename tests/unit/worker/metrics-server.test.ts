/**
 * The worker's metrics server: a port that is already taken stops start-up
 * with an error naming the address (never an uncaught EADDRINUSE later), and
 * port 0 takes any free port and reports it.
 */
import { createServer, type Server } from "node:http";
import { afterAll, describe, expect, it } from "vitest";
import { startMetricsServer } from "@/worker/metrics-server";

const servers: Server[] = [];
afterAll(() => servers.forEach((s) => s.close()));
const state = { busyRatio: () => 0, stopping: () => false };

describe("worker metrics server", () => {
  it("refuses a port it cannot bind, naming the address", async () => {
    const taken = createServer();
    servers.push(taken);
    await new Promise<void>((resolve) => taken.listen(0, "127.0.0.1", resolve));
    const address = taken.address();
    const port = typeof address === "object" && address ? address.port : 0;
    await expect(startMetricsServer(port, "127.0.0.1", state)).rejects.toThrow(
      new RegExp(`cannot listen on 127\\.0\\.0\\.1:${port}: EADDRINUSE`),
    );
  });

  it("takes any free port for port 0 and answers /health there", async () => {
    const { server, port } = await startMetricsServer(0, "127.0.0.1", state);
    servers.push(server);
    expect(port).toBeGreaterThan(0);
    const res = await fetch(`http://127.0.0.1:${port}/health`);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ status: "ok" });
  });
});
