/**
 * Child processes of the API benchmark: the production server (`next start`)
 * and worker processes, each started with the bench environment and stopped
 * with SIGTERM; output is kept for error reports.
 */
import { spawn, type ChildProcess } from "node:child_process";

export type Proc = { child: ChildProcess; output: () => string; stop: () => Promise<void> };

function start(
  command: string,
  args: string[],
  env: Record<string, string>,
  ready: (out: string) => boolean,
  what: string,
): Promise<Proc> {
  const child = spawn(command, args, {
    env: { ...process.env, ...env },
    stdio: ["ignore", "pipe", "pipe"],
    detached: true,
  });
  let out = "";
  child.stdout!.on("data", (d: Buffer) => (out = (out + d.toString()).slice(-20_000)));
  child.stderr!.on("data", (d: Buffer) => (out = (out + d.toString()).slice(-20_000)));
  const proc: Proc = {
    child,
    output: () => out,
    stop: () =>
      new Promise((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once("exit", () => resolve());
        try {
          process.kill(-child.pid!, "SIGTERM");
        } catch {
          resolve();
        }
      }),
  };
  return new Promise((resolve, reject) => {
    const deadline = Date.now() + 120_000;
    const timer = setInterval(() => {
      if (ready(out)) {
        clearInterval(timer);
        resolve(proc);
      } else if (child.exitCode !== null || Date.now() > deadline) {
        clearInterval(timer);
        void proc.stop();
        reject(new Error(`${what} did not start:\n${out}`));
      }
    }, 50);
  });
}

export async function startServer(port: number, env: Record<string, string>): Promise<Proc> {
  const server = await start(
    "npx",
    ["next", "start", "-H", "127.0.0.1", "-p", String(port)],
    env,
    (o) => /Ready in|ready/i.test(o),
    "next start",
  );
  // Ready means listening; the first request compiles nothing in production but loads route modules.
  for (let i = 0; i < 100; i++) {
    const res = await fetch(`http://127.0.0.1:${port}/api/v1/openapi.json`).catch(() => null);
    if (res?.ok) return server;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`next start answers no requests on ${port}:\n${server.output()}`);
}

export function startWorker(concurrency: number, env: Record<string, string>): Promise<Proc> {
  return start(
    process.execPath,
    ["--conditions=react-server", "--import", "tsx", "worker/index.ts"],
    { ...env, WORKER_CONCURRENCY: String(concurrency) },
    (o) => o.includes("ready:"),
    "worker",
  );
}
