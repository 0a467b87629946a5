/**
 * Invitation links carry a signed token:
 *
 *   token = base64url(payload) "." base64url(HMAC-SHA256(secret, "ketwise-invitation." + payload))
 *   payload = "<invitation id>.<expiry, Unix seconds>.<16 random bytes, base64url>"
 *
 * The signature rejects forged or altered links without a database lookup and
 * the expiry travels inside it; single use comes from the database, which
 * stores only SHA-256(token) and marks the invitation accepted. Re-sending an
 * invitation issues a new token, which invalidates the old link.
 * (HMAC: RFC 2104; constant-time comparison is common practice.)
 */
import { createHash, createHmac, randomBytes, timingSafeEqual } from "node:crypto";

export const INVITATION_TTL_DAYS = 7;

export type TokenProblem = "malformed" | "forged" | "expired";
export type VerifiedToken =
  { ok: true; invitationId: string; expiresAt: Date } | { ok: false; problem: TokenProblem };

const b64 = (buf: Buffer | string) => Buffer.from(buf).toString("base64url");

function mac(secret: string, payload: string): Buffer {
  return createHmac("sha256", secret).update(`ketwise-invitation.${payload}`).digest();
}

export function signInvitationToken(secret: string, invitationId: string, expiresAt: Date): string {
  const payload = `${invitationId}.${Math.floor(expiresAt.getTime() / 1000)}.${randomBytes(16).toString("base64url")}`;
  return `${b64(payload)}.${b64(mac(secret, payload))}`;
}

export function verifyInvitationToken(
  secret: string,
  token: string,
  now = new Date(),
): VerifiedToken {
  const parts = token.split(".");
  if (
    parts.length !== 2 ||
    !/^[A-Za-z0-9_-]+$/.test(parts[0]) ||
    !/^[A-Za-z0-9_-]{43}$/.test(parts[1])
  ) {
    return { ok: false, problem: "malformed" };
  }
  const payload = Buffer.from(parts[0], "base64url").toString("utf8");
  const expected = mac(secret, payload);
  const given = Buffer.from(parts[1], "base64url");
  if (given.length !== expected.length || !timingSafeEqual(given, expected))
    return { ok: false, problem: "forged" };
  const match = /^([0-9a-f-]{36})\.(\d{1,12})\.[A-Za-z0-9_-]{22}$/.exec(payload);
  if (!match) return { ok: false, problem: "malformed" };
  const expiresAt = new Date(Number(match[2]) * 1000);
  if (expiresAt.getTime() <= now.getTime()) return { ok: false, problem: "expired" };
  return { ok: true, invitationId: match[1], expiresAt };
}

export function hashInvitationToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function invitationExpiry(now = new Date()): Date {
  return new Date(now.getTime() + INVITATION_TTL_DAYS * 86_400_000);
}
