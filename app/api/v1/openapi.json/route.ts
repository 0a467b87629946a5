/** GET /api/v1/openapi.json — the OpenAPI 3.1 document, generated from the zod schemas (public). */
import { env } from "@/lib/env";
import { getOpenApiDocument } from "@/lib/openapi/document";

export function GET(): Response {
  return Response.json(getOpenApiDocument(env.APP_URL), {
    headers: { "cache-control": "public, max-age=300" },
  });
}
