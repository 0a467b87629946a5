/**
 * Tenancy: a user or key of organisation A asking for organisation B's data
 * gets 404 (never 403 — no existence leak), and org-scoped
 * writes with a foreign id change nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { authorizeMember } from "@/lib/auth/guards";
import { isProblemError } from "@/lib/api/problem";
import { withOrg } from "@/lib/api/with-org";
import { revokeKey } from "@/lib/api-keys/mutations";
import { listApiKeys } from "@/lib/orgs/queries";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg, sessionCookie } from "../../support/factories";

let a: Awaited<ReturnType<typeof createUserWithOrg>>;
let b: Awaited<ReturnType<typeof createUserWithOrg>>;

beforeAll(async () => {
  a = await createUserWithOrg("alice");
  b = await createUserWithOrg("bob");
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

const route = withOrg(async (_req, ctx) => Response.json({ orgId: ctx.org.id }), {
  role: "viewer",
});

describe("cross-organisation access", () => {
  it("guard: the owner of A is not found in B", async () => {
    const error = await authorizeMember(a.user.id, b.orgId, "viewer").catch((e: unknown) => e);
    expect(isProblemError(error) && error.status).toBe(404);
  });

  it("guard: an unknown organisation id is also 404", async () => {
    const error = await authorizeMember(a.user.id, crypto.randomUUID(), "viewer").catch(
      (e: unknown) => e,
    );
    expect(isProblemError(error) && error.status).toBe(404);
  });

  it("route: a session of A naming B (by id or slug) gets 404 problem+json", async () => {
    const cookie = await sessionCookie(a.user.id);
    for (const org of [b.orgId, b.slug]) {
      const res = await route(
        new Request("http://localhost/api/x", { headers: { cookie, "x-ketwise-org": org } }),
      );
      expect(res.status).toBe(404);
      expect(await res.json()).toMatchObject({ type: "/problems/not-found", status: 404 });
    }
  });

  it("route: the org cookie pointing at B falls back to A's own organisation", async () => {
    const cookie = `${await sessionCookie(a.user.id)}; kw_org=${b.orgId}`;
    const res = await route(new Request("http://localhost/api/x", { headers: { cookie } }));
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ orgId: a.orgId });
  });

  it("route: an API key of A always acts in A", async () => {
    const { key } = await createTestApiKey(a.orgId, "viewer");
    const res = await route(
      new Request("http://localhost/api/x", {
        headers: { authorization: `Bearer ${key}`, "x-ketwise-org": b.orgId },
      }),
    );
    expect(await res.json()).toEqual({ orgId: a.orgId });
  });

  it("data layer: revoking B's key through A's id changes nothing", async () => {
    const bKey = await createTestApiKey(b.orgId, "member");
    const asA = await authorizeMember(a.user.id, a.orgId);
    await expect(revokeKey(asA, bKey.id)).rejects.toMatchObject({ status: 404 });
    const keys = await listApiKeys(b.orgId);
    expect(keys.find((k) => k.id === bKey.id)?.revokedAt).toBeNull();
    expect((await listApiKeys(a.orgId)).some((k) => k.id === bKey.id)).toBe(false);
  });
});
