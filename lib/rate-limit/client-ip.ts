/**
 * The client's IP address for rate limits, from the number of reverse
 * proxies in front of the app that the operator trusts (`TRUSTED_PROXY_HOPS`).
 *
 * Each trusted proxy appends the address it received the request from to
 * `X-Forwarded-For`, so with n trusted hops the client is the n-th entry from
 * the RIGHT; everything left of it was written by the client and is ignored.
 * With 0 hops (a bare server, the default) the header is never read: a client
 * could put anything there. The answer is then null ("unknown"), and limits
 * keyed by address fall back to the other keys (account, device).
 */
import { isIP } from "node:net";

export function clientIpFrom(headers: Headers, trustedHops: number): string | null {
  if (trustedHops <= 0) return null;
  const hops = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  if (hops.length < trustedHops) return null;
  const candidate = hops[hops.length - trustedHops];
  // "[::1]:1234" and "1.2.3.4:5678" forms some proxies write.
  const bare = candidate
    .replace(/^\[([^\]]+)\](?::\d+)?$/, "$1")
    .replace(/^(\d+\.\d+\.\d+\.\d+):\d+$/, "$1");
  return isIP(bare) ? bare : null;
}
