/** GET /api/v1/runs/:id/terms.csv — the run page's terms.csv download, same bytes (lib/export/run-files.ts). */
import { buildRunFile, runFileResponse } from "@/lib/export/run-files";
import { v1Route } from "@/lib/openapi/route";
import { getRunOrThrow } from "@/lib/runs/queries";

export const GET = v1Route<{ id: string }>(async (_req, { org, params }) =>
  runFileResponse(buildRunFile(await getRunOrThrow(org.id, params.id), "terms.csv")),
);
