/** GET /api/v1/circuits/:id — a saved circuit; DELETE — remove it. */
import { notFound } from "@/lib/api/problem";
import { deleteCircuit } from "@/lib/library/mutations";
import { getCircuitOrThrow } from "@/lib/library/queries";
import { toCircuitView } from "@/lib/library/serialize";
import { v1Route } from "@/lib/openapi/route";

export const GET = v1Route<{ id: string }>(async (_req, { org, params }) =>
  Response.json(toCircuitView(await getCircuitOrThrow(org.id, params.id))),
);

export const DELETE = v1Route<{ id: string }>(
  async (_req, { org, params }) => {
    await getCircuitOrThrow(org.id, params.id);
    if (!(await deleteCircuit(org.id, params.id)))
      throw notFound("No saved circuit with this id in this organisation.");
    return new Response(null, { status: 204 });
  },
  { role: "member" },
);
