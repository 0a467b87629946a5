/**
 * GET /api/v1/runs/:id — one run with its request and, once succeeded, its result
 * (404 for other organisations' ids). `?wait=N` (N ≤ 30 s) holds the answer until
 * the run is terminal: woken by the run-finished announcement, not by polling
 * (lib/runs/run-waiter.ts); a client that goes away releases its wait at once.
 */
import type { Run } from "@/db/schema";
import { v1Route } from "@/lib/openapi/route";
import { readQuery } from "@/lib/openapi/request";
import { isTerminalStatus } from "@/lib/runs/constants";
import { getRunOrThrow } from "@/lib/runs/queries";
import { registerRunWaiter } from "@/lib/runs/run-waiter";
import { runGetQuerySchema } from "@/lib/runs/schemas";
import { toRunView } from "@/lib/runs/serialize";

export const GET = v1Route<{ id: string }>(async (req, { org, params }) => {
  const { wait } = readQuery(req, runGetQuerySchema);
  let run: Run = await getRunOrThrow(org.id, params.id);
  if (wait && !isTerminalStatus(run.status)) {
    const waiter = await registerRunWaiter(run.id);
    try {
      // Read again after subscribing: a finish between the first read and the subscription is not missed.
      run = await getRunOrThrow(org.id, params.id);
      if (!isTerminalStatus(run.status)) {
        // Nobody reads the answer of an aborted request: skip the last read.
        if ((await waiter.until(wait * 1000, req.signal)) !== "aborted")
          run = await getRunOrThrow(org.id, params.id);
      }
    } finally {
      waiter.release();
    }
  }
  return Response.json(toRunView(run));
});
