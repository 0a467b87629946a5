/**
 * The HTTP security headers of every answer (applied by proxy.ts).
 *
 * Pages get a strict Content-Security-Policy with a fresh nonce per request
 * (the nonce-based "strict CSP" of the OWASP CSP Cheat Sheet; Next.js reads
 * the nonce from the request's CSP header and puts it on its own scripts):
 * scripts only with the nonce (and what they load, 'strict-dynamic'), no
 * 'unsafe-eval' outside development, no plugins, no <base> hijack, and never
 * framed (frame-ancestors 'none', plus X-Frame-Options for old browsers).
 * Styles allow inline (React style attributes, the code editor's injected
 * styles) — styles cannot run code. API answers get a policy that allows
 * nothing at all. HSTS only when the app's own URL is https.
 */
export type SecurityOptions = { development: boolean; https: boolean };

export function contentSecurityPolicy(nonce: string, options: SecurityOptions): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    `connect-src 'self'${options.development ? " ws: wss:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "frame-ancestors 'none'",
    ...(options.https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

/** For JSON, CSV and other non-HTML answers: nothing may load, nothing may frame. */
export const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'";

/** Headers every answer carries besides the CSP. */
export function baseSecurityHeaders(options: SecurityOptions): Record<string, string> {
  return {
    "x-content-type-options": "nosniff",
    "x-frame-options": "DENY",
    "referrer-policy": "strict-origin-when-cross-origin",
    "permissions-policy":
      "camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()",
    "cross-origin-opener-policy": "same-origin",
    ...(options.https
      ? { "strict-transport-security": "max-age=63072000; includeSubDomains" }
      : {}),
  };
}

/** A fresh, unguessable nonce (128 random bits, base64). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/**
 * True for a server-action POST whose Origin is another site than the Host it
 * was sent to (a cross-site form or fetch). Browsers always send Origin on
 * POST; a request without one is not from a browser page and carries no
 * ambient-credential risk, so it is left to Next.js's own checks.
 */
export function isForeignOriginAction(method: string, headers: Headers): boolean {
  if (method !== "POST" || !headers.has("next-action")) return false;
  const origin = headers.get("origin");
  if (origin === null) return false;
  const host = headers.get("x-forwarded-host") ?? headers.get("host");
  if (!host) return true;
  try {
    return new URL(origin).host !== host.split(",")[0].trim();
  } catch {
    return true; // "null" (sandboxed frames, privacy redirects) or garbage
  }
}
