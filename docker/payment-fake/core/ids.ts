import { randomBytes } from "node:crypto";

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

/** Random alphanumeric text of the given length (rejection sampling, no modulo bias). */
export function randomText(length: number): string {
  let out = "";
  while (out.length < length) {
    for (const byte of randomBytes(length * 2)) {
      if (byte < 248 && out.length < length) out += ALPHABET[byte % 62];
    }
  }
  return out;
}

/** A provider-style object id: `prefix_` + 24 random alphanumerics, e.g. `cus_…`, `in_…`. */
export function newId(prefix: string): string {
  return `${prefix}_${randomText(24)}`;
}
