/**
 * Rate-limit answer fields per the IETF draft "RateLimit header fields for HTTP",
 * draft-ietf-httpapi-ratelimit-headers-06 (R. Polli, A. Martinez, December 2022):
 *
 *   RateLimit-Limit: 300          the quota of the current window (requests)
 *   RateLimit-Remaining: 297      what is left of it
 *   RateLimit-Reset: 42           seconds until the window restarts (delta-seconds)
 *   RateLimit-Policy: 300;w=60    quota policy: 300 requests per 60-second window
 *
 * A refused request (429) carries the same fields with `RateLimit-Remaining: 0`,
 * plus `Retry-After` (RFC 9110 §10.2.3) in seconds. Client-safe (no server imports).
 */
export type RateLimitState = {
  /** Requests allowed per window. */
  limit: number;
  /** Requests left in the current window (never negative). */
  remaining: number;
  /** Whole seconds until the current window ends (at least 1 while points are spent). */
  resetSeconds: number;
  /** Length of the window in seconds. */
  windowSeconds: number;
};

/** The four header fields of one budget, names in the draft's casing. */
export function rateLimitHeaders(state: RateLimitState): Record<string, string> {
  return {
    "RateLimit-Limit": String(state.limit),
    "RateLimit-Remaining": String(Math.max(0, state.remaining)),
    "RateLimit-Reset": String(Math.max(0, Math.ceil(state.resetSeconds))),
    "RateLimit-Policy": `${state.limit};w=${state.windowSeconds}`,
  };
}

/** Sets the fields on `headers` (mutates). */
export function applyRateLimitHeaders(headers: Headers, state: RateLimitState): void {
  for (const [name, value] of Object.entries(rateLimitHeaders(state))) headers.set(name, value);
}
