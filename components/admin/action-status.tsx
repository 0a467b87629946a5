import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import type { ActionState } from "@/lib/api/action-state";

/**
 * The form-level result of an admin action: success or error text, and for
 * "no free seat" (402) a link to where seats are bought. Field errors sit under
 * their fields (see `fieldError`).
 */
export function ActionStatus({
  state,
  compact = true,
}: {
  state: ActionState<unknown>;
  compact?: boolean;
}) {
  if (state.status === "error") {
    return (
      <Alert
        tone="error"
        role="alert"
        compact={compact}
        actions={
          state.code === 402 && /seat|plan/i.test(state.message) ? (
            <Link
              href="/app/billing#seats"
              className="text-[13px] font-medium text-accent-ink underline"
            >
              Go to billing to add seats
            </Link>
          ) : undefined
        }
      >
        {state.message}
      </Alert>
    );
  }
  if (state.status === "success" && state.message) {
    return (
      <Alert tone="success" role="status" compact={compact}>
        {state.message}
      </Alert>
    );
  }
  return null;
}

export function fieldError(state: ActionState<unknown>, name: string): string[] | undefined {
  return state.status === "error" ? state.fieldErrors?.[name] : undefined;
}

export function typedValue(state: ActionState<unknown>, name: string, fallback = ""): string {
  return state.status === "error" ? (state.values?.[name] ?? fallback) : fallback;
}
