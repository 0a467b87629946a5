/** POST /api/v1/runs — queue a run (202 + Location); GET /api/v1/runs — list runs, newest first. */
import { readIdempotencyKey, v1Route } from "@/lib/openapi/route";
import { readJsonBody, readQuery } from "@/lib/openapi/request";
import { MAX_BODY_BYTES } from "@/lib/runs/limits";
import { listRuns } from "@/lib/runs/queries";
import { runCreateSchema, runListQuerySchema } from "@/lib/runs/schemas";
import { runPath, toRunSummary, toRunView } from "@/lib/runs/serialize";
import { submitRun } from "@/lib/runs/submit-run";

export const POST = v1Route(
  async (req, { org, actor }) => {
    const idempotencyKey = readIdempotencyKey(req);
    const input = await readJsonBody(req, runCreateSchema, MAX_BODY_BYTES);
    const { run, replayed } = await submitRun(org, actor, input, idempotencyKey);
    const headers: Record<string, string> = { location: runPath(run.id) };
    if (replayed) headers["idempotent-replayed"] = "true";
    return Response.json(toRunView(run), { status: 202, headers });
  },
  { role: "member" },
);

export const GET = v1Route(async (req, { org }) => {
  const query = readQuery(req, runListQuerySchema);
  const { page, nextCursor } = await listRuns(org.id, query);
  return Response.json({ data: page.map(toRunSummary), nextCursor });
});
