/** GET /api/v1/circuits — saved circuits; POST — save one (checked by the engine). */
import { createCircuit } from "@/lib/library/mutations";
import { listCircuits } from "@/lib/library/queries";
import { circuitCreateSchema, libraryListQuerySchema } from "@/lib/library/schemas";
import { toCircuitView, toSummaryView } from "@/lib/library/serialize";
import { circuitQubits } from "@/lib/library/validate";
import { readJsonBody, readQuery } from "@/lib/openapi/request";
import { v1Route } from "@/lib/openapi/route";
import { MAX_BODY_BYTES } from "@/lib/runs/limits";

export const GET = v1Route(async (req, { org }) => {
  const { page, nextCursor } = await listCircuits(org.id, readQuery(req, libraryListQuerySchema));
  return Response.json({ data: page.map(toSummaryView), nextCursor });
});

export const POST = v1Route(
  async (req, { org, actor }) => {
    const input = await readJsonBody(req, circuitCreateSchema, MAX_BODY_BYTES);
    const qubits = circuitQubits(input);
    const userId = actor.kind === "user" ? actor.userId : actor.createdById;
    const row = await createCircuit(org.id, userId, input, qubits);
    return Response.json(toCircuitView(row), {
      status: 201,
      headers: { location: `/api/v1/circuits/${row.id}` },
    });
  },
  { role: "member" },
);
