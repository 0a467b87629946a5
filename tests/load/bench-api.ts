/**
 * The runs pipeline under load (run by tests/load/bench-api.sh on the
 * production build, against the <name>_bench database):
 *
 * 1. submit → succeeded latency of a 4-qubit, 1,000-shot run, one run at a
 *    time, from the run's own timestamps (finishedAt − queuedAt), 200 runs
 *    after 20 warm-up runs, one worker process (2 engine threads);
 * 2. POST /api/v1/runs with 50 connections for 20 s (autocannon), the same
 *    worker consuming meanwhile: p50/p95/p99 of every response, errors;
 * 3. for scale, the framework's ceiling: a GET of the cached OpenAPI document;
 * 4. small-run throughput with 1 and 2 worker processes (1 engine thread
 *    each): 300 runs queued while the queue is paused, then
 *    runs / (last finishedAt − first startedAt); and the engine alone on the
 *    same requests in this process, so worker ÷ engine shows the worker's
 *    own overhead;
 * 5. POST /api/v1/runs at an offered 50 submissions/s (open loop);
 * 6. light requests (GET /api/v1/usage, 10 connections, 20 s) alone and while
 *    one client loops the heaviest preview the caps allow (./bench-preview.ts).
 *    `npm run bench:api -- --preview-only` runs this phase alone.
 *
 * The bench organisation is on the Institute plan; the bench server raises
 * the API's rate limits and backlog cap (they would refuse a load test).
 */
import { eq, inArray, and, like, sql } from "drizzle-orm";
import autocannon from "autocannon";
import { closeDb, db } from "@/db";
import { organizations, runs, users } from "@/db/schema";
import { closeQueue, getRunsQueue } from "@/lib/queue/enqueue";
import { estimate } from "@/lib/quantum";
import { createKey } from "@/lib/api-keys/mutations";
import { getMembership } from "@/lib/orgs/queries";
import { createOrganization } from "@/lib/orgs/mutations";
import { smallRequest } from "../integration/runs/support/requests";
import { startServer, startWorker, type Proc } from "./bench-processes";
import { previewIsolationPhase } from "./bench-preview";
import { median, percentile, table } from "./bench-stats";

const PORT = Number(process.env.BENCH_PORT ?? 3310);
const BASE = `http://127.0.0.1:${PORT}`;
const LATENCY_RUNS = 200;
const WARMUP_RUNS = 20;
const THROUGHPUT_RUNS = 300;
const childEnv = {
  PORT: String(PORT),
  AUTH_URL: `http://localhost:${PORT}`,
  APP_URL: `http://localhost:${PORT}`,
  API_RATE_LIMIT_PER_MINUTE: "100000000",
  RUN_SUBMIT_LIMIT_PER_MINUTE: "100000000",
  RUNS_MAX_UNFINISHED: "100000000",
};

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const log = (m: string) => console.log(`[bench] ${m}`);

async function setupOrg(): Promise<{ orgId: string; key: string }> {
  const userId = crypto.randomUUID();
  await db
    .insert(users)
    .values({ id: userId, name: "Bench", email: `bench-${userId}@bench.example` });
  const { id: orgId } = await createOrganization({
    name: `Bench ${new Date().toISOString()}`,
    ownerUserId: userId,
  });
  await db.update(organizations).set({ plan: "institute" }).where(eq(organizations.id, orgId));
  // Scripts run under plain Node: read the membership directly (the page/action guards need a request).
  const membership = await getMembership(orgId, userId);
  if (!membership) throw new Error(`${userId} is not a member of organisation ${orgId}`);
  const access = { userId: userId, ...membership };
  const { key } = await createKey(access, { name: "bench", role: "member", scope: "personal" });
  return { orgId, key };
}

async function submit(key: string, name: string, seed: number): Promise<string> {
  const res = await fetch(`${BASE}/api/v1/runs`, {
    method: "POST",
    headers: { authorization: `Bearer ${key}`, "content-type": "application/json" },
    body: JSON.stringify({ name, ...smallRequest(seed) }),
  });
  if (res.status !== 202) throw new Error(`submit answered ${res.status}: ${await res.text()}`);
  return ((await res.json()) as { id: string }).id;
}

async function waitTerminal(orgId: string, id: string) {
  for (;;) {
    const [row] = await db
      .select({
        status: runs.status,
        queuedAt: runs.queuedAt,
        startedAt: runs.startedAt,
        finishedAt: runs.finishedAt,
      })
      .from(runs)
      .where(and(eq(runs.orgId, orgId), eq(runs.id, id)));
    if (row && ["succeeded", "failed", "canceled"].includes(row.status)) {
      if (row.status !== "succeeded") throw new Error(`run ${id} ${row.status}`);
      return row;
    }
    await sleep(2);
  }
}

async function latencyPhase(orgId: string, key: string) {
  for (let i = 0; i < WARMUP_RUNS; i++)
    await waitTerminal(orgId, await submit(key, `warmup-${i}`, i));
  const total: number[] = [];
  const queue: number[] = [];
  for (let i = 0; i < LATENCY_RUNS; i++) {
    const row = await waitTerminal(orgId, await submit(key, `latency-${i}`, 1000 + i));
    total.push(row.finishedAt!.getTime() - row.queuedAt.getTime());
    queue.push(row.startedAt!.getTime() - row.queuedAt.getTime());
  }
  return { median: median(total), p95: percentile(total, 95), queueMedian: median(queue) };
}

async function postPhase(key: string) {
  const times: number[] = [];
  const instance = autocannon({
    url: `${BASE}/api/v1/runs`,
    connections: 50,
    duration: 20,
    method: "POST",
    headers: { authorization: `Bearer ${key}`, "content-type": "application/json" },
    body: JSON.stringify({ name: "load", ...smallRequest(7) }),
  });
  instance.on("response", (_client, _status, _bytes, responseTime) => times.push(responseTime));
  const result = await instance;
  return {
    requests: result.requests.total,
    rps: result.requests.average,
    p50: Math.round(percentile(times, 50)),
    p95: Math.round(percentile(times, 95)),
    p99: Math.round(percentile(times, 99)),
    errors: result.non2xx + result.errors + result.timeouts,
  };
}

/** POST /api/v1/runs at a fixed offered rate (open loop: autocannon paces the requests, 50 per second overall). */
async function openLoopPhase(key: string, rate: number) {
  const times: number[] = [];
  const instance = autocannon({
    url: `${BASE}/api/v1/runs`,
    connections: 50,
    overallRate: rate,
    duration: 20,
    method: "POST",
    headers: { authorization: `Bearer ${key}`, "content-type": "application/json" },
    body: JSON.stringify({ name: "open-loop", ...smallRequest(11) }),
  });
  instance.on("response", (_client, _status, _bytes, responseTime) => times.push(responseTime));
  const result = await instance;
  return {
    rps: result.requests.average,
    p50: Math.round(percentile(times, 50)),
    p95: Math.round(percentile(times, 95)),
    errors: result.non2xx + result.errors + result.timeouts,
  };
}

/** The engine alone on the throughput phase's request, in this process: runs per second. */
async function engineOnlyRate(): Promise<number> {
  const requests = Array.from({ length: THROUGHPUT_RUNS }, (_, i) => smallRequest(i));
  for (const r of requests.slice(0, 20)) await estimate(r);
  const started = performance.now();
  for (const r of requests) await estimate(r);
  return THROUGHPUT_RUNS / ((performance.now() - started) / 1000);
}

/** The framework's own ceiling: GET /api/v1/openapi.json (a cached document, no database) at 50 connections. */
async function ceilingPhase() {
  const times: number[] = [];
  const instance = autocannon({
    url: `${BASE}/api/v1/openapi.json`,
    connections: 50,
    duration: 10,
  });
  instance.on("response", (_client, _status, _bytes, responseTime) => times.push(responseTime));
  const result = await instance;
  return { rps: result.requests.average, p95: Math.round(percentile(times, 95)) };
}

/** Stops consumers, empties the queue and cancels what is left, so the next phase starts clean. */
async function drain(orgId: string) {
  const queue = getRunsQueue();
  await queue.obliterate({ force: true });
  await db
    .update(runs)
    .set({ status: "canceled", finishedAt: new Date() })
    .where(and(eq(runs.orgId, orgId), inArray(runs.status, ["queued", "running"])));
}

async function throughputPhase(orgId: string, key: string, processes: number): Promise<number> {
  const queue = getRunsQueue();
  await queue.pause();
  const workers = await Promise.all(
    Array.from({ length: processes }, () => startWorker(1, childEnv)),
  );
  const prefix = `tput-${processes}-`;
  for (let i = 0; i < THROUGHPUT_RUNS; i += 10) {
    await Promise.all(
      Array.from({ length: 10 }, (_, j) => submit(key, `${prefix}${i + j}`, i + j)),
    );
  }
  await queue.resume();
  const batch = and(eq(runs.orgId, orgId), like(runs.name, `${prefix}%`));
  for (;;) {
    const [{ done }] = await db
      .select({ done: sql<number>`COUNT(*)` })
      .from(runs)
      .where(and(batch, eq(runs.status, "succeeded")));
    if (Number(done) >= THROUGHPUT_RUNS) break;
    await sleep(50);
  }
  const [{ first, last }] = await db
    .select({ first: sql<Date>`MIN(${runs.startedAt})`, last: sql<Date>`MAX(${runs.finishedAt})` })
    .from(runs)
    .where(batch);
  await Promise.all(workers.map((w) => w.stop()));
  const seconds = (new Date(last).getTime() - new Date(first).getTime()) / 1000;
  return THROUGHPUT_RUNS / seconds;
}

async function previewOnly(key: string, procs: Proc[]): Promise<void> {
  log(`starting next start on ${PORT}`);
  procs.push(await startServer(PORT, childEnv));
  const p = await previewPhase(key);
  console.log("\n" + table(p));
}

async function previewPhase(key: string): Promise<[string, string, string][]> {
  log("light requests alone, then while one client loops the heaviest allowed preview (20 s each)");
  const r = await previewIsolationPhase(BASE, key);
  log(
    `  alone p95 ${r.baseline.p95} ms; with heavy previews p95 ${r.loaded.p95} ms; heavy: ${r.heavy.count} (${r.heavy.statuses}), median ${Math.round(r.heavy.medianMs)} ms`,
  );
  return [
    [
      "GET /api/v1/usage, 10 connections, alone: p95",
      `${r.baseline.p95} ms (${r.baseline.requests} requests, ${r.baseline.errors} errors)`,
      "—",
    ],
    [
      "… while one client loops the heaviest allowed preview: p95",
      `${r.loaded.p95} ms (${r.loaded.requests} requests, ${r.loaded.errors} errors)`,
      "< 100 ms",
    ],
    ["… ratio loaded : alone (p95)", (r.loaded.p95 / r.baseline.p95).toFixed(2), "—"],
    [
      `heaviest allowed preview (${(r.bodyBytes / 1024).toFixed(0)} KiB body): answers, median`,
      `${r.heavy.statuses}; ${Math.round(r.heavy.medianMs)} ms`,
      "—",
    ],
  ];
}

async function main(): Promise<void> {
  const { orgId, key } = await setupOrg();
  const procs: Proc[] = [];
  if (process.argv.includes("--preview-only")) {
    try {
      await previewOnly(key, procs);
    } finally {
      await Promise.all(procs.map((p) => p.stop()));
      await db
        .delete(organizations)
        .where(eq(organizations.id, orgId))
        .catch(() => {});
      await closeQueue();
      await closeDb();
    }
    return;
  }
  try {
    log(`starting next start on ${PORT} and one worker`);
    procs.push(await startServer(PORT, childEnv));
    const worker = await startWorker(2, childEnv);
    procs.push(worker);

    log(`latency: ${WARMUP_RUNS} warm-up + ${LATENCY_RUNS} runs, one at a time`);
    const latency = await latencyPhase(orgId, key);
    log(
      `  median ${latency.median} ms, p95 ${latency.p95} ms (queue wait median ${latency.queueMedian} ms)`,
    );

    log("POST /api/v1/runs: 50 connections, 20 s");
    const post = await postPhase(key);
    log(
      `  ${post.requests} requests (${post.rps.toFixed(0)}/s), p50 ${post.p50} ms, p95 ${post.p95} ms, p99 ${post.p99} ms, errors ${post.errors}`,
    );
    log("POST /api/v1/runs: open loop, 50 submissions/s for 20 s");
    const open = await openLoopPhase(key, 50);
    log(
      `  ${open.rps.toFixed(0)}/s, p50 ${open.p50} ms, p95 ${open.p95} ms, errors ${open.errors}`,
    );
    await worker.stop();
    procs.pop();
    await drain(orgId);
    const ceiling = await ceilingPhase();
    log(
      `  framework ceiling: GET /api/v1/openapi.json ${ceiling.rps.toFixed(0)}/s, p95 ${ceiling.p95} ms`,
    );

    log(
      `throughput: ${THROUGHPUT_RUNS} small runs, 1 then 2 worker processes (1 engine thread each)`,
    );
    const one = await throughputPhase(orgId, key, 1);
    await drain(orgId);
    const two = await throughputPhase(orgId, key, 2);
    log(
      `  1 worker ${one.toFixed(1)} runs/s, 2 workers ${two.toFixed(1)} runs/s, ratio ${(two / one).toFixed(2)}`,
    );
    const engineOnly = await engineOnlyRate();
    log(`  engine alone on the same requests: ${engineOnly.toFixed(1)} runs/s`);
    await drain(orgId);
    const preview = await previewPhase(key);

    console.log(
      "\n" +
        table([
          [
            "submit → succeeded, median (4 qubits, 1,000 shots; 200 runs)",
            `${latency.median} ms`,
            "< 150 ms",
          ],
          ["submit → succeeded, p95", `${latency.p95} ms`, "—"],
          ["POST /api/v1/runs, 50 connections × 20 s: p50", `${post.p50} ms`, "—"],
          ["POST /api/v1/runs: p95", `${post.p95} ms`, "< 100 ms"],
          ["POST /api/v1/runs: p99", `${post.p99} ms`, "—"],
          [
            "POST /api/v1/runs: requests (per s), errors",
            `${post.requests} (${post.rps.toFixed(0)}/s), ${post.errors} errors`,
            "0 errors",
          ],
          [
            "for scale: GET /api/v1/openapi.json (no database), 50 connections",
            `${ceiling.rps.toFixed(0)}/s, p95 ${ceiling.p95} ms`,
            "—",
          ],
          [
            "POST throughput ÷ cached GET throughput (same run)",
            (post.rps / ceiling.rps).toFixed(2),
            "≥ 0.5",
          ],
          ["POST /api/v1/runs, open loop 50/s × 20 s: p50", `${open.p50} ms`, "—"],
          [
            "POST /api/v1/runs, open loop 50/s: p95, errors",
            `${open.p95} ms, ${open.errors} errors`,
            "< 100 ms",
          ],
          ["throughput, 1 worker process", `${one.toFixed(1)} runs/s`, "—"],
          ["throughput, 2 worker processes", `${two.toFixed(1)} runs/s`, "—"],
          ["throughput ratio 2 : 1", (two / one).toFixed(2), "≥ 1.6"],
          ["engine alone, same small runs, in-process", `${engineOnly.toFixed(1)} runs/s`, "—"],
          [
            "worker runs/s ÷ engine-only runs/s (1 worker process)",
            (one / engineOnly).toFixed(2),
            "≥ 0.5",
          ],
          ...preview,
        ]),
    );
  } finally {
    await Promise.all(procs.map((p) => p.stop()));
    await db
      .delete(organizations)
      .where(eq(organizations.id, orgId))
      .catch(() => {});
    await closeQueue();
    await closeDb();
  }
}

main().catch((error: unknown) => {
  console.error("[bench] failed:", error);
  process.exitCode = 1;
});
