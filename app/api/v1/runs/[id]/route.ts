/** GET /api/v1/runs/:id — one run with its request and, once succeeded, its result (404 for other organisations' ids). */
import { v1Route } from "@/lib/openapi/route";
import { getRunOrThrow } from "@/lib/runs/queries";
import { toRunView } from "@/lib/runs/serialize";

export const GET = v1Route<{ id: string }>(async (_req, { org, params }) =>
  Response.json(toRunView(await getRunOrThrow(org.id, params.id))),
);
