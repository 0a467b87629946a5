/**
 * The OpenAPI 3.1 document of API v1, generated from the zod schemas by
 * @asteasolutions/zod-to-openapi (built once per process). Shared shapes are
 * named components because their schemas carry a zod `.meta({ id })`
 * (Problem, Run, RunSummary, QuotaVerdict, Circuit, Observable, UsageReport).
 */
import { OpenAPIRegistry, OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { registerPaths } from "./paths";

/** The generated document's type (openapi3-ts's OpenAPI 3.1 model, as the generator returns it). */
export type OpenApiDocument = ReturnType<OpenApiGeneratorV31["generateDocument"]>;
let cached: OpenApiDocument | undefined;

export function buildOpenApiDocument(serverUrl?: string): OpenApiDocument {
  const registry = new OpenAPIRegistry();
  registry.registerComponent("securitySchemes", "bearerKey", {
    type: "http",
    scheme: "bearer",
    description:
      "An organisation API key: `Authorization: Bearer kw_xxxxxxxx_…` (created on the API keys page, shown once).",
  });
  registry.registerComponent("securitySchemes", "session", {
    type: "apiKey",
    in: "cookie",
    name: "authjs.session-token",
    description: "The browser session of a signed-in member (the app's own pages use it).",
  });
  registerPaths(registry);
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Ketwise API",
      version: "1.0.0",
      description:
        "Expectation values ⟨ψ|A|ψ⟩ of observables on circuit states — exact, sampled and noisy. " +
        "Submit a run, poll it until it is terminal, read the result. Errors are RFC 9457 problem documents.",
    },
    servers: serverUrl ? [{ url: serverUrl }] : [],
  });
}

/** The document, generated on first use. */
export function getOpenApiDocument(serverUrl?: string): OpenApiDocument {
  cached ??= buildOpenApiDocument(serverUrl);
  return cached;
}
