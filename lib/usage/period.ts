/** Billing periods are UTC calendar months written `YYYY-MM` (lib/billing/plans.ts bills per month). */
import { formatIsoMonth } from "@/lib/format";
export function periodOf(date: Date): string {
  return formatIsoMonth(date);
}

export function currentPeriod(): string {
  return periodOf(new Date());
}
