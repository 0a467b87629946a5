/**
 * Redis-backed rate limits: sign-in per known client IP (50 / 15 min; the
 * per-account progressive delay is tested in tests/integration/security),
 * and the per-actor API budget of withOrg answering 429 with Retry-After.
 */
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { isProblemError } from "@/lib/api/problem";
import { withOrg } from "@/lib/api/with-org";
import { BUDGETS, consumeSignInIp } from "@/lib/rate-limit";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg, uniqueSuffix } from "../../support/factories";

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

const ip = () =>
  `10.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;

async function spend(times: number, fn: () => Promise<void>) {
  for (let i = 0; i < times; i++) await fn();
}

describe("sign-in rate limit by address", () => {
  it("limits one known client address across many e-mails", async () => {
    const address = ip();
    await spend(BUDGETS.signInIp.points, () => consumeSignInIp(address));
    const error = await consumeSignInIp(address).catch((e: unknown) => e);
    expect(isProblemError(error) && error.status).toBe(429);
    if (!isProblemError(error)) return;
    expect(error.problem.detail).toMatch(
      /^Too many sign-in attempts from your network\. Try again in \d+ minutes\.$/,
    );
    expect(error.problem.retryAfter).toBeGreaterThan(800);
  });

  it("does nothing for an unknown address (limits per account and browser apply instead)", async () => {
    await spend(BUDGETS.signInIp.points + 1, () => consumeSignInIp(null));
  });
});

describe("API rate limit in withOrg", () => {
  it("answers 429 problem+json with Retry-After once the actor's budget is spent", async () => {
    const { orgId } = await createUserWithOrg(`api-${uniqueSuffix()}`);
    const { key } = await createTestApiKey(orgId, "viewer");
    const route = withOrg(async () => new Response(null, { status: 204 }), {
      rateLimit: { points: 2, duration: 60 },
    });
    const call = () =>
      route(
        new Request("http://localhost/api/v1/x", { headers: { authorization: `Bearer ${key}` } }),
      );
    expect((await call()).status).toBe(204);
    expect((await call()).status).toBe(204);
    const limited = await call();
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(await limited.json()).toMatchObject({ type: "/problems/rate-limited", status: 429 });
  });
});
