/** Request shapes of the billing forms and actions (client-safe). */
import { z } from "zod";

export const paidPlanSchema = z.enum(["lab", "institute"], { error: "Choose Lab or Institute." });

const seats = z.coerce
  .number({ error: "Enter a number of seats." })
  .int("Seats are whole people.")
  .min(1, "At least one seat.")
  .max(10_000, "That is more seats than any plan offers.");

export const checkoutSchema = z.object({ plan: paidPlanSchema, seats });
export const changeSeatsSchema = z.object({ seats });
export const changePlanSchema = z.object({ plan: paidPlanSchema });
export const emptySchema = z.object({});

export type CheckoutInput = z.infer<typeof checkoutSchema>;
