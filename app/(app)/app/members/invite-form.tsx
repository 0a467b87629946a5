"use client";

import { useActionState, useEffect, useRef } from "react";
import { ActionStatus, fieldError, typedValue } from "@/components/admin/action-status";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Select } from "@/components/ui/select";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { inviteAction } from "./actions";
import { plural } from "@/lib/format";

const ROLE_OPTIONS = [
  { value: "member", label: "Member — runs, library, own API keys" },
  { value: "viewer", label: "Viewer — reads only" },
  { value: "admin", label: "Admin — also members, keys and billing" },
];

export function InviteForm({ seatsLeft }: { seatsLeft: number }) {
  const [state, action] = useActionState(inviteAction, idleState);
  const form = useRef<HTMLFormElement>(null);
  useEffect(() => {
    if (state.status === "success") form.current?.reset();
  }, [state]);
  return (
    <form ref={form} action={action} className="grid gap-3" noValidate>
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_20rem_auto] sm:items-start">
        <Field label="E-mail" error={fieldError(state, "email")}>
          <Input
            name="email"
            type="email"
            autoComplete="off"
            placeholder="colleague@lab.example"
            defaultValue={typedValue(state, "email")}
            required
          />
        </Field>
        <Field label="Role" error={fieldError(state, "role")}>
          <Select
            name="role"
            options={ROLE_OPTIONS}
            defaultValue={typedValue(state, "role", "member")}
          />
        </Field>
        <SubmitButton className="sm:mt-[26px]">Send invitation</SubmitButton>
      </div>
      <p className="text-[12.5px] text-ink-3">
        {seatsLeft > 0
          ? `${plural(seatsLeft, "seat")} free. The link works once and expires in 7 days; a pending invitation holds a seat.`
          : "Every seat is in use: add seats on the billing page before inviting."}
      </p>
      <ActionStatus state={state} />
    </form>
  );
}
