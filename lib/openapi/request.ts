/**
 * Reading API v1 requests: a JSON body under a size limit, validated by the
 * one zod schema of its shape; query strings likewise. Failures are problems:
 * 413 body too large, 415 not JSON, 400 malformed JSON or query, 422 body does
 * not match the schema (each issue with its dotted field path; an unknown field
 * is named in its own issue).
 */
import type { z } from "zod";
import { badRequest, ProblemError, validationFailed, zodFieldErrors } from "@/lib/api/problem";
import { formatBytes } from "@/lib/format";

const tooLarge = (max: number) =>
  new ProblemError({
    type: "/problems/body-too-large",
    title: "Request body too large",
    status: 413,
    detail: `The request body is larger than ${formatBytes(max, { binary: true })}.`,
  });

/**
 * The body as UTF-8 text, refused with 413 as soon as it passes `maxBytes`:
 * a declared Content-Length over the cap is refused before any byte is read,
 * and a streamed body is cancelled at the first chunk past it.
 */
export async function readText(req: Request, maxBytes: number): Promise<string> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw tooLarge(maxBytes);
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    let step: ReadableStreamReadResult<Uint8Array>;
    try {
      step = await reader.read();
    } catch {
      // The client went away mid-body (e.g. a debounced preview it replaced).
      throw badRequest(
        "The request body ended early: the connection was closed before it was complete.",
      );
    }
    const { done, value } = step;
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString("utf8");
}

/** The JSON body under `maxBytes`, not yet checked against a schema (415 / 413 / 400 problems). */
export async function readJson(req: Request, maxBytes: number): Promise<unknown> {
  const type = req.headers.get("content-type") ?? "";
  if (!/^application\/(?:[\w.+-]+\+)?json\b/i.test(type)) {
    throw new ProblemError({
      type: "/problems/unsupported-media-type",
      title: "Unsupported media type",
      status: 415,
      detail: "Send the body as JSON with `Content-Type: application/json`.",
    });
  }
  const text = await readText(req, maxBytes);
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    throw badRequest(
      `The body is not valid JSON (${error instanceof Error ? error.message : "parse error"}).`,
    );
  }
}

/** A body read by readJson, checked against its schema (422 with each field's issue). */
export function parseBody<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success)
    throw validationFailed(
      "The request body does not match the schema.",
      zodFieldErrors(parsed.error),
    );
  return parsed.data;
}

export async function readJsonBody<S extends z.ZodType>(
  req: Request,
  schema: S,
  maxBytes: number,
): Promise<z.output<S>> {
  return parseBody(schema, await readJson(req, maxBytes));
}

export function readQuery<S extends z.ZodType>(req: Request, schema: S): z.output<S> {
  const params = Object.fromEntries(new URL(req.url).searchParams);
  const parsed = schema.safeParse(params);
  if (!parsed.success)
    throw badRequest("The query string is not valid.", zodFieldErrors(parsed.error));
  return parsed.data;
}
