/**
 * Redis-backed rate limits (rate-limiter-flexible, fixed windows per key).
 *
 * Sign-in: at most 10 attempts per e-mail and 50 per IP address in 15 minutes;
 * a successful sign-in clears the e-mail's counter. Magic-link requests: 5 per
 * e-mail and 20 per IP per 15 minutes. API (withOrg): API_RATE_LIMIT_PER_MINUTE
 * requests per minute per key or user (route handlers may ask for another budget).
 * A limit answers `ProblemError` 429 with Retry-After in seconds; `consume`
 * returns the budget's state for the RateLimit-* answer fields (./headers.ts).
 */
import "server-only";
import { RateLimiterMemory, RateLimiterRedis, RateLimiterRes } from "rate-limiter-flexible";
import { tooManyRequests } from "@/lib/api/problem";
import type { RateLimitState } from "./headers";
import { metrics } from "@/lib/observability/metrics";
import { getRedis } from "./redis";

export type { RateLimitState } from "./headers";

export type Budget = { points: number; duration: number };

export const BUDGETS = {
  signInEmail: { points: 10, duration: 15 * 60 },
  signInIp: { points: 50, duration: 15 * 60 },
  magicLinkEmail: { points: 5, duration: 15 * 60 },
  magicLinkIp: { points: 20, duration: 15 * 60 },
} satisfies Record<string, Budget>;

const limiters = new Map<string, RateLimiterRedis>();

function limiter(name: string, budget: Budget): RateLimiterRedis {
  const id = `${name}:${budget.points}:${budget.duration}`;
  let found = limiters.get(id);
  if (!found) {
    // While Redis is unreachable, limit per process in memory instead of failing every request.
    const insuranceLimiter = new RateLimiterMemory({ keyPrefix: `kw:rl:${name}`, ...budget });
    found = new RateLimiterRedis({
      storeClient: getRedis(),
      keyPrefix: `kw:rl:${name}`,
      ...budget,
      rejectIfRedisNotReady: true,
      insuranceLimiter,
    });
    limiters.set(id, found);
  }
  return found;
}

function stateOf(budget: Budget, res: RateLimiterRes): RateLimitState {
  return {
    limit: budget.points,
    remaining: Math.max(0, res.remainingPoints),
    resetSeconds: Math.max(0, Math.ceil(res.msBeforeNext / 1000)),
    windowSeconds: budget.duration,
  };
}

/**
 * Spends one point of `name`'s budget for `key` and returns what is left of it;
 * throws 429 (carrying the same state) when spent out. `message` is the
 * user-facing detail; the wait is appended in minutes/seconds.
 */
export async function consume(
  name: string,
  budget: Budget,
  key: string,
  message: string,
): Promise<RateLimitState> {
  try {
    return stateOf(budget, await limiter(name, budget).consume(key));
  } catch (error) {
    if (error instanceof RateLimiterRes) {
      metrics().rateLimitRefusals.inc({ budget: name });
      const seconds = Math.max(1, Math.ceil(error.msBeforeNext / 1000));
      const wait = seconds >= 90 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} seconds`;
      const limited = tooManyRequests(`${message} Try again in ${wait}.`, seconds);
      limited.problem.rateLimit = {
        ...stateOf(budget, error),
        remaining: 0,
        resetSeconds: seconds,
      };
      throw limited;
    }
    throw error;
  }
}

/** Forgets `key`'s spent points (e.g. after a successful sign-in). */
export async function reset(name: string, budget: Budget, key: string): Promise<void> {
  await limiter(name, budget).delete(key);
}

/** Both sign-in budgets; the e-mail is normalised (trimmed, lower case). */
export async function consumeSignIn(email: string, ip: string): Promise<void> {
  const message = "Too many sign-in attempts.";
  await consume("signin-ip", BUDGETS.signInIp, ip, message);
  await consume("signin-email", BUDGETS.signInEmail, email.trim().toLowerCase(), message);
}

export async function resetSignInEmail(email: string): Promise<void> {
  await reset("signin-email", BUDGETS.signInEmail, email.trim().toLowerCase());
}

export async function consumeMagicLink(email: string, ip: string): Promise<void> {
  const message = "Too many sign-in links requested.";
  await consume("magic-ip", BUDGETS.magicLinkIp, ip, message);
  await consume("magic-email", BUDGETS.magicLinkEmail, email.trim().toLowerCase(), message);
}

/** The client IP from proxy headers (first X-Forwarded-For hop), or "unknown". */
export function clientIp(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return forwarded || headers.get("x-real-ip") || "unknown";
}
