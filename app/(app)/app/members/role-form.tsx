"use client";

import { useActionState } from "react";
import { ActionStatus } from "@/components/admin/action-status";
import { Select } from "@/components/ui/select";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { changeRoleAction } from "./actions";

const OPTIONS = [
  { value: "viewer", label: "Viewer" },
  { value: "member", label: "Member" },
  { value: "admin", label: "Admin" },
];

/** Role picker for one member (owners change only by transfer). */
export function RoleForm({ userId, role, name }: { userId: string; role: string; name: string }) {
  const [state, action] = useActionState(changeRoleAction, idleState);
  return (
    <form action={action} className="grid gap-1.5">
      <input type="hidden" name="userId" value={userId} />
      <div className="flex items-center gap-2">
        <Select
          name="role"
          size="sm"
          options={OPTIONS}
          defaultValue={role}
          aria-label={`Role of ${name}`}
          className="w-32"
        />
        <SubmitButton size="sm" variant="secondary">
          Save
        </SubmitButton>
      </div>
      {state.status !== "idle" ? <ActionStatus state={state} /> : null}
    </form>
  );
}
