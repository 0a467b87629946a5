/**
 * The billing webhook refuses bodies over its cap with 413 before reading
 * them (the reported hole: a forged 20 MiB body was read in full before the
 * signature check). A declared oversize Content-Length is refused without
 * touching the body; an undeclared (chunked) one is cut at the cap.
 */
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { POST } from "@/app/api/webhooks/billing/route";
import { WEBHOOK_MAX_BODY_BYTES } from "@/lib/billing/webhook";
import { closeRedis } from "@/lib/rate-limit/redis";

afterAll(async () => {
  await closeRedis();
  await closeDb();
});

/** A body stream that counts how many bytes were pulled from it. */
function countingBody(totalBytes: number, chunk = 64 * 1024) {
  const pulled = { bytes: 0 };
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        if (pulled.bytes >= totalBytes) return controller.close();
        const size = Math.min(chunk, totalBytes - pulled.bytes);
        pulled.bytes += size;
        controller.enqueue(new Uint8Array(size).fill(0x7b));
      },
    },
    { highWaterMark: 0 },
  );
  return { stream, pulled };
}

const post = (body: BodyInit, headers: Record<string, string> = {}) =>
  POST(
    new Request("http://localhost/api/webhooks/billing", {
      method: "POST",
      body,
      headers: { "stripe-signature": "t=1,v1=00", ...headers },
      duplex: "half",
    } as RequestInit),
  );

describe("billing webhook body cap", () => {
  it("413 for a declared 20 MiB body, without reading a byte of it", async () => {
    const { stream, pulled } = countingBody(20 * 1024 * 1024);
    const res = await post(stream, { "content-length": String(20 * 1024 * 1024) });
    expect(res.status).toBe(413);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    expect(await res.json()).toMatchObject({ type: "/problems/body-too-large", status: 413 });
    expect(pulled.bytes).toBe(0);
  });

  it("413 for an undeclared streamed body, reading at most one chunk past the cap", async () => {
    const { stream, pulled } = countingBody(20 * 1024 * 1024);
    const res = await post(stream);
    expect(res.status).toBe(413);
    expect(pulled.bytes).toBeLessThanOrEqual(WEBHOOK_MAX_BODY_BYTES + 3 * 64 * 1024);
  });

  it("a small forged body still gets the signature check (400), not 413", async () => {
    const res = await post(JSON.stringify({ id: "evt_forged", type: "invoice.paid" }));
    expect(res.status).toBe(400);
  });
});
