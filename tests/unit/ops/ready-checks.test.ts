/**
 * Readiness checks answer a public endpoint: a driver's error text (which names
 * hosts, ports and database users) stays in the log; the check says "unreachable".
 * The database client is replaced by one that fails like mysql2 does when the
 * credentials are refused (message shape from memory).
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("@/db", () => ({
  db: {
    execute: () =>
      Promise.reject(
        new Error("Access denied for user 'ketwise'@'10.20.30.40' (using password: YES)"),
      ),
  },
}));
vi.mock("@/lib/observability/logger", () => ({ logger: () => ({ error: () => {} }) }));

const { checkDatabase } = await import("@/lib/ops/queries");

describe("readiness checks", () => {
  it("never put the driver's message in the public answer", async () => {
    const check = await checkDatabase();
    expect(check.ok).toBe(false);
    expect(check.detail).toBe("unreachable (see the server log)");
    expect(check.detail).not.toMatch(/10\.20\.30\.40|ketwise/);
  });
});
