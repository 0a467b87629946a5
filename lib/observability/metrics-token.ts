/**
 * The metrics endpoints (app `GET /api/metrics`, the worker's `/metrics`) answer
 * only `Authorization: Bearer $METRICS_TOKEN`, compared in constant time.
 * Without METRICS_TOKEN the app's endpoint answers 404 (metrics off).
 */
import { createHash, timingSafeEqual } from "node:crypto";
import { env } from "@/lib/env";

function digest(value: string): Buffer {
  return createHash("sha256").update(value).digest();
}

export function metricsToken(): string | null {
  return env.METRICS_TOKEN ?? null;
}

export function metricsTokenMatches(authorization: string | null): boolean {
  const token = metricsToken();
  if (!token || !authorization) return false;
  const match = /^Bearer\s+(\S+)$/i.exec(authorization.trim());
  return match !== null && timingSafeEqual(digest(match[1]), digest(token));
}
