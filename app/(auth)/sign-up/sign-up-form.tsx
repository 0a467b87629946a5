"use client";

import { useActionState } from "react";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { fieldError, FormStatus, typedValue } from "../_components/form-status";
import { signUpAction } from "./actions";

export function SignUpForm() {
  const [state, action] = useActionState(signUpAction, idleState);
  return (
    <form action={action} className="grid gap-4" noValidate>
      <FormStatus state={state} />
      <Field label="Name" error={fieldError(state, "name")}>
        <Input
          name="name"
          autoComplete="name"
          defaultValue={typedValue(state, "name")}
          required
          autoFocus
        />
      </Field>
      <Field label="Work e-mail" error={fieldError(state, "email")}>
        <Input
          name="email"
          type="email"
          autoComplete="email"
          defaultValue={typedValue(state, "email")}
          required
        />
      </Field>
      <Field
        label="Password"
        hint="At least 10 characters. A short sentence is easier to remember than symbols."
        error={fieldError(state, "password")}
      >
        <Input name="password" type="password" autoComplete="new-password" required />
      </Field>
      <SubmitButton className="mt-1 w-full">Create account</SubmitButton>
    </form>
  );
}
