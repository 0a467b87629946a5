import { Alert } from "@/components/ui/alert";
import type { ActionState } from "@/lib/api/action-state";

/** The form-level message of an action result (field errors sit under their fields). */
export function FormStatus({ state }: { state: ActionState }) {
  if (state.status === "error") {
    return (
      <Alert tone="error" role="alert" compact>
        {state.message}
      </Alert>
    );
  }
  if (state.status === "success" && state.message) {
    return (
      <Alert tone="success" role="status" compact>
        {state.message}
      </Alert>
    );
  }
  return null;
}

export function fieldError(state: ActionState, name: string): string[] | undefined {
  return state.status === "error" ? state.fieldErrors?.[name] : undefined;
}

export function typedValue(state: ActionState, name: string, fallback = ""): string {
  return state.status === "error" ? (state.values?.[name] ?? fallback) : fallback;
}
