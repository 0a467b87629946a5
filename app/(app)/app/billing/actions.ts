"use server";

import { redirect } from "next/navigation";
import { orgAction } from "@/lib/api/action";
import {
  changePlanOp,
  changeSeatsOp,
  openPortalOp,
  scheduleDowngradeOp,
  startCheckoutOp,
  withdrawDowngradeOp,
} from "@/lib/billing/operations";
import { operationAction, type Operation } from "@/lib/api/operation";
import type { z } from "zod";

/** An operation whose success carries a provider URL: the action sends the browser there. */
function redirecting<S extends z.ZodType>(op: Operation<S, { url: string }>) {
  return orgAction<S, { url: string }>(op.schema, { role: op.role }, async (input, access) => {
    const state = await op.run(input, access);
    if (state.status === "success" && state.data?.url) redirect(state.data.url);
    return state;
  });
}

export const startCheckoutAction = redirecting(startCheckoutOp);
export const openPortalAction = redirecting(openPortalOp);
export const changeSeatsAction = operationAction(changeSeatsOp, "/app", "layout");
export const changePlanAction = operationAction(changePlanOp, "/app", "layout");
export const scheduleDowngradeAction = operationAction(scheduleDowngradeOp, "/app/billing");
export const withdrawDowngradeAction = operationAction(withdrawDowngradeOp, "/app/billing");
