/**
 * Role helper matrix against the real database: a member of an organisation
 * may act from their role up, never above it (roles are cumulative:
 * viewer < member < admin < owner). 403 for a member whose role
 * is too weak; the same check through withOrg for sessions and API keys.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { authorizeMember } from "@/lib/auth/guards";
import { isProblemError } from "@/lib/api/problem";
import { withOrg } from "@/lib/api/with-org";
import { ROLES, type Role } from "@/lib/orgs/roles";
import { closeRedis } from "@/lib/rate-limit/redis";
import {
  addMember,
  createTestApiKey,
  createTestUser,
  createUserWithOrg,
  sessionCookie,
} from "../../support/factories";

let orgId: string;
const userByRole = {} as Record<Role, string>;

beforeAll(async () => {
  const owner = await createUserWithOrg("owner");
  orgId = owner.orgId;
  userByRole.owner = owner.user.id;
  for (const role of ["admin", "member", "viewer"] as const) {
    const user = await createTestUser(role);
    await addMember(orgId, user.id, role);
    userByRole[role] = user.id;
  }
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

async function statusOf(promise: Promise<unknown>): Promise<number> {
  try {
    await promise;
    return 200;
  } catch (error) {
    if (isProblemError(error)) return error.status;
    throw error;
  }
}

// Expected verdicts: rows = the actor's role, columns = the action's minimum role.
const matrix: Record<Role, Record<Role, number>> = {
  viewer: { viewer: 200, member: 403, admin: 403, owner: 403 },
  member: { viewer: 200, member: 200, admin: 403, owner: 403 },
  admin: { viewer: 200, member: 200, admin: 200, owner: 403 },
  owner: { viewer: 200, member: 200, admin: 200, owner: 200 },
};

describe("authorizeMember (the check behind requireRole / requireMembership)", () => {
  for (const actor of ROLES) {
    for (const needed of ROLES) {
      it(`${actor} asking for a ${needed} action → ${matrix[actor][needed]}`, async () => {
        expect(await statusOf(authorizeMember(userByRole[actor], orgId, needed))).toBe(
          matrix[actor][needed],
        );
      });
    }
  }

  it("returns the organisation and the actual role on success", async () => {
    const access = await authorizeMember(userByRole.member, orgId, "viewer");
    expect(access.role).toBe("member");
    expect(access.org.id).toBe(orgId);
  });

  it("names the needed and the actual role in the 403 detail", async () => {
    const error = await authorizeMember(userByRole.viewer, orgId, "member").catch(
      (e: unknown) => e,
    );
    expect(isProblemError(error) && error.problem.detail).toMatch(
      /needs the Member role.*you are Viewer/,
    );
  });
});

describe("withOrg enforces the route's role", () => {
  const memberRoute = withOrg(async (_req, ctx) => Response.json({ role: ctx.role }), {
    role: "member",
  });
  const adminRoute = withOrg(async (_req, ctx) => Response.json({ role: ctx.role }), {
    role: "admin",
  });

  it("viewer session cannot call a member route; member can", async () => {
    const asViewer = await memberRoute(
      new Request("http://localhost/api/x", {
        headers: { cookie: await sessionCookie(userByRole.viewer), "x-ketwise-org": orgId },
      }),
    );
    expect(asViewer.status).toBe(403);
    expect(asViewer.headers.get("content-type")).toBe("application/problem+json");
    const body = await asViewer.json();
    expect(body).toMatchObject({ type: "/problems/forbidden", title: "Not allowed", status: 403 });

    const asMember = await memberRoute(
      new Request("http://localhost/api/x", {
        headers: { cookie: await sessionCookie(userByRole.member), "x-ketwise-org": orgId },
      }),
    );
    expect(asMember.status).toBe(200);
    expect(await asMember.json()).toEqual({ role: "member" });
  });

  it("member API key cannot call an admin route; admin key can", async () => {
    const memberKey = await createTestApiKey(orgId, "member", userByRole.member);
    const adminKey = await createTestApiKey(orgId, "admin", userByRole.admin);
    const call = (key: string) =>
      adminRoute(
        new Request("http://localhost/api/x", { headers: { authorization: `Bearer ${key}` } }),
      );
    expect((await call(memberKey.key)).status).toBe(403);
    const ok = await call(adminKey.key);
    expect(ok.status).toBe(200);
    expect(await ok.json()).toEqual({ role: "admin" });
  });
});
