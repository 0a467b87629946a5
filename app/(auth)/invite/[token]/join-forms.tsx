"use client";

import { useActionState } from "react";
import { ActionStatus, fieldError, typedValue } from "@/components/admin/action-status";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { acceptInvitationAction, joinWithNewAccountAction } from "./actions";

export function AcceptForm({ token, orgName }: { token: string; orgName: string }) {
  const [state, action] = useActionState(acceptInvitationAction, idleState);
  return (
    <form action={action} className="grid gap-3">
      <input type="hidden" name="token" value={token} />
      <ActionStatus state={state} compact={false} />
      <SubmitButton className="w-full">Join {orgName}</SubmitButton>
    </form>
  );
}

export function SignUpAndJoinForm({
  token,
  email,
  orgName,
}: {
  token: string;
  email: string;
  orgName: string;
}) {
  const [state, action] = useActionState(joinWithNewAccountAction, idleState);
  return (
    <form action={action} className="grid gap-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <ActionStatus state={state} compact={false} />
      <Field label="Work e-mail" hint="The invitation is for this address.">
        <Input value={email} readOnly />
      </Field>
      <Field label="Your name" error={fieldError(state, "name")}>
        <Input
          name="name"
          autoComplete="name"
          defaultValue={typedValue(state, "name")}
          required
          autoFocus
        />
      </Field>
      <Field
        label="Choose a password"
        hint="At least 10 characters."
        error={fieldError(state, "password")}
      >
        <Input name="password" type="password" autoComplete="new-password" required />
      </Field>
      <SubmitButton className="w-full">Create account and join {orgName}</SubmitButton>
    </form>
  );
}
