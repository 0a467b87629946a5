/**
 * Setup file of the e2e project: after each test file, no page may have
 * broken the Content-Security-Policy (the browser tests run with the
 * production policy of proxy.ts on).
 */
import { afterAll, expect } from "vitest";
import { cspViolations } from "./browser";

afterAll(() => {
  expect(cspViolations, "Content-Security-Policy violations").toEqual([]);
});
