/**
 * System limits of the API v1 (not plan limits — those live in
 * lib/billing/plans.ts): the per-person run submission budget and the request
 * body size. (The per-key / per-user request budget is withOrg's.)
 */
import "server-only";
import { env } from "@/lib/env";
import type { Budget } from "@/lib/rate-limit";

/**
 * Largest accepted request body: 4 MiB. The largest valid request is an
 * 8-qubit complex matrix observable — 2 × 256² numbers at up to ~25 JSON
 * characters each ≈ 3.3 MB.
 */
export const MAX_BODY_BYTES = 4 * 1024 * 1024;

/** Run submissions per minute per person (their session and all keys they created together). */
export const runSubmitBudget = (): Budget => ({
  points: env.RUN_SUBMIT_LIMIT_PER_MINUTE,
  duration: 60,
});
