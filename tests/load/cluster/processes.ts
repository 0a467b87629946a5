/**
 * Processes of the cluster check, each started inside a host's namespace with
 * `ip netns exec` (which execs the command itself, so the pid is the
 * program's own and SIGKILL reaches it). Every process is remembered so
 * `stopAll()` can end whatever is left, whatever happened.
 */
import { spawn, type ChildProcess } from "node:child_process";
import type { Host } from "./netns";

export type Proc = {
  name: string;
  child: ChildProcess;
  output: () => string;
  alive: () => boolean;
  signal: (signal: NodeJS.Signals) => void;
  exited: () => Promise<number | null>;
};

const all = new Set<Proc>();

export function startIn(
  host: Host,
  name: string,
  command: string[],
  env: Record<string, string | undefined> = {},
): Proc {
  const child = spawn("ip", ["netns", "exec", host.ns, ...command], {
    env: { ...process.env, ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  const keep = (d: Buffer) => (out = (out + d.toString()).slice(-200_000));
  child.stdout!.on("data", keep);
  child.stderr!.on("data", keep);
  let code: number | null | undefined;
  const done = new Promise<number | null>((resolve) =>
    child.once("exit", (c) => {
      code = c;
      all.delete(proc);
      resolve(c);
    }),
  );
  const proc: Proc = {
    name,
    child,
    output: () => out,
    alive: () => code === undefined,
    signal: (s) => {
      if (code === undefined) child.kill(s);
    },
    exited: () => done,
  };
  all.add(proc);
  return proc;
}

export async function waitFor(
  what: string,
  check: () => boolean | Promise<boolean>,
  timeoutMs: number,
  proc?: Proc,
): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (await check()) return;
    if (proc && !proc.alive())
      throw new Error(`${what}: ${proc.name} exited:\n${proc.output().slice(-4000)}`);
    if (Date.now() > deadline)
      throw new Error(
        `${what}: not within ${timeoutMs} ms${proc ? `\n${proc.output().slice(-4000)}` : ""}`,
      );
    await new Promise((r) => setTimeout(r, 100));
  }
}

export async function stop(
  proc: Proc,
  signal: NodeJS.Signals = "SIGTERM",
  graceMs = 15_000,
): Promise<void> {
  if (!proc.alive()) return;
  proc.signal(signal);
  const timer = setTimeout(() => proc.signal("SIGKILL"), graceMs);
  await proc.exited();
  clearTimeout(timer);
}

/** The processes still running (their output is kept for the logs). */
export function running(): Proc[] {
  return [...all];
}

/** SIGKILLs every process still running (cleanup path). */
export async function stopAll(): Promise<void> {
  const left = [...all];
  for (const p of left) p.signal("SIGKILL");
  await Promise.all(left.map((p) => p.exited()));
}
