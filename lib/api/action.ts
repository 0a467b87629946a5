/**
 * Server-action wrappers — one wrapper (`serverAction`) in three access levels:
 * `formAction` (anyone), `userAction` (signed in), `orgAction` (member from a
 * role up). Each parses its input with a zod schema (the same one the form or
 * the caller uses), runs the body, and answers `ActionState` — for
 * `useActionState` forms and for client code calling a JSON action alike:
 *
 *   export const renameOrgAction = orgAction(renameSchema, { role: "admin" },
 *     async (input, access) => { …; return { status: "success", message: "Saved." }; });
 *   export const saveThingAction = orgAction(thingSchema, { role: "member", input: "json" },
 *     async (input, access) => ({ status: "success", data: await saveThing(access.org.id, input) }));
 *
 * `orgAction` checks the session and the role in the organisation named by the
 * form's (or the JSON input's) `orgId` (or the current organisation when absent)
 * before the body runs. Redirects and notFound() thrown by the body pass through.
 */
import "server-only";
import { redirect, unstable_rethrow } from "next/navigation";
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

/**
 * A FormData action: `(prev, formData)` for `useActionState`, or `(formData)` as a plain
 * `<form action>` (its answer is then only the redirect or refresh it causes, so that
 * signature answers nothing).
 */
export type FormActionFn<T> = {
  (formData: FormData): Promise<void>;
  (prev: ActionState<T>, formData: FormData): Promise<ActionState<T>>;
};

/** A JSON action, called from client code with the schema's input (plus an optional `orgId`). */
export type JsonActionFn<S extends z.ZodType, T> = (
  input: z.input<S> & { orgId?: string },
) => Promise<ActionState<T>>;

function formDataOf(prevOrData: unknown, formData: unknown): FormData {
  if (formData instanceof FormData) return formData;
  return prevOrData instanceof FormData ? prevOrData : new FormData();
}

/** The answer to an input its schema refuses: 422 with each field's messages. */
export const invalidInput = (error: z.ZodError): ActionState<never> => ({
  status: "error",
  message: "Check the highlighted fields.",
  fieldErrors: toFieldErrors(zodFieldErrors(error)),
  code: 422,
});

/** Who may call an action: anyone, any signed-in person, or members of an organisation from `role` up. */
type Gate<C> = (orgId: unknown) => Promise<C>;

const anyone: Gate<undefined> = async () => undefined;
const signedIn: Gate<{ userId: string }> = async () => ({ userId: (await requireUser()).id });
const member =
  (role: Role): Gate<OrgAccess> =>
  async (orgId) =>
    typeof orgId === "string" && orgId
      ? authorizeMember((await requireUser()).id, orgId, role)
      : requireCurrentOrg(role);

/**
 * THE server-action wrapper: access (the gate) → the one zod schema of the input →
 * the body → `ActionState`, the one answer shape of every action. Expected failures
 * (ProblemError, a schema mismatch) become error state with the HTTP-like `code`;
 * redirects and notFound() pass through; anything else is logged with an id.
 * `input: "form"` reads FormData (the form's `orgId` field names the organisation)
 * and echoes the typed text back on failure; `input: "json"` takes the schema's
 * input object from client code (its `orgId` likewise; absent = the current one).
 */
function serverAction<S extends z.ZodType, C, T>(
  gate: Gate<C>,
  schema: S,
  input: "form" | "json",
  body: (input: z.infer<S>, ctx: C, formData: FormData | null) => Promise<ActionState<T> | void>,
): FormActionFn<T> | JsonActionFn<S, T> {
  const run = async (
    fields: unknown,
    orgId: unknown,
    formData: FormData | null,
  ): Promise<ActionState<T>> => {
    try {
      const ctx = await gate(orgId);
      const parsed = schema.safeParse(fields);
      if (!parsed.success) return invalidInput(parsed.error);
      return (await body(parsed.data, ctx, formData)) ?? { status: "success" };
    } catch (error) {
      return errorState(error);
    }
  };
  if (input === "json") {
    return async (value: unknown) => {
      const { orgId, ...fields } = (
        typeof value === "object" && value !== null ? value : {}
      ) as Record<string, unknown>;
      return run(fields, orgId, null);
    };
  }
  const form = async (prevOrData: unknown, maybeFormData?: FormData) => {
    const formData = formDataOf(prevOrData, maybeFormData);
    const state = await run(Object.fromEntries(formData), formData.get("orgId"), formData);
    // A plain <form action> has no state to show an expired session in: send it to sign in.
    if (prevOrData instanceof FormData && state.status === "error" && state.code === 401)
      redirect("/sign-in?error=SessionExpired");
    return withValues(state, formData);
  };
  return form as FormActionFn<T>;
}

/** An action anyone may call (sign-in, sign-up, sign-out); the body also gets the FormData. */
export function formAction<S extends z.ZodType, T = unknown>(
  schema: S,
  body: Body<S, FormData, T>,
): FormActionFn<T> {
  return serverAction(anyone, schema, "form", (input, _ctx, formData) =>
    body(input, formData ?? new FormData()),
  ) as FormActionFn<T>;
}

/** An action for a signed-in user, outside any organisation (e.g. profile, the org switcher). */
export function userAction<S extends z.ZodType, T = unknown>(
  schema: S,
  body: Body<S, { userId: string }, T>,
): FormActionFn<T> {
  return serverAction(signedIn, schema, "form", body) as FormActionFn<T>;
}

/**
 * An action inside an organisation, allowed from `role` up (default viewer): the form's
 * (or the JSON input's) `orgId`, else the current organisation.
 */
export function orgAction<S extends z.ZodType, T = unknown>(
  schema: S,
  options: { role?: Role; input?: "form" },
  body: Body<S, OrgAccess, T>,
): FormActionFn<T>;
export function orgAction<S extends z.ZodType, T = unknown>(
  schema: S,
  options: { role?: Role; input: "json" },
  body: Body<S, OrgAccess, T>,
): JsonActionFn<S, T>;
export function orgAction<S extends z.ZodType, T = unknown>(
  schema: S,
  options: { role?: Role; input?: "form" | "json" },
  body: Body<S, OrgAccess, T>,
): FormActionFn<T> | JsonActionFn<S, T> {
  return serverAction(member(options.role ?? "viewer"), schema, options.input ?? "form", body);
}
