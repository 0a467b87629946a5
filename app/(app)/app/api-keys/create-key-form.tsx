"use client";

import { useActionState } from "react";
import { ActionStatus, fieldError, typedValue } from "@/components/admin/action-status";
import { Alert } from "@/components/ui/alert";
import { CodeBlock } from "@/components/ui/code-block";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { Select } from "@/components/ui/select";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState, type ActionState } from "@/lib/api/action-state";
import type { CreatedKey } from "@/lib/api-keys/operations";
import { createApiKeyAction } from "./actions";

type Option = { value: string; label: string };

/** Creates a key and shows the full key once, with a curl line to try it. */
export function CreateKeyForm({
  roles,
  scopes,
  appUrl,
}: {
  roles: Option[];
  scopes: Option[];
  appUrl: string;
}) {
  const [state, action] = useActionState(
    createApiKeyAction as (
      p: ActionState<CreatedKey>,
      f: FormData,
    ) => Promise<ActionState<CreatedKey>>,
    idleState as ActionState<CreatedKey>,
  );
  const created = state.status === "success" ? state.data : undefined;
  return (
    <div className="grid gap-4">
      <form action={action} className="grid gap-3" noValidate>
        <div className="grid gap-3 md:grid-cols-[minmax(0,1fr)_12rem_12rem_auto] md:items-start">
          <Field
            label="Name"
            hint="Where the key is used, e.g. “VQE notebook”."
            error={fieldError(state, "name")}
          >
            <Input name="name" maxLength={80} defaultValue={typedValue(state, "name")} required />
          </Field>
          <Field label="Role" error={fieldError(state, "role")}>
            <Select
              name="role"
              options={roles}
              defaultValue={typedValue(state, "role", "member")}
            />
          </Field>
          <Field label="Kind" error={fieldError(state, "scope")}>
            <Select
              name="scope"
              options={scopes}
              defaultValue={typedValue(state, "scope", "personal")}
            />
          </Field>
          <SubmitButton className="md:mt-[26px]">Create key</SubmitButton>
        </div>
        {state.status === "error" ? <ActionStatus state={state} /> : null}
      </form>
      {created ? (
        <Alert tone="success" role="status" title={`Key "${created.name}" created — copy it now`}>
          <div className="grid gap-3">
            <p>
              This is the only time the whole key is shown; Ketwise stores only a hash of it. Lost
              keys cannot be recovered, only replaced.
            </p>
            <CodeBlock code={created.key} title="API key" wrap />
            <CodeBlock
              code={`curl -H "Authorization: Bearer ${created.key}" ${appUrl}/api/v1/usage`}
              title="Try it"
              wrap
            />
          </div>
        </Alert>
      ) : null}
    </div>
  );
}
