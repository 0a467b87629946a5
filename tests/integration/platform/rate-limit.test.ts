/**
 * Redis-backed rate limits: sign-in per e-mail (10 / 15 min) and per IP
 * (50 / 15 min), the Credentials provider refusing once the budget is spent,
 * and the per-actor API budget of withOrg answering 429 with Retry-After.
 */
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { isProblemError } from "@/lib/api/problem";
import { withOrg } from "@/lib/api/with-org";
import { authorizeWithPassword } from "@/lib/auth/config";
import { RateLimitedSignIn } from "@/lib/auth/errors";
import { BUDGETS, consumeSignIn, resetSignInEmail } from "@/lib/rate-limit";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createTestUser, createUserWithOrg, TEST_PASSWORD, uniqueEmail, uniqueSuffix } from "../../support/factories";

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

const ip = () => `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;

async function spend(times: number, fn: () => Promise<void>) {
  for (let i = 0; i < times; i++) await fn();
}

describe("sign-in rate limit", () => {
  it("allows 10 attempts per e-mail, then answers 429 with a wait", async () => {
    const email = uniqueEmail("rl");
    await spend(BUDGETS.signInEmail.points, () => consumeSignIn(email, ip()));
    const error = await consumeSignIn(email.toUpperCase(), ip()).catch((e: unknown) => e);
    expect(isProblemError(error) && error.status).toBe(429);
    if (!isProblemError(error)) return;
    expect(error.problem.detail).toMatch(/^Too many sign-in attempts\. Try again in \d+ minutes\.$/);
    expect(error.problem.retryAfter).toBeGreaterThan(800);
    await resetSignInEmail(email);
    await expect(consumeSignIn(email, ip())).resolves.toBeUndefined();
  });

  it("limits one IP across many e-mails", async () => {
    const address = ip();
    await spend(BUDGETS.signInIp.points, () => consumeSignIn(uniqueEmail("ip"), address));
    const error = await consumeSignIn(uniqueEmail("ip"), address).catch((e: unknown) => e);
    expect(isProblemError(error) && error.status).toBe(429);
  });

  it("the Credentials provider refuses even the right password once the e-mail's budget is spent", async () => {
    const user = await createTestUser("locked");
    const req = () => new Request("http://localhost/", { headers: { "x-forwarded-for": ip() } });
    await spend(BUDGETS.signInEmail.points, async () => {
      expect(await authorizeWithPassword({ email: user.email, password: "wrong password!" }, req())).toBeNull();
    });
    const error = await authorizeWithPassword({ email: user.email, password: TEST_PASSWORD }, req()).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(RateLimitedSignIn);
    expect((error as RateLimitedSignIn).code).toBe("rate_limited");
  });
});

describe("API rate limit in withOrg", () => {
  it("answers 429 problem+json with Retry-After once the actor's budget is spent", async () => {
    const { orgId } = await createUserWithOrg(`api-${uniqueSuffix()}`);
    const { key } = await createTestApiKey(orgId, "viewer");
    const route = withOrg(async () => new Response(null, { status: 204 }), { rateLimit: { points: 2, duration: 60 } });
    const call = () => route(new Request("http://localhost/api/v1/x", { headers: { authorization: `Bearer ${key}` } }));
    expect((await call()).status).toBe(204);
    expect((await call()).status).toBe(204);
    const limited = await call();
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(await limited.json()).toMatchObject({ type: "/problems/rate-limited", status: 429 });
  });
});
