/**
 * The one problem schema: what the server sends (problemResponse) is what the
 * browser client parses (apiFetch → ApiError), extension members included.
 * Field names per RFC 9457 §3.1 (type, title, status, detail) and §3.2 (extensions).
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { problemResponse, validationFailed } from "@/lib/api/problem";
import { problemSchema, problemWith } from "@/lib/api/problem-schema";
import { editHeaders } from "@/lib/api/response-headers";
import { apiFetch, isApiError } from "@/lib/swr/api-client";
import { z } from "zod";

afterEach(() => vi.unstubAllGlobals());

async function clientErrorFor(res: Response) {
  vi.stubGlobal("fetch", async () => res);
  try {
    await apiFetch("org", "/api/v1/x");
  } catch (error) {
    if (isApiError(error)) return error;
    throw error;
  }
  throw new Error("apiFetch did not fail");
}

describe("problem documents", () => {
  it("a server problem validates against the schema and reaches the client intact", async () => {
    const problem = validationFailed("The request body does not match the schema.", [
      { path: "circuit.source", message: "unknown gate", line: 3, column: 1 },
    ]).problem;
    const res = problemResponse(problem);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    const body: unknown = await res.clone().json();
    expect(problemSchema.parse(body)).toEqual(body);
    const error = await clientErrorFor(res);
    expect(error.status).toBe(422);
    expect(error.type).toBe("/problems/validation-failed");
    expect(error.errorsAt("circuit")).toEqual([
      { path: "circuit.source", message: "unknown gate", line: 3, column: 1 },
    ]);
  });

  it("extension members go into the body beside the common fields, never over them", async () => {
    const problem = {
      ...validationFailed("bad", []).problem,
      extensions: { outline: { qubits: 2 }, status: 200 },
    };
    const body: unknown = await problemResponse(problem).json();
    const withOutline = problemWith({ outline: z.object({ qubits: z.int() }) });
    expect(withOutline.parse(body)).toMatchObject({ status: 422, outline: { qubits: 2 } });
    const error = await clientErrorFor(problemResponse(problem));
    expect(error.status).toBe(422);
    expect(error.body).toMatchObject({ outline: { qubits: 2 } });
  });

  it("a failed answer that is not a problem document becomes a generic error with its status", async () => {
    const error = await clientErrorFor(
      new Response(JSON.stringify({ message: "gateway" }), { status: 502 }),
    );
    expect(error.status).toBe(502);
    expect(error.message).toBe("The server answered 502.");
    expect(error.errors).toEqual([]);
  });
});

describe("editHeaders", () => {
  it("edits mutable headers in place", () => {
    const res = new Response("x", { status: 201 });
    expect(editHeaders(res, (h) => h.set("x-a", "1"))).toBe(res);
    expect(res.headers.get("x-a")).toBe("1");
  });

  it("copies a response whose headers are immutable, keeping status and location", () => {
    const res = Response.redirect("http://localhost/next", 303);
    const out = editHeaders(res, (h) => h.set("x-request-id", "abc"));
    expect(out).not.toBe(res);
    expect(out.status).toBe(303);
    expect(out.headers.get("location")).toBe("http://localhost/next");
    expect(out.headers.get("x-request-id")).toBe("abc");
  });
});
