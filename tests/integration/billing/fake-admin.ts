/**
 * A client for the payment fake's test controls (`/_fake/*`), shared by the
 * fake's own tests and Ketwise's billing tests. Same Bearer key as the API.
 */
export type FakeAdmin = (
  path: string,
  body?: Record<string, unknown>,
) => Promise<Record<string, unknown>>;

export function fakeAdminClient(baseUrl: string, apiKey: string): FakeAdmin {
  return async (path, body) => {
    const res = await fetch(`${baseUrl}${path}`, {
      method: body === undefined ? "GET" : "POST",
      headers: { Authorization: `Bearer ${apiKey}`, "Content-Type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const json = (await res.json()) as Record<string, unknown>;
    if (!res.ok) throw new Error(`${path} → ${res.status} ${JSON.stringify(json)}`);
    return json;
  };
}

/** Waits until the fake has no webhook delivery pending (or fails loudly). */
export async function flushWebhooks(admin: FakeAdmin, timeoutMs: number): Promise<void> {
  const r = await admin("/_fake/webhooks/flush", { timeout_ms: timeoutMs });
  if (r.idle !== true) throw new Error(`webhooks still pending: ${JSON.stringify(r)}`);
}
