/**
 * npm run bench:cluster — Ketwise on several hosts, under faults (needs root).
 *
 * Builds a test network of Linux network namespaces (netns.ts): a data host
 * (MariaDB + Redis with its append-only file), an app host (`next start`) and
 * two worker hosts, joined by a bridge with addresses of its own. Clients in
 * the root namespace submit runs with Idempotency-Keys, retrying with the same
 * key on errors. Then, each while runs are in flight:
 *   1. a worker host is cut off (link down) for longer than the job lock, then
 *      brought back: its run finishes on the other host, the returning worker
 *      writes nothing (its attempt is fenced off);
 *   2. Redis is stopped and started again;
 *   3. MariaDB is stopped and started again;
 *   4. the app is killed (SIGKILL) mid-submission and started again;
 *   5. a worker gets SIGTERM: it takes no new job and finishes the one it holds.
 * Afterwards: every acknowledged submission has exactly one run, every run
 * succeeded once, and the usage meters count each run once. Prints a table and
 * a closing `N passed, N failed` line; cleans up namespaces and processes
 * whatever happens, and gives up by itself after LIMIT_MS.
 *
 * `--short`: fewer runs (the form `npm test` runs). Needs a production build in
 * $KETWISE_CLUSTER_DIST (default .next; tests/load/bench-cluster.sh builds it).
 */
import { randomBytes } from "node:crypto";
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { longRunRequest } from "../../integration/runs/support/requests";
import { Client, backgroundLoad, type Submitted } from "./client";
import { createNetwork, destroyNetwork, host, setLink } from "./netns";
import { running, stopAll, type Proc } from "./processes";
import * as stack from "./stack";

const SHORT = process.argv.includes("--short");
const LIMIT_MS = 360_000; // about 2 minutes on a quiet 2-core machine; the limit leaves room for a loaded one
const PARTITION_MS = 20_000; // > job lock (10 s) + stalled-check interval (5 s)
const THROUGHPUT_RUNS = SHORT ? 40 : 120;
const BACKGROUND_CLIENTS = SHORT ? 2 : 4;
const BACKGROUND_EVERY_MS = SHORT ? 400 : 150;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const log = (m: string) => console.log(`[cluster] ${m}`);
const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;

type Check = { name: string; ok: boolean; detail: string };
const checks: Check[] = [];
function check(name: string, ok: boolean, detail: string): void {
  checks.push({ name, ok, detail });
  log(`${ok ? "PASS" : "FAIL"} ${name}: ${detail}`);
}

const smallRun = (seed: number) => ({
  circuit: {
    format: "qasm2",
    source:
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[4];\nh q[0];\ncx q[0],q[1];\ncx q[1],q[2];\nrx(0.3) q[3];\n',
  },
  observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X2 + 0.25 Z3" },
  shots: 200,
  seed,
});

async function main(): Promise<number> {
  if (process.getuid?.() !== 0)
    throw new Error("bench:cluster needs root (it creates network namespaces)");
  const data = host("data", 10);
  const app = host("app", 20);
  const w1 = host("w1", 31);
  const w2 = host("w2", 32);
  const config: stack.StackConfig = {
    data,
    app,
    password: randomBytes(12).toString("hex"),
    metricsToken: randomBytes(16).toString("hex"),
    authSecret: randomBytes(32).toString("hex"),
    distDir: process.env.KETWISE_CLUSTER_DIST ?? ".next",
  };
  const started = Date.now();
  createNetwork([data, app, w1, w2]);
  log(`network up: data ${data.ip}, app ${app.ip}, workers ${w1.ip} ${w2.ip}`);
  stack.prepareData(config);
  let mariadb = await stack.startMariadb(config);
  stack.createDatabase(config);
  let redis = await stack.startRedis(config);
  Object.assign(process.env, stack.appEnv(config), { NODE_ENV: "production" });

  const { migrate } = await import("drizzle-orm/mysql2/migrator");
  const { db, closeDb } = await import("@/db");
  await migrate(db, { migrationsFolder: join(stack.ROOT, "drizzle") });
  const { setupBenchOrg } = await import("./org");
  const { orgId, apiKey } = await setupBenchOrg();
  const { runStatus, verify, waitAllTerminal } = await import("./checks");
  const { closeQueue, getRunsQueue } = await import("@/lib/queue/enqueue");

  let appProc = await stack.startApp(config);
  const workers: Record<string, Proc> = { w1: await stack.startWorkerOn(config, w1, 1) };
  const workerLogs: Proc[] = [workers.w1];
  const client = new Client(stack.appUrl(config), apiKey);
  const all: Submitted[] = [];
  log(`stack ready in ${seconds(Date.now() - started)}`);

  const waitRun = async (runId: string, until: (s: string) => boolean, timeoutMs: number) => {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const row = await runStatus(orgId, runId).catch(() => null);
      if (row && until(row.status)) return row;
      if (Date.now() > deadline) return row;
      await sleep(100);
    }
  };

  async function throughput(label: string): Promise<number> {
    const queue = getRunsQueue();
    await queue.pause();
    const batch: Submitted[] = [];
    for (let i = 0; i < THROUGHPUT_RUNS; i += 8) {
      const part = await Promise.all(
        Array.from({ length: Math.min(8, THROUGHPUT_RUNS - i) }, (_, j) =>
          client.submit(`${label}-${i + j}`, smallRun(i + j), label),
        ),
      );
      batch.push(...part);
    }
    all.push(...batch);
    await queue.resume();
    await Promise.all(batch.map((s) => waitRun(s.runId, (st) => st === "succeeded", 60_000)));
    const { sql } = await import("drizzle-orm");
    const [rows] = (await db.execute(
      sql`select min(started_at) as first, max(finished_at) as last from runs where org_id = ${orgId} and idempotency_key like ${label + "-%"}`,
    )) as unknown as [{ first: Date; last: Date }[]];
    const span = (new Date(rows[0].last).getTime() - new Date(rows[0].first).getTime()) / 1000;
    return THROUGHPUT_RUNS / Math.max(span, 1e-3);
  }

  const tp1 = await throughput("tp1");
  log(`throughput, 1 worker host: ${tp1.toFixed(1)} runs/s`);
  workers.w2 = await stack.startWorkerOn(config, w2, 1);
  workerLogs.push(workers.w2);
  const tp2 = await throughput("tp2");
  log(`throughput, 2 worker hosts: ${tp2.toFixed(1)} runs/s (ratio ${(tp2 / tp1).toFixed(2)})`);

  const bg = backgroundLoad(client, BACKGROUND_CLIENTS, BACKGROUND_EVERY_MS, (i) =>
    smallRun(1000 + i),
  );
  const recovery: Record<string, number> = {};
  const probe = async (label: string, t0: number) => {
    const s = await client.submit(`probe-${label}`, smallRun(7), "probe", 90_000);
    all.push(s);
    const row = await waitRun(s.runId, (st) => st === "succeeded", 90_000);
    return { ok: row?.status === "succeeded", ms: Date.now() - t0 };
  };
  // Two runs of a few seconds each (a noisy 8-qubit density-matrix sweep of 64 points).
  const longPair = async (label: string) => {
    const pair = await Promise.all([
      client.submit(`${label}-a`, longRunRequest(64), "long"),
      client.submit(`${label}-b`, longRunRequest(64), "long"),
    ]);
    all.push(...pair);
    const rows = await Promise.all(
      pair.map((s) => waitRun(s.runId, (st) => st !== "queued", 30_000)),
    );
    return { pair, bothRunning: rows.every((r) => r?.status === "running") };
  };

  // 1. Partition a worker host for longer than its job lock.
  {
    const { pair, bothRunning } = await longPair("partition");
    check(
      "partition: both worker hosts hold a long run when the link goes down",
      bothRunning,
      bothRunning ? "yes" : "not both running",
    );
    const t0 = Date.now();
    setLink(w1, false);
    await sleep(PARTITION_MS);
    setLink(w1, true);
    const rows = await Promise.all(
      pair.map((s) => waitRun(s.runId, (st) => st === "succeeded", 90_000)),
    );
    recovery.partition = Date.now() - t0;
    const moved = rows.find((r) => (r?.attempts ?? 0) >= 2);
    check(
      "partition: the cut-off host's run finished on the other host",
      rows.every((r) => r?.status === "succeeded") && moved !== undefined,
      rows.map((r) => `${r?.status}/attempt ${r?.attempts}`).join(", "),
    );
    const fenced = moved ? `run ${moved.id}: superseded` : "(none)";
    let sawFence = false;
    for (let i = 0; i < 600 && !sawFence; i++) {
      sawFence = workers.w1.output().includes(fenced);
      if (!sawFence) await sleep(100);
    }
    check(
      "partition: the returning worker wrote nothing stale (its attempt was fenced off)",
      sawFence,
      sawFence ? "superseded" : `no "${fenced}" in w1's log`,
    );
  }

  // 2. Restart Redis (stop, start; append-only file on).
  {
    const t0 = Date.now();
    await stack.stopRedis(redis);
    await sleep(3_000);
    redis = await stack.startRedis(config);
    const p = await probe("redis", t0);
    recovery.redis = p.ms;
    check("Redis restart: a new run succeeds afterwards", p.ok, seconds(p.ms));
  }

  // 3. Restart MariaDB.
  {
    const t0 = Date.now();
    await stack.stopMariadb(mariadb);
    await sleep(2_000);
    mariadb = await stack.startMariadb(config);
    const p = await probe("mariadb", t0);
    recovery.mariadb = p.ms;
    check("MariaDB restart: app and workers reconnect, a new run succeeds", p.ok, seconds(p.ms));
  }

  // 4. Kill the app mid-submission.
  {
    const t0 = Date.now();
    appProc.signal("SIGKILL");
    await appProc.exited();
    appProc = await stack.startApp(config);
    const p = await probe("app", t0);
    recovery.app = p.ms;
    check("app killed: clients retrying with their keys get through", p.ok, seconds(p.ms));
  }

  // 5. SIGTERM a worker holding a run.
  {
    const { pair, bothRunning } = await longPair("sigterm");
    const t0 = Date.now();
    workers.w2.signal("SIGTERM");
    const code = await Promise.race([
      workers.w2.exited(),
      sleep(30_000).then(() => "timeout" as const),
    ]);
    recovery.sigterm = Date.now() - t0;
    const rows = await Promise.all(
      pair.map((s) => waitRun(s.runId, (st) => st === "succeeded", 90_000)),
    );
    // Within its grace period the worker either finishes the run it holds or leaves it to another worker.
    const finished = pair.some((s) => workers.w2.output().includes(`run ${s.runId}: succeeded`));
    const handedBack = rows.some((r) => (r?.attempts ?? 0) >= 2);
    check(
      "SIGTERM: the worker took no new job, finished or handed back its run, and exited cleanly",
      bothRunning &&
        code === 0 &&
        (finished || handedBack) &&
        rows.every((r) => r?.status === "succeeded"),
      `exit ${code} after ${seconds(recovery.sigterm)} (${finished ? "finished its run" : "handed its run back"}); ` +
        rows.map((r) => `${r?.status}/attempt ${r?.attempts}`).join(", "),
    );
  }

  await bg.stop();
  all.push(...bg.acknowledged);
  check(
    "clients: every submission was acknowledged",
    bg.errors.length === 0,
    bg.errors.length
      ? bg.errors.slice(0, 3).join("; ")
      : `${bg.acknowledged.length} background runs`,
  );
  await waitAllTerminal(orgId, 90_000);
  const verdict = await verify(
    orgId,
    all,
    workerLogs.map((w) => w.output()),
  );
  check("no run lost", verdict.lost === 0, `${verdict.lost} lost`);
  check("no key with two runs", verdict.duplicates === 0, `${verdict.duplicates}`);
  check("no run finished twice", verdict.runTwice === 0, `${verdict.runTwice}`);
  check("no run metered twice", verdict.doubleMetered === 0, `${verdict.doubleMetered}`);
  for (const d of verdict.details.slice(0, 20)) log(`  ${d}`);

  const rows: [string, string][] = [
    ["submitted (acknowledged keys)", String(verdict.submitted)],
    ["runs in the database", String(verdict.runs)],
    ["succeeded", String(verdict.succeeded)],
    ["lost", String(verdict.lost)],
    ["run twice", String(verdict.runTwice)],
    ["double-metered", String(verdict.doubleMetered)],
    [
      "recovery: worker host cut off 20 s (until its run finished elsewhere)",
      seconds(recovery.partition),
    ],
    ["recovery: Redis restart (until a new run succeeded)", seconds(recovery.redis)],
    ["recovery: MariaDB restart (until a new run succeeded)", seconds(recovery.mariadb)],
    ["recovery: app killed (until a new run succeeded)", seconds(recovery.app)],
    ["SIGTERM worker: time to a clean exit", seconds(recovery.sigterm)],
    ["throughput, 1 worker host (small runs)", `${tp1.toFixed(1)} runs/s`],
    ["throughput, 2 worker hosts", `${tp2.toFixed(1)} runs/s (×${(tp2 / tp1).toFixed(2)})`],
    ["wall time", seconds(Date.now() - started)],
  ];
  console.log(`\n| measure (${SHORT ? "short form" : "full form"}) | value |\n|---|---|`);
  for (const [k, v] of rows) console.log(`| ${k} | ${v} |`);
  writeLogs([appProc, ...workerLogs, mariadb, redis]);
  await Promise.allSettled([closeQueue(), closeDb()]);
  const failed = checks.filter((c) => !c.ok).length;
  console.log(`\n${checks.length - failed} passed, ${failed} failed`);
  return failed === 0 ? 0 : 1;
}

function writeLogs(procs: Proc[]): void {
  const dir = join(stack.ROOT, ".data/cluster/logs");
  mkdirSync(dir, { recursive: true });
  for (const p of procs) writeFileSync(join(dir, `${p.name.replace(/\s+/g, "-")}.log`), p.output());
}

let cleaned = false;
async function cleanup(): Promise<void> {
  if (cleaned) return;
  cleaned = true;
  writeLogs(running());
  await stopAll();
  destroyNetwork();
}

const limit = setTimeout(() => {
  console.error(`[cluster] giving up after ${LIMIT_MS / 1000} s`);
  console.log("0 passed, 1 failed");
  void cleanup().finally(() => process.exit(1));
}, LIMIT_MS);
for (const signal of ["SIGINT", "SIGTERM"] as const)
  process.on(signal, () => void cleanup().finally(() => process.exit(130)));

main()
  .then(async (code) => {
    clearTimeout(limit);
    await cleanup();
    process.exit(code);
  })
  .catch(async (error: unknown) => {
    clearTimeout(limit);
    console.error("[cluster] failed:", error instanceof Error ? error.stack : error);
    console.log(
      `${checks.filter((c) => c.ok).length} passed, ${checks.filter((c) => !c.ok).length + 1} failed`,
    );
    await cleanup();
    process.exit(1);
  });
