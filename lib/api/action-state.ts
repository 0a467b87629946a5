/**
 * The state a server action hands back to its form (`useActionState`).
 * Client-safe: forms import `idleState` from here, not from ./action.
 */
export type FieldErrors = Record<string, string[]>;

export type ActionState<T = unknown> =
  | { status: "idle" }
  | { status: "success"; message?: string; data?: T }
  | {
      status: "error";
      message: string;
      fieldErrors?: FieldErrors;
      /** HTTP-like status of the failure (401, 403, 404, 409, 422, 429, 500…). */
      code?: number;
      /** The submitted text fields (never passwords), so the form can keep what was typed. */
      values?: Record<string, string>;
    };

export const idleState: ActionState = { status: "idle" };

/** One line for an answer shown beside a control: its message, and the fields a refused input names. */
export function actionText(state: ActionState<unknown>): string {
  if (state.status === "idle") return "";
  if (state.status === "success") return state.message ?? "Done.";
  const fields = Object.entries(state.fieldErrors ?? {}).map(
    ([path, messages]) => `${path}: ${messages[0]}`,
  );
  return fields.length ? fields.join("; ") : state.message;
}

/** The data of a successful answer (SWR fetchers over JSON actions); a failure is thrown with its text. */
export function actionData<T>(state: ActionState<T>): T {
  if (state.status === "success" && state.data !== undefined) return state.data;
  throw new Error(actionText(state) || "The action answered without data.");
}
