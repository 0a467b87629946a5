"use client";

import Link from "next/link";
import { useActionState } from "react";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState } from "@/lib/api/action-state";
import { fieldError, FormStatus, typedValue } from "../_components/form-status";
import { signInWithPasswordAction } from "./actions";

export function PasswordForm({ callbackUrl, email }: { callbackUrl: string; email?: string }) {
  const [state, action] = useActionState(signInWithPasswordAction, idleState);
  return (
    <form action={action} className="grid gap-4" noValidate>
      <input type="hidden" name="callbackUrl" value={callbackUrl} />
      <FormStatus state={state} />
      <Field label="E-mail" error={fieldError(state, "email")}>
        <Input
          name="email"
          type="email"
          autoComplete="email"
          defaultValue={typedValue(state, "email", email)}
          required
          autoFocus
        />
      </Field>
      <Field
        label="Password"
        error={fieldError(state, "password")}
        aside={
          <Link href="/sign-in?tab=link" className="text-[13px] text-accent-ink hover:underline">
            Forgot it? E-mail me a link
          </Link>
        }
      >
        <Input name="password" type="password" autoComplete="current-password" required />
      </Field>
      <SubmitButton className="mt-1 w-full">Sign in</SubmitButton>
    </form>
  );
}
