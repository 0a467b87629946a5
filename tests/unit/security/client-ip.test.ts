/**
 * Client IP from trusted proxy hops: each trusted proxy appends the address it
 * saw to X-Forwarded-For, so with n trusted hops the client is the n-th entry
 * from the right (MDN "X-Forwarded-For", security and privacy concerns; common
 * practice). Entries further left are client-written and never used.
 */
import { describe, expect, it } from "vitest";
import { clientIpFrom } from "@/lib/rate-limit/client-ip";
import { delaySeconds, FREE_FAILURES, MAX_DELAY_SECONDS } from "@/lib/auth/sign-in-throttle";

const h = (xff?: string) => new Headers(xff === undefined ? {} : { "x-forwarded-for": xff });

describe("clientIpFrom", () => {
  it("trusts nothing with 0 hops", () => {
    expect(clientIpFrom(h("198.51.100.1"), 0)).toBeNull();
    expect(clientIpFrom(h(), 0)).toBeNull();
  });

  it("takes the n-th entry from the right", () => {
    expect(clientIpFrom(h("6.6.6.6, 198.51.100.1"), 1)).toBe("198.51.100.1");
    expect(clientIpFrom(h("6.6.6.6, 198.51.100.1, 10.0.0.2"), 2)).toBe("198.51.100.1");
    expect(clientIpFrom(h("2001:db8::1"), 1)).toBe("2001:db8::1");
    expect(clientIpFrom(h("[2001:db8::1]:443"), 1)).toBe("2001:db8::1");
    expect(clientIpFrom(h("198.51.100.1:5555"), 1)).toBe("198.51.100.1");
  });

  it("answers null when the chain is shorter than the trusted hops or the entry is not an address", () => {
    expect(clientIpFrom(h("198.51.100.1"), 2)).toBeNull();
    expect(clientIpFrom(h("unknown"), 1)).toBeNull();
    expect(clientIpFrom(h("1.2.3.4, <script>"), 1)).toBeNull();
  });
});

describe("progressive delay", () => {
  it("is free for the first failures, then doubles up to the cap", () => {
    for (let f = 0; f < FREE_FAILURES; f++) expect(delaySeconds(f)).toBe(0);
    expect(delaySeconds(FREE_FAILURES)).toBe(1);
    expect(delaySeconds(FREE_FAILURES + 1)).toBe(2);
    expect(delaySeconds(FREE_FAILURES + 4)).toBe(16);
    expect(delaySeconds(FREE_FAILURES + 40)).toBe(MAX_DELAY_SECONDS);
  });
});
