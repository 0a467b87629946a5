/**
 * The worker's log call: one JSON line per event (pino, see
 * lib/observability/logger.ts), with the job's request id, run id and
 * organisation bound while a job runs.
 */
import { logger } from "@/lib/observability/logger";

export function log(message: string, error?: unknown): void {
  if (error === undefined) logger().info(message);
  else logger().error({ err: error instanceof Error ? error : String(error) }, message);
}
