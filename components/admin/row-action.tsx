"use client";

import { useActionState, useState } from "react";
import { Button, type ButtonVariant } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState, type ActionState } from "@/lib/api/action-state";
import { ActionStatus } from "./action-status";

type Action = (prev: ActionState, formData: FormData) => Promise<ActionState>;

/**
 * A one-button admin action on a table row (remove, revoke, re-send …): hidden
 * fields, an optional confirmation dialog, and the result shown under it.
 */
export function RowAction({
  action,
  fields,
  label,
  variant = "secondary",
  confirm,
  confirmLabel,
}: {
  action: Action;
  fields: Record<string, string>;
  label: string;
  variant?: ButtonVariant;
  /** When set, a dialog with this text asks first. */
  confirm?: { title: string; body: string };
  confirmLabel?: string;
}) {
  const [state, run] = useActionState(action, idleState);
  const [open, setOpen] = useState(false);
  const hidden = Object.entries(fields).map(([k, v]) => (
    <input key={k} type="hidden" name={k} value={v} />
  ));
  return (
    <div className="grid justify-items-end gap-1.5">
      {confirm ? (
        <>
          <Button size="sm" variant={variant} onClick={() => setOpen(true)}>
            {label}
          </Button>
          <Dialog
            open={open}
            onClose={() => setOpen(false)}
            title={confirm.title}
            description={confirm.body}
            size="sm"
            footer={
              <form action={run} onSubmit={() => setOpen(false)} className="flex gap-2">
                {hidden}
                <Button variant="ghost" onClick={() => setOpen(false)}>
                  Cancel
                </Button>
                <SubmitButton variant={variant === "secondary" ? "primary" : variant}>
                  {confirmLabel ?? label}
                </SubmitButton>
              </form>
            }
          />
        </>
      ) : (
        <form action={run}>
          {hidden}
          <SubmitButton size="sm" variant={variant}>
            {label}
          </SubmitButton>
        </form>
      )}
      {state.status !== "idle" ? (
        <div className="max-w-xs text-left">
          <ActionStatus state={state} />
        </div>
      ) : null}
    </div>
  );
}
