/** POST /api/v1/runs/preview — synchronous, cheap: parse, counts, settings, shot plan, quota verdict. */
import { v1Route } from "@/lib/openapi/route";
import { readJsonBody } from "@/lib/openapi/request";
import { MAX_BODY_BYTES } from "@/lib/runs/limits";
import { previewRun } from "@/lib/runs/preview-run";
import { engineRequestOf, runCreateSchema } from "@/lib/runs/schemas";

export const POST = v1Route(async (req, { org }) => {
  const input = await readJsonBody(req, runCreateSchema, MAX_BODY_BYTES);
  return Response.json(await previewRun(org, engineRequestOf(input)));
});
