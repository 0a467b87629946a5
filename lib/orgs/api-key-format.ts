/**
 * API key format: `kw_<prefix>_<secret>` — prefix 8 lowercase base-32 chars
 * (shown in the UI to tell keys apart), secret 32 base64url chars (192 bits).
 * Only the prefix and SHA-256(hex) of the whole key are stored.
 */
import { createHash, randomBytes } from "node:crypto";

const PREFIX_ALPHABET = "abcdefghijkmnpqrstuvwxyz23456789";
export const API_KEY_PATTERN = /^kw_([a-z2-9]{8})_([A-Za-z0-9_-]{32})$/;

export function hashApiKey(key: string): string {
  return createHash("sha256").update(key).digest("hex");
}

export function generateApiKey(): { key: string; prefix: string; hash: string } {
  const bytes = randomBytes(8);
  const prefix = Array.from(bytes, (b) => PREFIX_ALPHABET[b % PREFIX_ALPHABET.length]).join("");
  const secret = randomBytes(24).toString("base64url");
  const key = `kw_${prefix}_${secret}`;
  return { key, prefix, hash: hashApiKey(key) };
}

/** True when the string has the shape of a Ketwise API key (says nothing about validity). */
export function looksLikeApiKey(value: string): boolean {
  return API_KEY_PATTERN.test(value);
}
