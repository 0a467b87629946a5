/**
 * Sign-in throttling that cannot be turned against users. Reported holes: the
 * per-IP bucket was keyed by the client-written X-Forwarded-For (rotating it
 * bypassed the limit), and ten failures locked an account's owner out even
 * with the right password. Now failures slow down only their own source
 * (browser, else IP, else "unknown"), with a progressive delay; the
 * X-Forwarded-For header is ignored unless proxies are trusted
 * (TRUSTED_PROXY_HOPS, default 0 in tests).
 */
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { authorizeWithPassword } from "@/lib/auth/config";
import { RateLimitedSignIn } from "@/lib/auth/errors";
import {
  DEVICE_COOKIE,
  FREE_FAILURES,
  newDeviceCookie,
  recordSignInFailure,
  signInSource,
} from "@/lib/auth/sign-in-throttle";
import { clientIp } from "@/lib/rate-limit";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestUser, TEST_PASSWORD } from "../../support/factories";

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

const rotating = (i: number) =>
  new Request("http://localhost/", { headers: { "x-forwarded-for": `203.0.113.${i % 250}` } });

describe("sign-in throttling", () => {
  it("ignores a client-written X-Forwarded-For when no proxy is trusted", () => {
    expect(clientIp(new Headers({ "x-forwarded-for": "198.51.100.7" }))).toBeNull();
    expect(clientIp(new Headers({ "x-real-ip": "198.51.100.7" }))).toBeNull();
  });

  it("rotating X-Forwarded-For does not reset the delay: failures pile up on one source", async () => {
    const user = await createTestUser("throttle-rotate");
    for (let i = 0; i < FREE_FAILURES; i++) {
      expect(
        await authorizeWithPassword(
          { email: user.email, password: "wrong password!" },
          rotating(i),
        ),
      ).toBeNull();
    }
    const refused = await authorizeWithPassword(
      { email: user.email, password: "wrong password!" },
      rotating(99),
    ).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(RateLimitedSignIn);
    expect((refused as RateLimitedSignIn).detail).toMatch(
      /Too many failed sign-ins for this account from this browser or network\. Wait \d+ seconds?/,
    );
  });

  it("the owner's own browser still signs in with the right password while an attacker is being slowed", async () => {
    const user = await createTestUser("throttle-owner");
    // An attacker (no device cookie, unknown address) has failed many times: a long delay for that source.
    for (let i = 0; i < FREE_FAILURES + 8; i++) await recordSignInFailure(user.email, "unknown");
    const attacker = await authorizeWithPassword(
      { email: user.email, password: TEST_PASSWORD },
      rotating(1),
    ).catch((e: unknown) => e);
    expect(attacker).toBeInstanceOf(RateLimitedSignIn);
    expect((attacker as RateLimitedSignIn).retryAfter).toBeGreaterThan(60);

    const ownBrowser = new Request("http://localhost/", {
      headers: { cookie: `${DEVICE_COOKIE}=${newDeviceCookie(user.email)}` },
    });
    expect(
      await authorizeWithPassword({ email: user.email, password: TEST_PASSWORD }, ownBrowser),
    ).toMatchObject({ id: user.id });
  });

  it("a device cookie counts only for the account it was issued to, and only when its signature holds", () => {
    const cookie = newDeviceCookie("ada@example.org");
    const headers = (value: string) => new Headers({ cookie: `${DEVICE_COOKIE}=${value}` });
    expect(signInSource(headers(cookie), "ada@example.org", null)).toMatch(/^device:/);
    expect(signInSource(headers(cookie), "eve@example.org", null)).toBe("unknown");
    expect(
      signInSource(headers(`${cookie.split(".")[0]}.forged`), "ada@example.org", "192.0.2.1"),
    ).toBe("ip:192.0.2.1");
  });
});
