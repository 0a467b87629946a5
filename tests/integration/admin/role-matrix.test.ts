/**
 * Role matrix of every admin operation (viewer < member < admin
 * < owner, cumulative): each role calls each operation through `runOperation`,
 * i.e. the same role check, schema and body as the server action. Too weak →
 * 403 "Not allowed"; allowed → the body runs (its own rule may still refuse,
 * which is never a 403 for an allowed role here). A non-member gets 404.
 * Billing operations run against an organisation without a subscription, so
 * an allowed call ends in the body's 409 "choose a plan first" — no provider
 * call is needed to tell the role check apart.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { createApiKeyOp, revokeApiKeyOp } from "@/lib/api-keys/operations";
import {
  changePlanOp,
  changeSeatsOp,
  openPortalOp,
  scheduleDowngradeOp,
  withdrawDowngradeOp,
} from "@/lib/billing/operations";
import { inviteOp, resendInvitationOp, revokeInvitationOp } from "@/lib/invitations/operations";
import { runOperation, type Operation } from "@/lib/api/operation";
import { changeRoleOp, removeMemberOp, transferOwnershipOp } from "@/lib/members/operations";
import { ROLES, roleAtLeast, type Role } from "@/lib/orgs/roles";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createWebhookOp, deleteWebhookOp, setWebhookEnabledOp } from "@/lib/webhooks/operations";
import {
  addMember,
  createTestApiKey,
  createTestUser,
  createUserWithOrg,
} from "../../support/factories";

let orgId: string;
let orgName: string;
let outsider: string;
const users = {} as Record<Role, string>;
let target: string;

beforeAll(async () => {
  const owner = await createUserWithOrg("matrix-owner");
  orgId = owner.orgId;
  orgName = owner.name;
  users.owner = owner.user.id;
  for (const role of ["admin", "member", "viewer"] as const) {
    const u = await createTestUser(`matrix-${role}`);
    await addMember(orgId, u.id, role);
    users[role] = u.id;
  }
  const t = await createTestUser("matrix-target");
  await addMember(orgId, t.id, "viewer");
  target = t.id;
  outsider = (await createTestUser("matrix-outsider")).id;
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

type Case = {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- one table holds operations of different input and output types
  op: Operation<any, any>;
  fields: () => Promise<Record<string, string>> | Record<string, string>;
  min: Role;
};

const unknownId = "00000000-0000-4000-8000-000000000000";
const cases: Case[] = [
  { op: changeRoleOp, min: "admin", fields: () => ({ userId: target, role: "viewer" }) },
  { op: removeMemberOp, min: "admin", fields: () => ({ userId: unknownId }) },
  {
    op: transferOwnershipOp,
    min: "owner",
    fields: () => ({ userId: unknownId, confirm: "wrong name" }),
  },
  { op: inviteOp, min: "admin", fields: () => ({ email: "not-an-email", role: "member" }) },
  { op: resendInvitationOp, min: "admin", fields: () => ({ invitationId: unknownId }) },
  { op: revokeInvitationOp, min: "admin", fields: () => ({ invitationId: unknownId }) },
  {
    op: createApiKeyOp,
    min: "member",
    fields: () => ({ name: "matrix key", role: "viewer", scope: "personal" }),
  },
  { op: revokeApiKeyOp, min: "member", fields: () => ({ keyId: unknownId }) },
  { op: changeSeatsOp, min: "admin", fields: () => ({ seats: "4" }) },
  { op: changePlanOp, min: "admin", fields: () => ({ plan: "institute" }) },
  { op: scheduleDowngradeOp, min: "admin", fields: () => ({}) },
  { op: withdrawDowngradeOp, min: "admin", fields: () => ({}) },
  { op: openPortalOp, min: "admin", fields: () => ({}) },
  { op: createWebhookOp, min: "admin", fields: () => ({ url: "https://10.0.0.1/hook" }) },
  {
    op: setWebhookEnabledOp,
    min: "admin",
    fields: () => ({ endpointId: unknownId, enabled: "false" }),
  },
  { op: deleteWebhookOp, min: "admin", fields: () => ({ endpointId: unknownId }) },
];

describe("every admin operation checks the caller's role", () => {
  for (const c of cases) {
    it(`${c.op.name} needs ${c.min}`, async () => {
      expect(c.op.role).toBe(c.min);
      for (const role of ROLES) {
        const state = await runOperation(c.op, users[role], orgId, await c.fields());
        const code = state.status === "error" ? state.code : 200;
        if (roleAtLeast(role, c.min))
          expect(code, `${role} on ${c.op.name}: ${JSON.stringify(state)}`).not.toBe(403);
        else {
          expect(code, `${role} on ${c.op.name}`).toBe(403);
          expect(state.status === "error" && state.message).toMatch(/needs the .* role or higher/);
        }
      }
      const stranger = await runOperation(c.op, outsider, orgId, await c.fields());
      expect(stranger).toMatchObject({ status: "error", code: 404 });
    });
  }
});

describe("rules inside the operations", () => {
  it("an admin cannot touch the owner; the last owner can be neither demoted nor removed", async () => {
    const byAdmin = await runOperation(removeMemberOp, users.admin, orgId, { userId: users.owner });
    expect(byAdmin).toMatchObject({ status: "error", code: 403 });
    const self = await runOperation(removeMemberOp, users.owner, orgId, { userId: users.owner });
    expect(self).toMatchObject({ status: "error", code: 409 });
    expect((self as { message: string }).message).toMatch(/last owner/);
    const demote = await runOperation(changeRoleOp, users.owner, orgId, {
      userId: users.owner,
      role: "admin",
    });
    expect(demote).toMatchObject({ status: "error", code: 409 });
  });

  it("role changes never grant owner; ownership moves only by transfer with the name typed", async () => {
    const grant = await runOperation(changeRoleOp, users.owner, orgId, {
      userId: users.admin,
      role: "owner",
    });
    expect(grant).toMatchObject({ status: "error", code: 422 });
    const typo = await runOperation(transferOwnershipOp, users.owner, orgId, {
      userId: users.admin,
      confirm: "nope",
    });
    expect(typo).toMatchObject({ status: "error", code: 409 });
    expect(typo.status === "error" && typo.fieldErrors?.confirm).toBeTruthy();
  });

  it("a member's key never outranks them, organisation keys are for admins, and members revoke only their own", async () => {
    const tooStrong = await runOperation(createApiKeyOp, users.member, orgId, {
      name: "k",
      role: "admin",
      scope: "personal",
    });
    expect(tooStrong).toMatchObject({ status: "error", code: 403 });
    const orgKey = await runOperation(createApiKeyOp, users.member, orgId, {
      name: "k",
      role: "member",
      scope: "organization",
    });
    expect(orgKey).toMatchObject({ status: "error", code: 403 });
    const adminsKey = await createTestApiKey(orgId, "member", users.admin);
    const revoke = await runOperation(revokeApiKeyOp, users.member, orgId, { keyId: adminsKey.id });
    expect(revoke).toMatchObject({ status: "error", code: 403 });
    const byAdmin = await runOperation(revokeApiKeyOp, users.admin, orgId, { keyId: adminsKey.id });
    expect(byAdmin).toMatchObject({ status: "success" });
  });

  it("transfer: the new owner owns, the old owner becomes admin, and can no longer transfer", async () => {
    const done = await runOperation(transferOwnershipOp, users.owner, orgId, {
      userId: users.admin,
      confirm: orgName,
    });
    expect(done).toMatchObject({ status: "success" });
    const again = await runOperation(transferOwnershipOp, users.owner, orgId, {
      userId: users.member,
      confirm: orgName,
    });
    expect(again).toMatchObject({ status: "error", code: 403 });
  });
});
