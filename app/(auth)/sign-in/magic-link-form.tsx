"use client";

import { useActionState } from "react";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { fieldError, FormStatus, typedValue } from "../_components/form-status";
import { requestMagicLinkAction } from "./actions";

export function MagicLinkForm({ callbackUrl, email }: { callbackUrl: string; email?: string }) {
  const [state, action] = useActionState(requestMagicLinkAction, idleState);
  return (
    <form action={action} className="grid gap-4" noValidate>
      <input type="hidden" name="callbackUrl" value={callbackUrl} />
      <FormStatus state={state} />
      <Field
        label="E-mail"
        hint="We'll send a link that signs you in once and expires in 15 minutes."
        error={fieldError(state, "email")}
      >
        <Input
          name="email"
          type="email"
          autoComplete="email"
          defaultValue={typedValue(state, "email", email)}
          required
          autoFocus
        />
      </Field>
      <SubmitButton className="mt-1 w-full">E-mail me a sign-in link</SubmitButton>
    </form>
  );
}
