/** Billing periods are UTC calendar months written `YYYY-MM` (lib/billing/plans.ts bills per month). */
export function periodOf(date: Date): string {
  return date.toISOString().slice(0, 7);
}

export function currentPeriod(): string {
  return periodOf(new Date());
}
