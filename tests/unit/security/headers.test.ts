/**
 * Security headers and the cross-site server-action check (proxy.ts). The
 * policy follows the nonce-based strict CSP of the OWASP Content Security
 * Policy Cheat Sheet and the header set of the OWASP HTTP Headers Cheat Sheet
 * (nosniff, frame denial, referrer policy, permissions policy, HSTS on https).
 */
import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import { proxy } from "@/proxy";
import {
  baseSecurityHeaders,
  contentSecurityPolicy,
  isForeignOriginAction,
} from "@/lib/security/headers";

const directives = (csp: string) =>
  new Map(
    csp.split(";").map((d) => {
      const [name, ...values] = d.trim().split(/\s+/);
      return [name, values] as const;
    }),
  );

describe("content security policy", () => {
  it("production: scripts only by nonce, no eval, no inline script, never framed", () => {
    const csp = directives(contentSecurityPolicy("abc123", { development: false, https: false }));
    expect(csp.get("script-src")).toEqual(["'self'", "'nonce-abc123'", "'strict-dynamic'"]);
    expect(csp.get("script-src")).not.toContain("'unsafe-eval'");
    expect(csp.get("script-src")).not.toContain("'unsafe-inline'");
    expect(csp.get("frame-ancestors")).toEqual(["'none'"]);
    expect(csp.get("object-src")).toEqual(["'none'"]);
    expect(csp.get("base-uri")).toEqual(["'self'"]);
    expect(csp.has("upgrade-insecure-requests")).toBe(false);
  });

  it("development adds eval for the dev server only; https adds upgrade-insecure-requests", () => {
    expect(
      directives(contentSecurityPolicy("n", { development: true, https: false })).get("script-src"),
    ).toContain("'unsafe-eval'");
    expect(
      directives(contentSecurityPolicy("n", { development: false, https: true })).has(
        "upgrade-insecure-requests",
      ),
    ).toBe(true);
  });

  it("HSTS only over https", () => {
    expect(
      baseSecurityHeaders({ development: false, https: false })["strict-transport-security"],
    ).toBeUndefined();
    expect(
      baseSecurityHeaders({ development: false, https: true })["strict-transport-security"],
    ).toMatch(/^max-age=\d{8}; includeSubDomains$/);
  });
});

describe("proxy", () => {
  const page = () => proxy(new NextRequest("http://localhost:3000/app/runs"));

  it("gives every page a fresh nonce in its CSP and passes it to the render", () => {
    const [a, b] = [page(), page()];
    const nonceOf = (res: Response) =>
      /'nonce-([^']+)'/.exec(res.headers.get("content-security-policy") ?? "")?.[1];
    expect(nonceOf(a)).toMatch(/^[A-Za-z0-9+/=]{22,}$/);
    expect(nonceOf(a)).not.toBe(nonceOf(b));
    expect(a.headers.get("x-middleware-request-x-nonce")).toBe(nonceOf(a));
    for (const name of [
      "x-content-type-options",
      "x-frame-options",
      "referrer-policy",
      "permissions-policy",
    ]) {
      expect(a.headers.get(name), name).toBeTruthy();
    }
  });

  it("API answers get a policy that allows nothing", () => {
    const res = proxy(new NextRequest("http://localhost:3000/api/v1/usage"));
    expect(res.headers.get("content-security-policy")).toBe(
      "default-src 'none'; frame-ancestors 'none'",
    );
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("answers 403 problem+json to a server action posted from another site", async () => {
    const res = proxy(
      new NextRequest("http://localhost:3000/app/members", {
        method: "POST",
        headers: { "next-action": "7f00", origin: "https://evil.example", host: "localhost:3000" },
      }),
    );
    expect(res.status).toBe(403);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    expect(await res.json()).toMatchObject({ type: "/problems/forbidden", status: 403 });
  });

  it("lets same-site actions through", () => {
    const res = proxy(
      new NextRequest("http://localhost:3000/app/members", {
        method: "POST",
        headers: { "next-action": "7f00", origin: "http://localhost:3000", host: "localhost:3000" },
      }),
    );
    expect(res.status).toBe(200);
    expect(res.headers.get("x-middleware-next")).toBe("1");
  });
});

describe("isForeignOriginAction", () => {
  const h = (headers: Record<string, string>) =>
    new Headers({ "next-action": "x", host: "app.example", ...headers });
  it.each([
    ["another site", { origin: "https://evil.example" }, true],
    ["a look-alike port", { origin: "https://app.example:8443" }, true],
    ["the opaque null origin", { origin: "null" }, true],
    ["the same site", { origin: "https://app.example" }, false],
    ["no Origin (not a browser page)", {}, false],
  ])("%s → %s", (_label, headers, expected) => {
    expect(isForeignOriginAction("POST", h(headers))).toBe(expected);
  });
  it("ignores GETs and non-action POSTs", () => {
    expect(isForeignOriginAction("GET", h({ origin: "https://evil.example" }))).toBe(false);
    expect(
      isForeignOriginAction(
        "POST",
        new Headers({ origin: "https://evil.example", host: "app.example" }),
      ),
    ).toBe(false);
  });
});
