/**
 * An API key acts with the lower of its own role and its creator's CURRENT
 * role, decided on every request: the reported hole was a member demoted to
 * viewer whose personal key still created runs and library circuits. A
 * creator who leaves disables their keys (organisation keys included), and
 * both changes are written to the audit log and shown on the API-keys page.
 */
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, db } from "@/db";
import { auditEvents } from "@/db/schema";
import { listVisibleKeys } from "@/lib/api-keys/queries";
import { keyStanding } from "@/lib/api-keys/effective-role";
import { runOperation } from "@/lib/api/operation";
import { changeRoleOp, removeMemberOp } from "@/lib/members/operations";
import { closeRedis } from "@/lib/rate-limit/redis";
import { api } from "../runs/support/api";
import {
  addMember,
  createTestApiKey,
  createTestUser,
  createUserWithOrg,
} from "../../support/factories";

const BELL = {
  format: "qasm2",
  source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n',
};

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;

beforeAll(async () => {
  owner = await createUserWithOrg("keyrights-owner");
});

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

const saveCircuit = (key: string, name: string) =>
  api("POST", "/api/v1/circuits", { key, body: { ...BELL, name } });

async function auditFor(keyId: string) {
  return db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.orgId, owner.orgId), eq(auditEvents.targetId, keyId)));
}

describe("key rights follow the creator's current role", () => {
  it("a member demoted to viewer: their member key now acts as viewer (reads yes, writes 403), audited", async () => {
    const member = await createTestUser("keyrights-member");
    await addMember(owner.orgId, member.id, "member");
    const { key, id } = await createTestApiKey(owner.orgId, "member", member.id);
    expect((await saveCircuit(key, "before demotion")).status).toBe(201);

    const demoted = await runOperation(changeRoleOp, owner.user.id, owner.orgId, {
      userId: member.id,
      role: "viewer",
    });
    expect(demoted).toMatchObject({ status: "success" });

    const write = await saveCircuit(key, "after demotion");
    expect(write.status).toBe(403);
    expect(write.body.detail).toMatch(/acts as Viewer.*creator is now Viewer/);
    const run = await api("POST", "/api/v1/runs", {
      key,
      body: { circuit: BELL, observable: { format: "pauli", terms: "ZZ" } },
    });
    expect(run.status).toBe(403);
    expect((await api("GET", "/api/v1/circuits", { key })).status).toBe(200);

    const events = await auditFor(id);
    expect(events.map((e) => e.action)).toContain("api_key.capped");
    expect(events.find((e) => e.action === "api_key.capped")?.metadata).toMatchObject({
      keyRole: "member",
      actsAs: "viewer",
    });

    const listed = (
      await listVisibleKeys(owner.orgId, { userId: owner.user.id, role: "owner" })
    ).find((k) => k.id === id)!;
    expect(keyStanding(listed.role, listed.creatorRole)).toMatchObject({
      state: "capped",
      role: "viewer",
    });

    // Promoted back: the key's own role applies again.
    await runOperation(changeRoleOp, owner.user.id, owner.orgId, {
      userId: member.id,
      role: "member",
    });
    expect((await saveCircuit(key, "after promotion")).status).toBe(201);
  });

  it("an admin's organisation key is disabled when the admin is removed, and says why", async () => {
    const admin = await createTestUser("keyrights-admin");
    await addMember(owner.orgId, admin.id, "admin");
    const orgKey = await createTestApiKey(owner.orgId, "admin", admin.id, "organization");
    expect((await api("GET", "/api/v1/usage", { key: orgKey.key })).status).toBe(200);

    const removed = await runOperation(removeMemberOp, owner.user.id, owner.orgId, {
      userId: admin.id,
    });
    expect(removed).toMatchObject({ status: "success" });

    const res = await api("GET", "/api/v1/usage", { key: orgKey.key });
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/disabled: the person who created it is no longer a member/);
    expect((await auditFor(orgKey.id)).map((e) => e.action)).toContain("api_key.disabled");
    const listed = (
      await listVisibleKeys(owner.orgId, { userId: owner.user.id, role: "owner" })
    ).find((k) => k.id === orgKey.id)!;
    expect(listed.creatorRole).toBeNull();
    expect(keyStanding(listed.role, listed.creatorRole).state).toBe("disabled");
  });

  it("a demotion that stays at or above the key's role changes nothing and writes no key entry", async () => {
    const admin = await createTestUser("keyrights-admin2");
    await addMember(owner.orgId, admin.id, "admin");
    const { key, id } = await createTestApiKey(owner.orgId, "member", admin.id);
    await runOperation(changeRoleOp, owner.user.id, owner.orgId, {
      userId: admin.id,
      role: "member",
    });
    expect((await saveCircuit(key, "still member")).status).toBe(201);
    expect((await auditFor(id)).map((e) => e.action)).not.toContain("api_key.capped");
  });
});
