/** GET /api/v1/observables — saved observables; POST — save one (checked by the engine: parses, Hermitian). */
import { createObservable } from "@/lib/library/mutations";
import { listObservables } from "@/lib/library/queries";
import { libraryListQuerySchema, observableCreateSchema } from "@/lib/library/schemas";
import { toObservableView, toSummaryView } from "@/lib/library/serialize";
import { observableQubits } from "@/lib/library/validate";
import { readJsonBody, readQuery } from "@/lib/openapi/request";
import { v1Route } from "@/lib/openapi/route";
import { MAX_BODY_BYTES } from "@/lib/runs/limits";

export const GET = v1Route(async (req, { org }) => {
  const { page, nextCursor } = await listObservables(
    org.id,
    readQuery(req, libraryListQuerySchema),
  );
  return Response.json({ data: page.map(toSummaryView), nextCursor });
});

export const POST = v1Route(
  async (req, { org, actor }) => {
    const input = await readJsonBody(req, observableCreateSchema, MAX_BODY_BYTES);
    const qubits = observableQubits(input);
    const userId = actor.kind === "user" ? actor.userId : actor.createdById;
    const row = await createObservable(org.id, userId, input, qubits);
    return Response.json(toObservableView(row), {
      status: 201,
      headers: { location: `/api/v1/observables/${row.id}` },
    });
  },
  { role: "member" },
);
