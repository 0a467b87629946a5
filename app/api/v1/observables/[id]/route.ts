/** GET /api/v1/observables/:id — a saved observable; DELETE — remove it. */
import { notFound } from "@/lib/api/problem";
import { deleteObservable } from "@/lib/library/mutations";
import { getObservableOrThrow } from "@/lib/library/queries";
import { toObservableView } from "@/lib/library/serialize";
import { v1Route } from "@/lib/openapi/route";

export const GET = v1Route<{ id: string }>(async (_req, { org, params }) =>
  Response.json(toObservableView(await getObservableOrThrow(org.id, params.id))),
);

export const DELETE = v1Route<{ id: string }>(
  async (_req, { org, params }) => {
    await getObservableOrThrow(org.id, params.id);
    if (!(await deleteObservable(org.id, params.id)))
      throw notFound("No saved observable with this id in this organisation.");
    return new Response(null, { status: 204 });
  },
  { role: "member" },
);
