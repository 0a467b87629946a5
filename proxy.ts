/**
 * Runs before every request (Next.js proxy): security headers on every
 * answer (lib/security/headers.ts) — a per-request CSP nonce for pages, a
 * nothing-allowed policy for API answers — and a 403 problem for server
 * actions posted from another site (Next.js would otherwise answer 500).
 */
import { NextResponse, type NextRequest } from "next/server";
import { env } from "@/lib/env";
import {
  API_CONTENT_SECURITY_POLICY,
  baseSecurityHeaders,
  contentSecurityPolicy,
  isForeignOriginAction,
  newNonce,
} from "@/lib/security/headers";

function options() {
  return { development: env.NODE_ENV === "development", https: env.APP_URL.startsWith("https://") };
}

export function proxy(request: NextRequest): NextResponse {
  const opts = options();
  if (isForeignOriginAction(request.method, request.headers)) {
    const res = NextResponse.json(
      {
        type: "/problems/forbidden",
        title: "Not allowed",
        status: 403,
        detail: "This form was sent from another site. Open Ketwise itself and try again.",
      },
      { status: 403, headers: { "content-type": "application/problem+json" } },
    );
    for (const [k, v] of Object.entries(baseSecurityHeaders(opts))) res.headers.set(k, v);
    res.headers.set("content-security-policy", API_CONTENT_SECURITY_POLICY);
    return res;
  }

  const isApi = request.nextUrl.pathname.startsWith("/api/");
  const nonce = isApi ? null : newNonce();
  const csp = nonce ? contentSecurityPolicy(nonce, opts) : API_CONTENT_SECURITY_POLICY;
  const requestHeaders = new Headers(request.headers);
  if (nonce) {
    requestHeaders.set("x-nonce", nonce);
    requestHeaders.set("content-security-policy", csp);
  }
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", csp);
  for (const [k, v] of Object.entries(baseSecurityHeaders(opts))) response.headers.set(k, v);
  return response;
}

export const config = {
  matcher: [
    // Everything but build assets (immutable files with their own headers from next.config).
    { source: "/((?!_next/static|_next/image|favicon.ico|icon.svg).*)" },
  ],
};
