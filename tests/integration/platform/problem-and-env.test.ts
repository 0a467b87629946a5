/**
 * The problem+json edge (RFC 9457 §3: members type, title, status, detail;
 * media type application/problem+json) and environment validation.
 */
import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { notFound, problemResponse, toProblem, tooManyRequests } from "@/lib/api/problem";
import { EnvError, parseEnv } from "@/lib/env";

describe("problem details", () => {
  it("serialises with the RFC 9457 media type and no extra members", async () => {
    const res = problemResponse(notFound("No run with that id.").problem);
    expect(res.status).toBe(404);
    expect(res.headers.get("content-type")).toBe("application/problem+json");
    expect(await res.json()).toEqual({
      type: "/problems/not-found",
      title: "Not found",
      status: 404,
      detail: "No run with that id.",
    });
  });

  it("sends Retry-After for 429 as a header, not in the body", async () => {
    const res = problemResponse(tooManyRequests("Slow down.", 12.2).problem);
    expect(res.headers.get("retry-after")).toBe("13");
    expect(await res.json()).not.toHaveProperty("retryAfter");
  });

  it("maps a zod failure to 422 with dotted field paths", () => {
    const result = z
      .object({ observable: z.object({ terms: z.string() }) })
      .safeParse({ observable: { terms: 1 } });
    const problem = toProblem(result.error);
    expect(problem.status).toBe(422);
    expect(problem.errors?.[0].path).toBe("observable.terms");
  });

  it("hides unexpected errors behind a generic 500 with an error id", () => {
    const spy = vi.spyOn(console, "error").mockImplementation(() => {});
    const problem = toProblem(new Error("secret SQL detail"));
    expect(problem.status).toBe(500);
    expect(problem.detail).not.toContain("secret");
    expect(problem.detail).toMatch(/error id [0-9a-f]{8}/);
    spy.mockRestore();
  });
});

describe("environment", () => {
  const base = { DATABASE_URL: "mysql://u:p@127.0.0.1:3307/ketwise", AUTH_SECRET: "x".repeat(32) };

  it("fills the documented defaults", () => {
    const env = parseEnv(base);
    expect(env).toMatchObject({
      REDIS_URL: "redis://127.0.0.1:6380/0",
      SMTP_PORT: 1025,
      MAIL_WEB_PORT: 1080,
      STRIPE_API_PORT: 12111,
      PORT: 3000,
    });
    expect(env.DEMO_SEED).toBe(false);
    expect(parseEnv({ ...base, DEMO_SEED: "on" }).DEMO_SEED).toBe(true);
  });

  it("names every bad variable", () => {
    expect(() =>
      parseEnv({ DATABASE_URL: "postgres://x", AUTH_SECRET: "short", SMTP_PORT: "abc" }),
    ).toThrowError(EnvError);
    try {
      parseEnv({ DATABASE_URL: "postgres://x", AUTH_SECRET: "short", SMTP_PORT: "abc" });
    } catch (error) {
      const issues = (error as EnvError).issues.join("\n");
      expect(issues).toMatch(/DATABASE_URL/);
      expect(issues).toMatch(/AUTH_SECRET/);
      expect(issues).toMatch(/SMTP_PORT/);
    }
  });
});
