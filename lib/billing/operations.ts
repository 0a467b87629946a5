/**
 * Billing operations (admin and up; shape: lib/api/operation.ts). Checkout
 * and the portal answer with a URL the server action redirects to.
 */
import "server-only";
import { defineOperation } from "@/lib/api/operation";
import { createPortalSession, startCheckout } from "./checkout";
import { getPlan } from "./plans";
import { changePlanSchema, changeSeatsSchema, checkoutSchema, emptySchema } from "./schemas";
import { changePlan, changeSeats, setCancelAtPeriodEnd } from "./subscription-changes";
import { formatLongDate, plural } from "@/lib/format";

const day = (d: Date | null) => (d ? formatLongDate(d) : "the end of the period");

export const startCheckoutOp = defineOperation({
  name: "billing.checkout",
  role: "admin",
  schema: checkoutSchema,
  run: async (input, access) => {
    const { url } = await startCheckout(access, input);
    return { status: "success" as const, message: "Opening the payment page…", data: { url } };
  },
});

export const changeSeatsOp = defineOperation({
  name: "billing.change-seats",
  role: "admin",
  schema: changeSeatsSchema,
  run: async (input, access) => {
    const r = await changeSeats(access, input.seats);
    if (!r.changed)
      return { status: "success", message: `You already pay for ${plural(input.seats, "seat")}.` };
    return {
      status: "success",
      message:
        r.to > r.from
          ? `Seats raised from ${r.from} to ${r.to}; the prorated difference was invoiced and charged.`
          : `Seats lowered from ${r.from} to ${r.to}; the unused time is credited on the next invoice.`,
    };
  },
});

export const changePlanOp = defineOperation({
  name: "billing.change-plan",
  role: "admin",
  schema: changePlanSchema,
  run: async (input, access) => {
    const r = await changePlan(access, input.plan);
    const name = getPlan(input.plan).name;
    return {
      status: "success",
      message: r.changed
        ? `You are now on the ${name} plan; the prorated difference is on your invoices.`
        : `You are already on ${name}.`,
    };
  },
});

export const scheduleDowngradeOp = defineOperation({
  name: "billing.schedule-downgrade",
  role: "admin",
  schema: emptySchema,
  run: async (_input, access) => {
    const { endsAt } = await setCancelAtPeriodEnd(access, true);
    return {
      status: "success",
      message: `The organisation moves to Sandbox on ${day(endsAt)}; until then the paid plan stays.`,
    };
  },
});

export const withdrawDowngradeOp = defineOperation({
  name: "billing.withdraw-downgrade",
  role: "admin",
  schema: emptySchema,
  run: async (_input, access) => {
    await setCancelAtPeriodEnd(access, false);
    return { status: "success", message: "The subscription continues; nothing was canceled." };
  },
});

export const openPortalOp = defineOperation({
  name: "billing.portal",
  role: "admin",
  schema: emptySchema,
  run: async (_input, access) => {
    const url = await createPortalSession(access);
    return { status: "success" as const, data: { url } };
  },
});
