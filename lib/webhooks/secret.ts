/**
 * Webhook signing secrets: `whsec_` + 32 random bytes (base64url), shown to the admin
 * once and stored encrypted with AES-256-GCM under a key derived from AUTH_SECRET by
 * HKDF-SHA256 (RFC 5869), so a database dump alone does not reveal them.
 */
import "server-only";
import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from "node:crypto";
import { env } from "@/lib/env";

function key(): Buffer {
  return Buffer.from(
    hkdfSync("sha256", env.AUTH_SECRET, "ketwise", "webhook signing secrets v1", 32),
  );
}

export function generateWebhookSecret(): string {
  return `whsec_${randomBytes(32).toString("base64url")}`;
}

export function encryptSecret(secret: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv("aes-256-gcm", key(), iv);
  const data = Buffer.concat([cipher.update(secret, "utf8"), cipher.final()]);
  return [iv, cipher.getAuthTag(), data].map((b) => b.toString("base64url")).join(".");
}

export function decryptSecret(stored: string): string {
  const [iv, tag, data] = stored.split(".").map((p) => Buffer.from(p, "base64url"));
  const decipher = createDecipheriv("aes-256-gcm", key(), iv);
  decipher.setAuthTag(tag);
  return Buffer.concat([decipher.update(data), decipher.final()]).toString("utf8");
}
