/**
 * Redis-backed rate limits (rate-limiter-flexible, fixed windows per key).
 *
 * Sign-in: at most 50 attempts per client IP in 15 minutes (when the IP is
 * known, see ./client-ip.ts); per account, failures slow down the source they
 * come from (lib/auth/sign-in-throttle.ts) instead of locking the account.
 * Magic-link requests: 5 per e-mail and 20 per IP per 15 minutes. Sign-ups:
 * 3 per e-mail and 10 per IP per hour. API (withOrg): API_RATE_LIMIT_PER_MINUTE
 * requests per minute per key or user (route handlers may ask for another budget).
 * A limit answers `ProblemError` 429 with Retry-After in seconds; `consume`
 * returns the budget's state for the RateLimit-* answer fields (./headers.ts).
 */
import "server-only";
import { RateLimiterMemory, RateLimiterRedis, RateLimiterRes } from "rate-limiter-flexible";
import { tooManyRequests } from "@/lib/api/problem";
import { env } from "@/lib/env";
import { clientIpFrom } from "./client-ip";
import type { RateLimitState } from "./headers";
import { metrics } from "@/lib/observability/metrics";
import { getRedis } from "./redis";
import { formatWait } from "@/lib/format";

export type { RateLimitState } from "./headers";

export type Budget = { points: number; duration: number };

export const BUDGETS = {
  signInIp: { points: 50, duration: 15 * 60 },
  signUpEmail: { points: 3, duration: 60 * 60 },
  signUpIp: { points: 10, duration: 60 * 60 },
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
      const limited = tooManyRequests(`${message} Try again in ${formatWait(seconds)}.`, seconds);
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

/** The per-IP sign-in budget (skipped when the client IP is unknown). */
export async function consumeSignInIp(ip: string | null): Promise<void> {
  if (ip)
    await consume(
      "signin-ip",
      BUDGETS.signInIp,
      ip,
      "Too many sign-in attempts from your network.",
    );
}

export async function consumeMagicLink(email: string, ip: string | null): Promise<void> {
  const message = "Too many sign-in links requested.";
  if (ip) await consume("magic-ip", BUDGETS.magicLinkIp, ip, message);
  await consume("magic-email", BUDGETS.magicLinkEmail, email.trim().toLowerCase(), message);
}

export async function consumeSignUp(email: string, ip: string | null): Promise<void> {
  const message = "Too many sign-ups.";
  if (ip) await consume("signup-ip", BUDGETS.signUpIp, ip, message);
  await consume("signup-email", BUDGETS.signUpEmail, email.trim().toLowerCase(), message);
}

/**
 * The client IP for limits: from TRUSTED_PROXY_HOPS reverse proxies' entries
 * in X-Forwarded-For, never from what the client wrote; null when unknown.
 */
export function clientIp(headers: Headers): string | null {
  return clientIpFrom(headers, env.TRUSTED_PROXY_HOPS);
}
