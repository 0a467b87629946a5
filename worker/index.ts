/**
 * The Ketwise worker process: `node --conditions=react-server --import tsx worker/index.ts`.
 *
 * Runs queued jobs (lib/queue/jobs.ts) with WORKER_CONCURRENCY jobs at once,
 * each run's engine in its own thread (engine-pool.ts) so the event loop keeps
 * the queue locks, progress writes and cancellation checks going.
 * Env: DATABASE_URL, REDIS_URL, WORKER_CONCURRENCY (default 2), KETWISE_ENGINE_THREADS
 * (engine threads per run; default cores ÷ WORKER_CONCURRENCY), SMTP_* for mail;
 * WORKER_METRICS_PORT (+ METRICS_TOKEN) serves /health and /metrics.
 *
 * Faults: infrastructure errors are retried with backoff (JOB_ATTEMPTS); a job
 * whose worker died is re-queued by BullMQ's stalled-job check after at most
 * LOCK_DURATION_MS + STALLED_INTERVAL_MS; when retries run out the run is
 * marked failed with a clear problem. SIGTERM/SIGINT: stop taking jobs, let
 * active ones finish for up to SHUTDOWN_GRACE_MS, then exit (anything still
 * running is recovered by another worker as a stalled job).
 */
import { Worker, type Job } from "bullmq";
import { closeDb } from "@/db";
import { env } from "@/lib/env";
import { queuePrefix, workerConnection } from "@/lib/queue/connection";
import { closeQueue } from "@/lib/queue/enqueue";
import {
  LOCK_DURATION_MS,
  MAX_STALLED_COUNT,
  RUNS_QUEUE,
  STALLED_INTERVAL_MS,
} from "@/lib/queue/jobs";
import { engineThreads } from "@/lib/quantum/parallel/config";
import { EnginePool } from "./engine-pool";
import { failDeliveryAfterRetries } from "@/lib/webhooks/deliveries";
import { failRunAfterRetries } from "./give-up";
import { rootLogger } from "@/lib/observability/logger";
import { log } from "./log";
import { meteredEngine } from "./metered-engine";
import { startMetricsServer } from "./metrics-server";
import { buildRegistry, dispatch } from "./registry";
import { startSweeper } from "./sweeper";
import { startOverageScheduler } from "./jobs/billing-overage";

const SHUTDOWN_GRACE_MS = 10_000;

async function main(): Promise<void> {
  rootLogger("worker");
  const concurrency = env.WORKER_CONCURRENCY;
  // Runs × engine threads ≤ cores: each run's engine splits its state over
  // cores ÷ WORKER_CONCURRENCY threads unless KETWISE_ENGINE_THREADS says otherwise
  // (engine threads read it from their copy of the environment).
  process.env.KETWISE_ENGINE_THREADS = String(
    env.KETWISE_ENGINE_THREADS ?? engineThreads(concurrency),
  );
  const started = performance.now();
  const pool = new EnginePool(concurrency);
  await pool.start();
  const registry = buildRegistry({ engine: meteredEngine(pool) });

  const worker = new Worker(
    RUNS_QUEUE,
    (job: Job, token?: string) => dispatch(registry, job, token),
    {
      connection: workerConnection(),
      prefix: queuePrefix(),
      concurrency,
      lockDuration: LOCK_DURATION_MS,
      stalledInterval: STALLED_INTERVAL_MS,
      maxStalledCount: MAX_STALLED_COUNT,
    },
  );
  worker.on("error", (error) => log("queue connection error", error));
  worker.on("failed", (job, error) => {
    if (!job) return;
    log(`job ${job.id} (${job.name}) attempt ${job.attemptsMade} failed`, error);
    void failRunAfterRetries(job, error);
    void failDeliveryAfterRetries(job).catch((e: unknown) =>
      log(`webhook delivery job ${job.id}: could not be marked failed`, e),
    );
  });
  await worker.waitUntilReady();
  const sweeper = startSweeper();
  const overage = startOverageScheduler();
  let stopping = false;
  const metrics =
    env.WORKER_METRICS_PORT === undefined
      ? null
      : await startMetricsServer(env.WORKER_METRICS_PORT, env.WORKER_METRICS_HOST, {
          busyRatio: () => pool.busyRatio(),
          stopping: () => stopping,
        });
  const metricsServer = metrics?.server ?? null;
  const serving = metrics
    ? `, /health and /metrics on ${env.WORKER_METRICS_HOST}:${metrics.port}`
    : "";
  log(
    `ready: ${concurrency} engine thread(s), queue "${queuePrefix()}:${RUNS_QUEUE}"${serving} (${Math.round(performance.now() - started)} ms)`,
  );

  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: finishing active jobs (up to ${SHUTDOWN_GRACE_MS / 1000} s)`);
    sweeper.stop();
    overage.stop();
    const grace = new Promise<"timeout">((resolve) =>
      setTimeout(() => resolve("timeout"), SHUTDOWN_GRACE_MS).unref(),
    );
    const outcome = await Promise.race([worker.close().then(() => "closed" as const), grace]);
    if (outcome === "timeout")
      log("grace period over; unfinished jobs will be recovered by another worker");
    await pool.close();
    metricsServer?.close();
    await Promise.allSettled([closeQueue(), closeDb()]);
    log("stopped");
    process.exit(0);
  };
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
  process.on("SIGINT", () => void shutdown("SIGINT"));
}

main().catch((error: unknown) => {
  log("worker failed to start", error);
  process.exit(1);
});
