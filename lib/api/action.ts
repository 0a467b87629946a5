/**
 * Server-action wrappers. Each parses FormData with a zod schema (the same one
 * the form uses), runs the body, and turns expected failures into form state
 * for `useActionState`:
 *
 *   export const renameOrgAction = orgAction(renameSchema, { role: "admin" },
 *     async (input, access) => { …; return { status: "success", message: "Saved." }; });
 *
 * `orgAction` checks the session and the role in the organisation named by the
 * form's `orgId` field (or the current organisation when absent) before the
 * body runs. Redirects and notFound() thrown by the body pass through.
 */
import "server-only";
import { unstable_rethrow } from "next/navigation";
import type { z } from "zod";
import { authorizeMember, requireCurrentOrg, type OrgAccess } from "@/lib/auth/guards";
import { requireUser } from "@/lib/auth/session";
import type { Role } from "@/lib/orgs/roles";
import type { ActionState, FieldErrors } from "./action-state";
import { isProblemError, newErrorId, zodFieldErrors } from "./problem";

export { idleState, type ActionState, type FieldErrors } from "./action-state";

function toFieldErrors(list: { path: string; message: string }[]): FieldErrors {
  const out: FieldErrors = {};
  for (const { path, message } of list) (out[path] ??= []).push(message);
  return out;
}

/** Maps a thrown value to error state; unexpected errors are logged with an id. */
export function errorState(error: unknown): ActionState<never> {
  unstable_rethrow(error);
  if (isProblemError(error)) {
    const { detail, errors, status } = error.problem;
    return {
      status: "error",
      message: detail,
      code: status,
      ...(errors ? { fieldErrors: toFieldErrors(errors) } : {}),
    };
  }
  const id = newErrorId();
  console.error(`[ketwise] unexpected error in server action (error id ${id})`, error);
  return {
    status: "error",
    message: `Something went wrong on our side (error id ${id}). Try again.`,
    code: 500,
  };
}

/** Text fields of the form, minus anything that looks like a secret. */
function echoValues(formData: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of formData) {
    if (typeof value === "string" && !/password|secret|token|^\$/i.test(key)) out[key] = value;
  }
  return out;
}

function withValues<T>(state: ActionState<T>, formData: FormData): ActionState<T> {
  return state.status === "error" ? { ...state, values: echoValues(formData) } : state;
}

type Body<S extends z.ZodType, C, T> = (
  input: z.infer<S>,
  ctx: C,
) => Promise<ActionState<T> | void>;

function parse<S extends z.ZodType>(schema: S, formData: FormData) {
  return schema.safeParse(Object.fromEntries(formData));
}

const invalid = (error: z.ZodError): ActionState<never> => ({
  status: "error",
  message: "Check the highlighted fields.",
  fieldErrors: toFieldErrors(zodFieldErrors(error)),
  code: 422,
});

/** An action anyone may call (sign-in, sign-up). */
export function formAction<S extends z.ZodType, T = unknown>(
  schema: S,
  body: Body<S, FormData, T>,
) {
  return async (_prev: ActionState<T>, formData: FormData): Promise<ActionState<T>> => {
    const parsed = parse(schema, formData);
    if (!parsed.success) return withValues(invalid(parsed.error), formData);
    try {
      return withValues((await body(parsed.data, formData)) ?? { status: "success" }, formData);
    } catch (error) {
      return withValues(errorState(error), formData);
    }
  };
}

/** An action for a signed-in user, outside any organisation (e.g. profile). */
export function userAction<S extends z.ZodType, T = unknown>(
  schema: S,
  body: Body<S, { userId: string }, T>,
) {
  return async (_prev: ActionState<T>, formData: FormData): Promise<ActionState<T>> => {
    try {
      const user = await requireUser();
      const parsed = parse(schema, formData);
      if (!parsed.success) return withValues(invalid(parsed.error), formData);
      return withValues(
        (await body(parsed.data, { userId: user.id })) ?? { status: "success" },
        formData,
      );
    } catch (error) {
      return withValues(errorState(error), formData);
    }
  };
}

/** An action inside an organisation, allowed from `role` up (default viewer). */
export function orgAction<S extends z.ZodType, T = unknown>(
  schema: S,
  options: { role?: Role },
  body: Body<S, OrgAccess, T>,
) {
  return async (_prev: ActionState<T>, formData: FormData): Promise<ActionState<T>> => {
    try {
      const role = options.role ?? "viewer";
      const orgId = formData.get("orgId");
      const access =
        typeof orgId === "string" && orgId
          ? await authorizeMember((await requireUser()).id, orgId, role)
          : await requireCurrentOrg(role);
      const parsed = parse(schema, formData);
      if (!parsed.success) return withValues(invalid(parsed.error), formData);
      return withValues((await body(parsed.data, access)) ?? { status: "success" }, formData);
    } catch (error) {
      return withValues(errorState(error), formData);
    }
  };
}
