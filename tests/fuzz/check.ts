/**
 * What the fuzz properties assert, shared by the tests (a few thousand cases)
 * and `npm run fuzz` (10⁵): the engine's preview answers a result or its own
 * typed error, never another exception; the API answers a result or a 4xx
 * problem+json, never a 5xx.
 */
import { NextRequest } from "next/server";
import { previewRequest } from "@/lib/quantum";
import { isEngineError } from "@/lib/quantum/errors";

export type Outcome = { ok: boolean; detail: string };

/** The engine's preview (validation and both parsers); throws on anything but a result or an EngineError. */
export async function previewOutcome(body: unknown): Promise<Outcome> {
  try {
    await previewRequest(body);
    return { ok: true, detail: "result" };
  } catch (error) {
    if (isEngineError(error)) return { ok: true, detail: error.code };
    throw error;
  }
}

type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;

/** POSTs `body` (JSON, or a raw string as is) to a route handler in-process; throws on a 5xx or a malformed problem. */
export async function apiOutcome(
  handler: Handler,
  path: string,
  key: string,
  body: unknown,
  raw = false,
): Promise<Outcome> {
  const res = await handler(
    new NextRequest(`http://localhost:3000${path}`, {
      method: "POST",
      headers: { authorization: `Bearer ${key}`, "content-type": "application/json" },
      body: raw ? String(body) : JSON.stringify(body),
    }),
    { params: Promise.resolve({}) },
  );
  const text = await res.text();
  if (res.status >= 500) throw new Error(`${path} answered ${res.status}: ${text.slice(0, 500)}`);
  if (res.status >= 400) {
    const problem = JSON.parse(text) as Record<string, unknown>;
    if (
      res.headers.get("content-type") !== "application/problem+json" ||
      problem.status !== res.status ||
      typeof problem.detail !== "string"
    ) {
      throw new Error(
        `${path} answered ${res.status} without a problem document: ${text.slice(0, 300)}`,
      );
    }
  }
  return { ok: true, detail: String(res.status) };
}
