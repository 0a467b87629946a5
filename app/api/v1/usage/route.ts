/** GET /api/v1/usage — this period's meters against the plan's quotas. */
import { v1Route } from "@/lib/openapi/route";
import { getUsageReport } from "@/lib/usage/report";

export const GET = v1Route(async (_req, { org }) =>
  Response.json(await getUsageReport(org.id, org.plan)),
);
