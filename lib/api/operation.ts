/**
 * Admin operations — every change on the members, API-keys, billing and
 * settings pages — share one shape: a minimum role, one zod schema for the
 * request (the same the form uses) and a body that gets the checked access.
 *
 *   export const changeRoleOp = defineOperation({ name: "member.change-role", role: "admin", schema, run });
 *   export const changeRoleAction = operationAction(changeRoleOp, "/app/members");   // in actions.ts
 *
 * `operationAction` builds the server action through the platform's
 * `orgAction` wrapper (session → membership → role → schema → body).
 * `runOperation` runs the very same role check, schema and body for a known
 * user id — the tests' way in (server actions need a Next request to read the
 * session). Finer rules (the last owner, who may touch an owner, whose API key)
 * live in the bodies, which throw ProblemError.
 */
import "server-only";
import { revalidatePath } from "next/cache";
import type { z } from "zod";
import { errorState, invalidInput, orgAction, type ActionState } from "@/lib/api/action";
import { authorizeMember, type OrgAccess } from "@/lib/auth/guards";
import type { Role } from "@/lib/orgs/roles";

export type Operation<S extends z.ZodType, T = unknown> = {
  /** Stable name, used by tests and logs (e.g. `member.change-role`). */
  name: string;
  /** Weakest role allowed to call it. */
  role: Role;
  schema: S;
  run: (input: z.infer<S>, access: OrgAccess) => Promise<ActionState<T>>;
};

export function defineOperation<S extends z.ZodType, T = unknown>(
  op: Operation<S, T>,
): Operation<S, T> {
  return op;
}

/** The server action for an operation; revalidates `path` (a layout path revalidates the pages below it). */
export function operationAction<S extends z.ZodType, T>(
  op: Operation<S, T>,
  path: string,
  type?: "layout" | "page",
) {
  return orgAction<S, T>(op.schema, { role: op.role }, async (input, access) => {
    const state = await op.run(input, access);
    if (state.status === "success") revalidatePath(path, type);
    return state;
  });
}

/** Same checks and body as the server action, for a known user (tests, scripts). */
export async function runOperation<S extends z.ZodType, T>(
  op: Operation<S, T>,
  userId: string,
  orgId: string,
  fields: Record<string, string>,
): Promise<ActionState<T>> {
  try {
    const access = await authorizeMember(userId, orgId, op.role);
    const parsed = op.schema.safeParse(fields);
    if (!parsed.success) return invalidInput(parsed.error);
    return await op.run(parsed.data, access);
  } catch (error) {
    return errorState(error);
  }
}
