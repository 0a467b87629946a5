/**
 * Structured JSON logs (pino), one line per event, for the app and the worker.
 *
 * Every line carries `service` ("app" | "worker"), the process id and, inside a
 * request or a job, the `requestId` that the API answered with in
 * `X-Request-Id` — so one grep follows a submission from the route handler to
 * the worker that ran it. LOG_LEVEL sets the threshold (default info).
 */
import { AsyncLocalStorage } from "node:async_hooks";
import pino, { type Logger } from "pino";
import { env } from "@/lib/env";

export type LogContext = { requestId?: string; runId?: string; orgId?: string; jobId?: string };

const context = new AsyncLocalStorage<LogContext>();

type Holder = { root?: Logger };
const holder = ((globalThis as { __ketwiseLogger?: Holder }).__ketwiseLogger ??= {});

/** The process's root logger; `service` names the process kind. */
export function rootLogger(service: "app" | "worker" = "app"): Logger {
  holder.root ??= pino({
    level: env.LOG_LEVEL,
    base: { service, pid: process.pid },
    timestamp: pino.stdTimeFunctions.isoTime,
  });
  return holder.root;
}

/** The logger of the current request or job (its ids bound), else the root logger. */
export function logger(): Logger {
  const ctx = context.getStore();
  return ctx ? rootLogger().child(ctx) : rootLogger();
}

/** Runs `fn` with ids bound to every log line written inside it (async calls included). */
export function withLogContext<T>(ids: LogContext, fn: () => T): T {
  return context.run({ ...context.getStore(), ...ids }, fn);
}

/** The request id of the current request or job, if any (carried into queued jobs). */
export function currentRequestId(): string | undefined {
  return context.getStore()?.requestId;
}

const REQUEST_ID = /^[A-Za-z0-9._-]{8,64}$/;

/** A client's `X-Request-Id` when it is a safe token, else a fresh one. */
export function requestIdFrom(header: string | null): string {
  if (header && REQUEST_ID.test(header)) return header;
  return crypto.randomUUID();
}
