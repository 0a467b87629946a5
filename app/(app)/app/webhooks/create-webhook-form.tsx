"use client";

import { useActionState } from "react";
import { ActionStatus, fieldError, typedValue } from "@/components/admin/action-status";
import { Alert } from "@/components/ui/alert";
import { CodeBlock } from "@/components/ui/code-block";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState, type ActionState } from "@/lib/api/action-state";
import type { CreatedWebhook } from "@/lib/webhooks/operations";
import { createWebhookAction } from "./actions";

/** Registers an endpoint and shows its signing secret once. */
export function CreateWebhookForm() {
  const [state, action] = useActionState(
    createWebhookAction as (
      p: ActionState<CreatedWebhook>,
      f: FormData,
    ) => Promise<ActionState<CreatedWebhook>>,
    idleState as ActionState<CreatedWebhook>,
  );
  const created = state.status === "success" ? state.data : undefined;
  return (
    <div className="grid gap-4">
      <form action={action} className="grid gap-3" noValidate>
        <div className="grid gap-3 md:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_auto] md:items-start">
          <Field
            label="URL"
            hint="Receives a POST when a run succeeds, fails or is canceled."
            error={fieldError(state, "url")}
          >
            <Input
              name="url"
              type="url"
              maxLength={2048}
              placeholder="https://example.com/hooks/ketwise"
              defaultValue={typedValue(state, "url")}
              required
            />
          </Field>
          <Field
            label="Description"
            hint="Optional, e.g. “lab pipeline”."
            error={fieldError(state, "description")}
          >
            <Input
              name="description"
              maxLength={120}
              defaultValue={typedValue(state, "description")}
            />
          </Field>
          <SubmitButton className="md:mt-[26px]">Add endpoint</SubmitButton>
        </div>
        {state.status === "error" ? <ActionStatus state={state} /> : null}
      </form>
      {created ? (
        <Alert tone="success" role="status" title="Endpoint added — copy its signing secret now">
          <div className="grid gap-3">
            <p>
              This is the only time the secret is shown. Use it to check the{" "}
              <code className="font-mono text-[12.5px]">Ketwise-Webhook-Signature</code> header of
              every delivery to <span className="font-mono text-[12.5px]">{created.url}</span>.
            </p>
            <CodeBlock code={created.secret} title="Signing secret" wrap />
          </div>
        </Alert>
      ) : null}
    </div>
  );
}
