/**
 * Route labels of the request-latency metric stay bounded: every id position of the
 * API v1 paths is one label value, whatever the client sent (Prometheus naming
 * practice: labels must not carry unbounded values such as ids — common practice).
 */
import { describe, expect, it } from "vitest";
import { routeLabel } from "@/lib/observability/metrics";

describe("routeLabel", () => {
  it("labels real and made-up ids alike", () => {
    const id = "5b0c7c1e-3f2a-4d7e-9a41-0c8f7e6d5a4b";
    expect(routeLabel(`/api/v1/runs/${id}`)).toBe("/api/v1/runs/:id");
    expect(routeLabel("/api/v1/runs/not-a-uuid-7")).toBe("/api/v1/runs/:id");
    expect(routeLabel("/api/v1/runs/x%20y/terms.csv")).toBe("/api/v1/runs/:id/terms.csv");
    expect(routeLabel(`/api/v1/circuits/${"a".repeat(40)}`)).toBe("/api/v1/circuits/:id");
  });

  it("keeps collection and static routes as they are", () => {
    expect(routeLabel("/api/v1/runs")).toBe("/api/v1/runs");
    expect(routeLabel("/api/v1/runs/preview")).toBe("/api/v1/runs/preview");
    expect(routeLabel("/api/v1/usage")).toBe("/api/v1/usage");
    expect(routeLabel("/api/v1/runs/abc/cancel")).toBe("/api/v1/runs/:id/cancel");
  });
});
