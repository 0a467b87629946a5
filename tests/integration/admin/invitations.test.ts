/**
 * Invitations against the real database and the local mail sink: the e-mailed
 * link joins once with the invited role; a reused, expired, forged, replaced
 * or foreign link is refused with its own reason; seats (members + pending
 * invitations) cap invitations with an offer to upgrade.
 * Signature: HMAC-SHA256 (RFC 2104) over the payload; a changed character fails.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { memberships } from "@/db/schema";
import { resendInvitationOp, inviteOp, revokeInvitationOp } from "@/lib/invitations/operations";
import { acceptInvitation } from "@/lib/invitations/mutations";
import { listOpenInvitations } from "@/lib/invitations/queries";
import { verifyInvitationToken } from "@/lib/invitations/token";
import { runOperation } from "@/lib/api/operation";
import { closeRedis } from "@/lib/rate-limit/redis";
import { createTestUser, createUserWithOrg, uniqueEmail } from "../../support/factories";
import { listMail, waitForMail } from "../../support/maildev";

/** maildev stamps messages to the whole second; compare from the start of this second. */
const wholeSecond = () => new Date(Math.floor(Date.now() / 1000) * 1000);

let owner: Awaited<ReturnType<typeof createUserWithOrg>>;

beforeAll(async () => {
  owner = await createUserWithOrg("inv-owner");
});
afterAll(async () => {
  await closeRedis();
  await closeDb();
});

async function invite(email: string, role = "member") {
  const since = wholeSecond();
  const state = await runOperation(inviteOp, owner.user.id, owner.orgId, { email, role });
  return { state, since };
}

async function tokenFromMail(email: string, since: Date) {
  const mail = await waitForMail(email, since);
  const match = /\/invite\/(\S+)/.exec(mail.text ?? "");
  if (!match) throw new Error("no invitation link in the e-mail");
  return { mail, token: match[1] };
}

/** Both mails can carry the same second: wait for the one whose link differs from `old`. */
async function newerToken(email: string, since: Date, old: string): Promise<string> {
  for (let i = 0; i < 80; i++) {
    const tokens = (await listMail())
      .filter((m) => m.to.some((t) => t.address === email) && new Date(m.time) >= since)
      .map((m) => /\/invite\/(\S+)/.exec(m.text ?? "")?.[1])
      .filter((t): t is string => !!t && t !== old);
    if (tokens.length) return tokens[0];
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no newer invitation mail to ${email}`);
}

describe("invitation links", () => {
  it("the e-mailed link joins once, with the invited role", async () => {
    const guest = await createTestUser("inv-guest");
    const { state, since } = await invite(guest.email, "viewer");
    expect(state).toMatchObject({ status: "success" });
    const { mail, token } = await tokenFromMail(guest.email, since);
    expect(mail.subject).toContain(owner.name);
    expect(mail.text).toMatch(/as Viewer/);
    const joined = await acceptInvitation(token, { id: guest.id, email: guest.email });
    expect(joined).toEqual({ orgId: owner.orgId, role: "viewer" });
    const row = await db
      .select()
      .from(memberships)
      .where(and(eq(memberships.orgId, owner.orgId), eq(memberships.userId, guest.id)));
    expect(row[0].role).toBe("viewer");
    await expect(
      acceptInvitation(token, { id: guest.id, email: guest.email }),
    ).rejects.toMatchObject({ status: 409, message: expect.stringMatching(/already been used/) });
  });

  it("refuses a link for another e-mail, a forged or expired one, and a replaced or revoked one", async () => {
    const email = uniqueEmail("inv-b");
    const { state, since } = await invite(email);
    expect(state).toMatchObject({ status: "success" });
    const { token } = await tokenFromMail(email, since);
    const stranger = await createTestUser("inv-stranger");
    await expect(
      acceptInvitation(token, { id: stranger.id, email: stranger.email }),
    ).rejects.toMatchObject({ status: 403 });
    const forged = token.slice(0, -2) + (token.endsWith("AA") ? "BB" : "AA");
    await expect(acceptInvitation(forged, { id: stranger.id, email })).rejects.toMatchObject({
      status: 400,
    });
    const later = new Date(Date.now() + 8 * 86_400_000);
    expect(verifyInvitationToken(process.env.AUTH_SECRET!, token, later)).toEqual({
      ok: false,
      problem: "expired",
    });
    await expect(acceptInvitation(token, { id: stranger.id, email }, later)).rejects.toMatchObject({
      status: 410,
    });

    const pending = (await listOpenInvitations(owner.orgId)).find((i) => i.email === email)!;
    const resentAt = wholeSecond();
    expect(
      await runOperation(resendInvitationOp, owner.user.id, owner.orgId, {
        invitationId: pending.id,
      }),
    ).toMatchObject({ status: "success" });
    const fresh = await newerToken(email, resentAt, token);
    expect(fresh).not.toBe(token);
    await expect(acceptInvitation(token, { id: stranger.id, email })).rejects.toMatchObject({
      status: 410,
      message: expect.stringMatching(/newer invitation/),
    });
    expect(
      await runOperation(revokeInvitationOp, owner.user.id, owner.orgId, {
        invitationId: pending.id,
      }),
    ).toMatchObject({ status: "success" });
    await expect(acceptInvitation(fresh, { id: stranger.id, email })).rejects.toMatchObject({
      status: 410,
      message: expect.stringMatching(/withdrawn/),
    });
  });

  it("refuses to invite a member twice or beyond the seats, offering an upgrade", async () => {
    const again = await invite(owner.user.email);
    expect(again.state).toMatchObject({ status: "error", code: 409 });
    // Sandbox: 3 seats. The owner and the viewer who joined above use two; one pending invitation was revoked.
    const third = await invite(uniqueEmail("inv-c"));
    expect(third.state).toMatchObject({ status: "success" });
    const fourth = await invite(uniqueEmail("inv-d"));
    expect(fourth.state).toMatchObject({ status: "error", code: 402 });
    expect((fourth.state as { message: string }).message).toMatch(
      /Sandbox plan allows 3 people.*Upgrade/,
    );
  });
});
