/**
 * Webhook signatures: HMAC-SHA256 (RFC 2104, FIPS 180-4). The primitive is checked
 * against RFC 4231 test case 2 (key "Jefe"), and the full header value against Python's
 * standard-library hmac — the verification recipe the webhooks page shows — run with
 * Debian's python3, an implementation independent of node:crypto.
 */
import { execFileSync } from "node:child_process";
import { createHmac } from "node:crypto";
import { describe, expect, it } from "vitest";
import { signWebhook, verifyWebhook, webhookHeaders } from "@/lib/webhooks/signature";

describe("webhook signatures", () => {
  it("uses HMAC-SHA256 as in RFC 4231 test case 2", () => {
    const mac = createHmac("sha256", "Jefe").update("what do ya want for nothing?").digest("hex");
    expect(mac).toBe("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843");
  });

  it("signs timestamp.body as Python's hmac module computes it", () => {
    const secret = "whsec_test-secret";
    const body = '{"id":"d1","type":"run.finished","data":{"run":{"name":"ψ ⟨Z⟩"}}}';
    const headers = webhookHeaders(secret, "d1", body, 1_767_000_000_000);
    expect(headers["ketwise-webhook-timestamp"]).toBe("1767000000");
    const python = execFileSync(
      "python3",
      [
        "-c",
        "import hashlib,hmac,sys; s,t,b=sys.argv[1:4]; print('v1='+hmac.new(s.encode(), t.encode()+b'.'+b.encode(), hashlib.sha256).hexdigest())",
        secret,
        headers["ketwise-webhook-timestamp"],
        body,
      ],
      { encoding: "utf8" },
    ).trim();
    expect(headers["ketwise-webhook-signature"]).toBe(python);
    expect(signWebhook(secret, 1_767_000_000, body)).toBe(python.slice(3));
  });

  it("verifies only the right secret, body and a fresh timestamp", () => {
    const now = 1_767_000_000_000;
    const h = webhookHeaders("s3cret", "d2", "{}", now);
    const given = {
      timestamp: h["ketwise-webhook-timestamp"],
      signature: h["ketwise-webhook-signature"],
    };
    expect(verifyWebhook("s3cret", given, "{}", { now })).toBe(true);
    expect(verifyWebhook("other", given, "{}", { now })).toBe(false);
    expect(verifyWebhook("s3cret", given, "{ }", { now })).toBe(false);
    expect(verifyWebhook("s3cret", given, "{}", { now: now + 301_000 })).toBe(false);
    expect(verifyWebhook("s3cret", { ...given, signature: null }, "{}", { now })).toBe(false);
  });
});
