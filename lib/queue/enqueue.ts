/**
 * Producer side of the queue, used by request handlers. One BullMQ Queue per
 * process with fail-fast Redis options; `enqueue` throws `QueueUnavailableError`
 * when Redis does not take the job within a few seconds.
 */
import "server-only";
import { Queue } from "bullmq";
import { currentRequestId } from "@/lib/observability/logger";
import {
  JOB_ATTEMPTS,
  JOB_BACKOFF,
  JOB_SCHEMAS,
  RUNS_QUEUE,
  type JobName,
  type JobPayload,
} from "./jobs";
import { producerConnection, queuePrefix } from "./connection";

export class QueueUnavailableError extends Error {
  constructor(cause: unknown) {
    super("the job queue (Redis) is unavailable", { cause });
    this.name = "QueueUnavailableError";
  }
}

const ENQUEUE_TIMEOUT_MS = 3_000;

type Holder = { queue?: Queue };
const holder = ((globalThis as { __ketwiseQueue?: Holder }).__ketwiseQueue ??= {});

export function getRunsQueue(): Queue {
  if (!holder.queue) {
    holder.queue = new Queue(RUNS_QUEUE, {
      connection: producerConnection(),
      prefix: queuePrefix(),
    });
    // Connection errors surface per call; without a listener they would be logged as unhandled.
    holder.queue.on("error", () => {});
  }
  return holder.queue;
}

/** `promise`, or a rejection naming Redis when it has not settled within `ms`. */
export function withTimeout<T>(promise: Promise<T>, ms: number): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no answer from Redis within ${ms} ms`)), ms);
    promise.then(
      (value) => (clearTimeout(timer), resolve(value)),
      (error: unknown) => (clearTimeout(timer), reject(error)),
    );
  });
}

/**
 * Adds a job. `jobId` makes the add idempotent (BullMQ ignores a second job with
 * the same id while the first exists); run jobs use the run id. `attempts` and
 * `backoffMs` (first retry delay, doubled each time) override the default policy.
 */
export async function enqueue<N extends JobName>(
  name: N,
  payload: JobPayload<N>,
  options: { jobId: string; delayMs?: number; attempts?: number; backoffMs?: number },
): Promise<void> {
  const requestId = payload.requestId ?? currentRequestId();
  const data = JOB_SCHEMAS[name].parse(requestId ? { ...payload, requestId } : payload);
  try {
    await withTimeout(
      getRunsQueue().add(name, data, {
        jobId: options.jobId,
        delay: options.delayMs,
        attempts: options.attempts ?? JOB_ATTEMPTS,
        backoff: options.backoffMs
          ? { type: "exponential", delay: options.backoffMs }
          : JOB_BACKOFF,
        removeOnComplete: { age: 3_600, count: 10_000 },
        removeOnFail: { age: 7 * 86_400 },
      }),
      ENQUEUE_TIMEOUT_MS,
    );
  } catch (error) {
    throw new QueueUnavailableError(error);
  }
}

/** Removes a waiting or delayed job (best effort; an active job is left to its worker). */
export async function removeWaitingJob(jobId: string): Promise<void> {
  try {
    const job = await withTimeout(getRunsQueue().getJob(jobId), ENQUEUE_TIMEOUT_MS);
    const state = job ? await job.getState() : null;
    if (job && (state === "waiting" || state === "delayed" || state === "prioritized"))
      await job.remove();
  } catch {
    // The worker skips canceled runs anyway.
  }
}

/** Closes the producer connection (scripts and tests). */
export async function closeQueue(): Promise<void> {
  const queue = holder.queue;
  holder.queue = undefined;
  await queue?.close();
}
