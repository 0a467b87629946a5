"use client";

import { useActionState } from "react";
import { ActionStatus, fieldError, typedValue } from "@/components/admin/action-status";
import { Field } from "@/components/ui/field";
import { Input } from "@/components/ui/input";
import { SubmitButton } from "@/components/ui/submit-button";
import { idleState, type ActionState } from "@/lib/api/action-state";
import {
  changePlanAction,
  changeSeatsAction,
  openPortalAction,
  scheduleDowngradeAction,
  startCheckoutAction,
  withdrawDowngradeAction,
} from "./actions";

type Act = (p: ActionState, f: FormData) => Promise<ActionState>;

/** Sandbox → paid plan: seats, then the provider's hosted payment page. */
export function CheckoutForm({
  plan,
  planName,
  minSeats,
  maxSeats,
}: {
  plan: string;
  planName: string;
  minSeats: number;
  maxSeats: number;
}) {
  const [state, action] = useActionState(startCheckoutAction as unknown as Act, idleState);
  return (
    <form action={action} className="grid gap-2" noValidate>
      <input type="hidden" name="plan" value={plan} />
      <div className="flex items-end gap-2">
        <Field label="Seats" error={fieldError(state, "seats")} className="w-24">
          <Input
            name="seats"
            type="number"
            min={minSeats}
            max={maxSeats}
            defaultValue={typedValue(state, "seats", String(minSeats))}
            mono
          />
        </Field>
        <SubmitButton className="flex-1">Upgrade to {planName}</SubmitButton>
      </div>
      <ActionStatus state={state} />
    </form>
  );
}

export function SeatsForm({ seats, min, max }: { seats: number; min: number; max: number }) {
  const [state, action] = useActionState(changeSeatsAction as Act, idleState);
  return (
    <form action={action} className="grid gap-2" noValidate>
      <div className="flex items-start gap-2">
        <Field
          label="Paid seats"
          hint={`At least ${min} (people in the organisation), at most ${max}.`}
          error={fieldError(state, "seats")}
          className="w-72"
        >
          <Input
            name="seats"
            type="number"
            min={min}
            max={max}
            defaultValue={typedValue(state, "seats", String(seats))}
            mono
          />
        </Field>
        <SubmitButton variant="secondary" className="mt-[26px]">
          Change seats
        </SubmitButton>
      </div>
      <ActionStatus state={state} />
    </form>
  );
}

export function ChangePlanForm({
  plan,
  label,
  primary,
}: {
  plan: string;
  label: string;
  primary?: boolean;
}) {
  const [state, action] = useActionState(changePlanAction as Act, idleState);
  return (
    <form action={action} className="grid gap-2">
      <input type="hidden" name="plan" value={plan} />
      <SubmitButton variant={primary ? "primary" : "secondary"}>{label}</SubmitButton>
      <ActionStatus state={state} />
    </form>
  );
}

export function DowngradeForm({ scheduled }: { scheduled: boolean }) {
  const [state, action] = useActionState(
    (scheduled ? withdrawDowngradeAction : scheduleDowngradeAction) as Act,
    idleState,
  );
  return (
    <form action={action} className="grid gap-2">
      <SubmitButton variant={scheduled ? "secondary" : "ghost"}>
        {scheduled ? "Keep the paid plan" : "Move to Sandbox at period end"}
      </SubmitButton>
      <ActionStatus state={state} />
    </form>
  );
}

export function PortalForm() {
  const [state, action] = useActionState(openPortalAction as unknown as Act, idleState);
  return (
    <form action={action} className="grid gap-2">
      <SubmitButton variant="secondary" size="sm">
        Card and invoices
      </SubmitButton>
      <ActionStatus state={state} />
    </form>
  );
}
