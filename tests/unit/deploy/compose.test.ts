/**
 * docker/compose.yaml, checked without a Docker engine: it parses as YAML
 * (the `yaml` package, YAML 1.2), every `depends_on` and named volume points at
 * something defined, the worker runs as replicas with a health check on the
 * port its metrics server listens on, the app's health check asks the real
 * readiness route, and every variable handed to the app or worker is one the
 * app's environment schema knows.
 */
import { existsSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parse } from "yaml";
import { envSchema } from "@/lib/env";

type Service = {
  image?: string;
  build?: unknown;
  command?: string[] | string;
  depends_on?: Record<string, { condition: string }>;
  environment?: Record<string, string>;
  volumes?: string[];
  healthcheck?: { test?: string[]; disable?: boolean };
  deploy?: { replicas?: number };
};
type Compose = { services: Record<string, Service>; volumes?: Record<string, unknown> };

const compose = parse(readFileSync("docker/compose.yaml", "utf8"), { merge: true }) as Compose;
const services = compose.services;
// Variables read by Next.js / Auth.js themselves rather than by lib/env.ts.
const FRAMEWORK_VARS = new Set(["AUTH_TRUST_HOST"]);

describe("docker/compose.yaml", () => {
  it("defines the stateful pair, the app, the worker and their helpers", () => {
    expect(Object.keys(services).sort()).toEqual([
      "app",
      "mail",
      "mariadb",
      "migrate",
      "payment-fake",
      "redis",
      "worker",
    ]);
  });

  it("points every depends_on at a defined service and every named volume at a declared one", () => {
    for (const [name, service] of Object.entries(services)) {
      for (const dependency of Object.keys(service.depends_on ?? {}))
        expect(services, `${name} → ${dependency}`).toHaveProperty(dependency);
      for (const volume of service.volumes ?? []) {
        const source = volume.split(":")[0];
        if (!source.startsWith(".") && !source.startsWith("/"))
          expect(compose.volumes, `${name} volume ${source}`).toHaveProperty(source);
      }
    }
  });

  it("runs the worker as several replicas, health-checked on its metrics server's port", () => {
    const worker = services.worker;
    expect(worker.deploy?.replicas).toBeGreaterThanOrEqual(2);
    const port = worker.environment?.WORKER_METRICS_PORT;
    expect(port).toMatch(/^\d+$/);
    expect(worker.environment?.WORKER_METRICS_HOST).toBe("0.0.0.0");
    expect(worker.healthcheck?.test?.join(" ")).toContain(`http://127.0.0.1:${port}/health`);
    expect(worker.command).toEqual([
      "node",
      "--conditions=react-server",
      "--import",
      "tsx",
      "worker/index.ts",
    ]);
    expect(existsSync("worker/index.ts")).toBe(true);
  });

  it("health-checks the app on the readiness route that exists in the app", () => {
    expect(services.app.healthcheck?.test?.join(" ")).toContain("http://127.0.0.1:3000/api/ready");
    expect(existsSync("app/api/ready/route.ts")).toBe(true);
  });

  it("hands the app and worker only variables the environment schema knows, and valid ones", () => {
    const known = new Set(Object.keys(envSchema.shape));
    for (const name of ["app", "worker", "migrate"]) {
      const environment = services[name].environment ?? {};
      for (const key of Object.keys(environment)) {
        expect(known.has(key) || FRAMEWORK_VARS.has(key), `${name}: ${key}`).toBe(true);
      }
      const sample = Object.fromEntries(
        Object.entries(environment).map(([k, v]) => [
          k,
          String(v).replace(
            /\$\{(\w+):?[-?]?([^}]*)\}/g,
            (_m, _n, fallback: string) => fallback || "",
          ),
        ]),
      );
      sample.AUTH_SECRET = "x".repeat(32);
      expect(() => envSchema.parse(sample), name).not.toThrow();
    }
  });
});
