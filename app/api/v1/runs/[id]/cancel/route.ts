/** POST /api/v1/runs/:id/cancel — cancel a queued or running run. */
import { v1Route } from "@/lib/openapi/route";
import { cancelRunForOrg } from "@/lib/runs/cancel-run";
import { toRunView } from "@/lib/runs/serialize";

export const POST = v1Route<{ id: string }>(
  async (_req, { org, params }) =>
    Response.json(toRunView(await cancelRunForOrg(org.id, params.id))),
  { role: "member" },
);
