/**
 * POST /api/v1/runs/preview — synchronous, cheap: parse, counts, settings, shot plan,
 * quota verdict and the circuit's outline; `?only=circuit` outlines a circuit alone.
 */
import { v1Route } from "@/lib/openapi/route";
import { readJson, readJsonBody, readQuery } from "@/lib/openapi/request";
import { MAX_BODY_BYTES } from "@/lib/runs/limits";
import { previewCircuit, previewRun } from "@/lib/runs/preview-run";
import { circuitPreviewRequestSchema, previewQuerySchema } from "@/lib/runs/schemas";

export const POST = v1Route(async (req, { org }) => {
  const { only } = readQuery(req, previewQuerySchema);
  if (only === "circuit") {
    const input = await readJsonBody(req, circuitPreviewRequestSchema, MAX_BODY_BYTES);
    return Response.json(await previewCircuit(input));
  }
  return Response.json(await previewRun(org, await readJson(req, MAX_BODY_BYTES)));
});
