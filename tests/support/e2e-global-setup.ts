/**
 * Global setup of the e2e project: a production build in `.next-e2e` (rebuilt
 * only when sources are newer than it), served by `next start` on
 * 127.0.0.1:$E2E_PORT (default 3100) against the test database and Redis db 1,
 * with AUTH_URL=http://localhost:$E2E_PORT. Stopped again after the run.
 */
import "./test-env";
import { spawn, spawnSync } from "node:child_process";
import { E2E_PORT, E2E_URL } from "./e2e-config";

async function waitForServer(url: string, timeoutMs: number, alive: () => boolean): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (!alive())
      throw new Error("the e2e app server exited during start-up (see its output above)");
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the e2e app server did not answer ${url} within ${timeoutMs} ms`);
}

export default async function setup(): Promise<() => Promise<void>> {
  try {
    await fetch(`${E2E_URL}/`, { signal: AbortSignal.timeout(1000) });
    throw new Error(`port ${E2E_PORT} is already in use; stop that process or set E2E_PORT`);
  } catch (error) {
    if (error instanceof Error && error.message.startsWith("port ")) throw error;
  }

  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_DIST_DIR: ".next-e2e",
    NEXT_TELEMETRY_DISABLED: "1",
    AUTH_URL: E2E_URL,
    APP_URL: E2E_URL,
    PORT: String(E2E_PORT),
  };
  const build = spawnSync(
    "bash",
    [
      "-c",
      "source scripts/lib/common.sh && source scripts/lib/build.sh && build_if_stale .next-e2e",
    ],
    { env, stdio: "inherit" },
  );
  if (build.status !== 0) throw new Error("next build for the e2e tests failed (see output above)");

  const server = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(E2E_PORT)], {
    env,
    detached: true,
    stdio: ["ignore", "inherit", "inherit"],
  });
  let exited = false;
  server.on("exit", () => (exited = true));
  await waitForServer(`${E2E_URL}/sign-in`, 60_000, () => !exited);

  return async () => {
    if (!exited && server.pid) {
      process.kill(-server.pid, "SIGTERM");
      await new Promise((r) => server.once("exit", r));
    }
  };
}
