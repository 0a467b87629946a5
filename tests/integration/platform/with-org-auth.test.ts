/**
 * withOrg authentication failures, each a specific problem+json (RFC 9457):
 * no credentials, malformed / unknown / revoked API key, expired session.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { withOrg } from "@/lib/api/with-org";
import { revokeKey } from "@/lib/api-keys/mutations";
import { authorizeMember } from "@/lib/auth/guards";
import { API_KEY_PATTERN } from "@/lib/orgs/api-key-format";
import { listApiKeys } from "@/lib/orgs/queries";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestApiKey, createUserWithOrg, sessionCookie } from "../../support/factories";

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;
const route = withOrg(async (_req, ctx) =>
  Response.json({ actor: ctx.actor.kind, org: ctx.org.id }),
);
const get = (headers: Record<string, string>) =>
  route(new Request("http://localhost/api/v1/x", { headers }));

beforeAll(async () => {
  owner = await createUserWithOrg("auth");
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

describe("withOrg authentication", () => {
  it("401 unauthorized without credentials", async () => {
    const res = await get({});
    expect(res.status).toBe(401);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    const body = await res.json();
    expect(Object.keys(body).sort()).toEqual(["detail", "status", "title", "type"]);
    expect(body).toMatchObject({ type: "/problems/unauthorized", status: 401 });
  });

  it("401 for a malformed, an unknown and a revoked key", async () => {
    expect((await get({ authorization: "Bearer nope" })).status).toBe(401);
    expect((await get({ authorization: "Basic abc" })).status).toBe(401);
    expect((await get({ authorization: `Bearer kw_abcdefgh_${"A".repeat(32)}` })).status).toBe(401);
    const created = await createTestApiKey(owner.orgId, "member", owner.user.id);
    expect((await get({ authorization: `Bearer ${created.key}` })).status).toBe(200);
    await revokeKey(await authorizeMember(owner.user.id, owner.orgId), created.id);
    const revoked = await get({ authorization: `Bearer ${created.key}` });
    expect(revoked.status).toBe(401);
    expect((await revoked.json()).detail).toMatch(/revoked/);
  });

  it("records when a key was last used and stores only its hash", async () => {
    const created = await createTestApiKey(owner.orgId, "viewer");
    await get({ authorization: `Bearer ${created.key}` });
    const row = (await listApiKeys(owner.orgId)).find((k) => k.id === created.id);
    expect(row?.lastUsedAt).toBeInstanceOf(Date);
    // The secret may itself contain or start with "_": read it with the key's own pattern.
    const secret = API_KEY_PATTERN.exec(created.key)?.[2];
    expect(secret).toHaveLength(32);
    expect(JSON.stringify(row)).not.toContain(secret);
  });

  it("a valid session acts as the user in their organisation", async () => {
    const res = await get({ cookie: await sessionCookie(owner.user.id) });
    expect(await res.json()).toEqual({ actor: "user", org: owner.orgId });
  });

  it("401 session-expired for a session cookie past its expiry", async () => {
    const res = await get({ cookie: await sessionCookie(owner.user.id, { maxAgeSeconds: -60 }) });
    expect(res.status).toBe(401);
    expect(await res.json()).toMatchObject({
      type: "/problems/session-expired",
      title: "Session expired",
    });
  });
});
