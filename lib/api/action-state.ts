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
