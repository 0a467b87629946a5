"use client";

import { useActionState, useState } from "react";
import { ActionStatus, fieldError } from "@/components/admin/action-status";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { transferOwnershipAction } from "./actions";

/** Owner only: hands the organisation to another member (the owner becomes an admin). */
export function TransferOwnership({
  userId,
  name,
  orgName,
}: {
  userId: string;
  name: string;
  orgName: string;
}) {
  const [open, setOpen] = useState(false);
  const [state, action] = useActionState(transferOwnershipAction, idleState);
  return (
    <>
      <Button size="sm" variant="ghost" onClick={() => setOpen(true)}>
        Make owner…
      </Button>
      <Dialog
        open={open}
        onClose={() => setOpen(false)}
        title={`Transfer ownership to ${name}?`}
        description={`${name} becomes the owner of ${orgName} and you become an admin. Only the new owner can undo this.`}
      >
        <form action={action} className="grid gap-3">
          <input type="hidden" name="userId" value={userId} />
          <Field label={`Type "${orgName}" to confirm`} error={fieldError(state, "confirm")}>
            <Input name="confirm" autoComplete="off" required />
          </Field>
          <ActionStatus state={state} />
          <div className="flex justify-end gap-2">
            <Button variant="ghost" onClick={() => setOpen(false)}>
              Cancel
            </Button>
            <SubmitButton variant="danger">Transfer ownership</SubmitButton>
          </div>
        </form>
      </Dialog>
    </>
  );
}
