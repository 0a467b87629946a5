/**
 * Exact money arithmetic. Unit prices may be fractions of a cent (decimal
 * strings with up to 12 places); a line's amount is quantity × unit price
 * rounded half-up to a whole cent, computed with integers so that
 * 3 × 0.2 is exactly 0.6, never 0.6000000000000001.
 */
const SCALE = 10n ** 12n;

export function decimalToScaled(decimal: string): bigint {
  const [whole, frac = ""] = decimal.split(".");
  return BigInt(whole) * SCALE + BigInt((frac + "0".repeat(12)).slice(0, 12));
}

/** round_half_up(quantity × unitDecimal) for a non-negative integer quantity. */
export function lineAmount(quantity: number, unitDecimal: string): number {
  if (!Number.isSafeInteger(quantity) || quantity < 0)
    throw new RangeError(`quantity must be a non-negative integer, got ${quantity}`);
  const product = BigInt(quantity) * decimalToScaled(unitDecimal);
  return Number((product + SCALE / 2n) / SCALE);
}

/** Formats cents, e.g. 2900 → "$29.00", -450 → "−$4.50". */
export function formatCents(cents: number, currency = "usd"): string {
  const text = new Intl.NumberFormat("en-US", {
    style: "currency",
    currency: currency.toUpperCase(),
  }).format(Math.abs(cents) / 100);
  return cents < 0 ? `-${text}` : text;
}

/** Formats a possibly fractional cent price, e.g. "0.2" → "$0.002". */
export function formatUnitDecimal(decimal: string, currency = "usd"): string {
  const dollars = Number(decimal) / 100;
  const digits = Math.min(14, Math.max(2, (decimal.split(".")[1]?.length ?? 0) + 2));
  return new Intl.NumberFormat("en-US", {
    style: "currency",
    currency: currency.toUpperCase(),
    minimumFractionDigits: 2,
    maximumFractionDigits: Math.min(digits, 20),
  }).format(dollars);
}

export function formatDate(unix: number): string {
  return new Date(unix * 1000).toLocaleDateString("en-GB", {
    day: "numeric",
    month: "short",
    year: "numeric",
    timeZone: "UTC",
  });
}
