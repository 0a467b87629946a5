/**
 * Starts the real worker process (`node --conditions=react-server --import tsx
 * worker/index.ts`) against the test database and Redis, as `npm start` does,
 * and waits until it reports ready. `kill()` is SIGKILL (a crash), `stop()`
 * is SIGTERM (graceful shutdown).
 */
import { spawn, type ChildProcess } from "node:child_process";

export type WorkerProcess = {
  child: ChildProcess;
  output: () => string;
  /** Resolves when the worker has printed `text` (checked on every chunk it writes). */
  waitForOutput: (text: string, timeoutMs?: number) => Promise<void>;
  kill: () => Promise<void>;
  stop: () => Promise<void>;
};

function exited(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => child.once("exit", () => resolve()));
}

export async function startWorker(
  options: { concurrency?: number; env?: Record<string, string> } = {},
): Promise<WorkerProcess> {
  const child = spawn(
    process.execPath,
    ["--conditions=react-server", "--import", "tsx", "worker/index.ts"],
    {
      env: {
        ...process.env,
        NODE_ENV: "test",
        WORKER_CONCURRENCY: String(options.concurrency ?? 2),
        ...options.env,
      },
      stdio: ["ignore", "pipe", "pipe"],
    },
  );
  let out = "";
  const listeners = new Set<() => void>();
  const append = (d: Buffer) => {
    out += d.toString();
    for (const l of listeners) l();
  };
  child.stdout!.on("data", append);
  child.stderr!.on("data", append);
  const deadline = Date.now() + 90_000;
  while (!out.includes("ready:")) {
    if (child.exitCode !== null) throw new Error(`worker exited during start:\n${out}`);
    if (Date.now() > deadline) {
      child.kill("SIGKILL");
      throw new Error(`worker not ready after 90 s:\n${out}`);
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  const waitForOutput = (text: string, timeoutMs = 60_000) =>
    new Promise<void>((resolve, reject) => {
      const check = () => {
        if (!out.includes(text)) return;
        clearTimeout(guard);
        listeners.delete(check);
        resolve();
      };
      // A hang guard, not a timing assertion: it turns a missing line into a readable failure.
      const guard = setTimeout(() => {
        listeners.delete(check);
        reject(new Error(`worker never printed "${text}":\n${out}`));
      }, timeoutMs);
      listeners.add(check);
      check();
    });
  return {
    child,
    output: () => out,
    waitForOutput,
    kill: async () => {
      child.kill("SIGKILL");
      await exited(child);
    },
    stop: async () => {
      child.kill("SIGTERM");
      await exited(child);
    },
  };
}
