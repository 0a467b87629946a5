/**
 * Post-sign-in destinations. The value (a `callbackUrl` query or form field) is
 * resolved against the app's own origin with the WHATWG URL parser — the one
 * browsers use — and refused unless it lands on that origin. Refused outright,
 * before parsing, because browsers and proxies read them in surprising ways:
 * control characters (browsers drop tab, CR and LF, so `/\t/evil.example`
 * becomes `//evil.example`), backslashes (read as `/`), and values whose
 * percent-decoded form would be protocol-relative. The answer is always a
 * path (`/…` + query + fragment), never a full URL.
 */
import { env } from "@/lib/env";

const MAX_CALLBACK_LENGTH = 2048;
const UNSAFE_CHARACTERS = /[\u0000-\u001f\u007f-\u009f\\]/u;

function decodedOnce(value: string): string | null {
  try {
    return decodeURIComponent(value);
  } catch {
    return null;
  }
}

function appOrigin(): string {
  return new URL(env.APP_URL).origin;
}

/** The same-origin path `value` points to, or `fallback` for anything else. */
export function safeCallbackPath(
  value: unknown,
  fallback = "/app",
  origin: string = appOrigin(),
): string {
  if (typeof value !== "string" || value.length === 0 || value.length > MAX_CALLBACK_LENGTH)
    return fallback;
  const decoded = decodedOnce(value);
  if (decoded === null) return fallback;
  for (const form of [value, decoded]) {
    if (UNSAFE_CHARACTERS.test(form) || form.startsWith("//")) return fallback;
  }
  let url: URL;
  try {
    url = new URL(value, origin);
  } catch {
    return fallback;
  }
  if (url.origin !== origin || url.username || url.password) return fallback;
  // Only paths, or full URLs spelled with our own origin.
  if (!value.startsWith("/") && !value.startsWith(`${origin}/`)) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  return path.startsWith("/") && !path.startsWith("//") ? path : fallback;
}
