/**
 * Numbers for people: counts with thousands separators, fixed and significant decimals,
 * percentages and powers of ten. One locale ("en-US" grouping and decimal point) on the
 * server and in the browser, so both render the same text. Negative values carry the true
 * minus sign U+2212, and a value that rounds to zero never shows a sign ("0.00", not "−0.00").
 */

export const NUMBER_LOCALE = "en-US";
/** The minus sign (U+2212), as wide as the plus sign and never broken from its digits. */
export const MINUS = "\u2212";
/** Narrow no-break space (U+202F), the thin digit-group separator of display figures. */
export const THIN_SPACE = "\u202f";

const SUPERSCRIPT: Record<string, string> = {
  "0": "⁰",
  "1": "¹",
  "2": "²",
  "3": "³",
  "4": "⁴",
  "5": "⁵",
  "6": "⁶",
  "7": "⁷",
  "8": "⁸",
  "9": "⁹",
  "-": "⁻",
};

export class NumberFormatError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = "NumberFormatError";
  }
}

function assertFinite(name: string, x: number): void {
  if (typeof x !== "number" || !Number.isFinite(x)) {
    throw new NumberFormatError(`${name} must be a finite number, got ${String(x)}.`);
  }
}

/**
 * Puts the true minus sign on a formatted number: an ASCII "-" before a digit becomes
 * U+2212 ("-1.5e-7" → "−1.5e−7"), and a negative that rounded to zero loses its sign
 * ("-0.00" → "0.00").
 */
export function withMinus(text: string): string {
  const signed = text.replace(/-(?=[\d.∞])/g, MINUS);
  return /^\u2212[0.]*$/.test(signed) ? signed.slice(1) : signed;
}

const grouped = new Map<number, Intl.NumberFormat>();
function groupedFormat(maxDecimals: number): Intl.NumberFormat {
  let f = grouped.get(maxDecimals);
  if (!f) {
    f = new Intl.NumberFormat(NUMBER_LOCALE, { maximumFractionDigits: maxDecimals });
    grouped.set(maxDecimals, f);
  }
  return f;
}

/**
 * A count with thousands separators: 1234567 → "1,234,567" (rounded to a whole number).
 * `group: "thin"` separates the groups by a narrow no-break space instead ("1 234 567"),
 * the style of the marketing figures.
 */
export function formatCount(n: number, options: { group?: "comma" | "thin" } = {}): string {
  return formatNumber(n, 0, options);
}

/**
 * A number with thousands separators and at most `maxDecimals` decimals, trailing zeros
 * dropped: formatNumber(1234.56, 1) → "1,234.6", formatNumber(2, 1) → "2". Infinite values
 * print as "∞" (a count parsed from a huge literal must still be reportable).
 */
export function formatNumber(
  n: number,
  maxDecimals = 1,
  options: { group?: "comma" | "thin" } = {},
): string {
  const text = withMinus(groupedFormat(maxDecimals).format(n));
  return options.group === "thin" ? text.replace(/,/g, THIN_SPACE) : text;
}

const compact = new Intl.NumberFormat(NUMBER_LOCALE, {
  notation: "compact",
  maximumFractionDigits: 1,
});

/** A short figure for meters and axes: 1200000 → "1.2M", 36000 → "36K", 600 → "600". */
export function formatCompact(n: number): string {
  return withMinus(compact.format(n));
}

/** |x| rounded to `decimals` places, half away from zero, as a digit string with point. */
export function fixedAbs(x: number, decimals: number): string {
  const scaled = Number((Math.abs(x) * 10 ** decimals).toPrecision(15));
  const int = Math.round(scaled);
  if (decimals <= 0) return String(int * 10 ** -decimals);
  const s = String(int).padStart(decimals + 1, "0");
  return `${s.slice(0, -decimals)}.${s.slice(-decimals)}`;
}

/** Prefixes the sign of `x` to the digits `text` unless they are all zero. */
export function signed(x: number, text: string, ascii = false): string {
  return x < 0 && /[1-9]/.test(text) ? (ascii ? "-" : MINUS) + text : text;
}

/**
 * A number with a fixed count of decimals (half away from zero) and a true minus sign:
 * formatFixed(-0.5, 6) → "−0.500000", formatFixed(-0.0001, 2) → "0.00".
 * `ascii` gives "-" for CSV and clipboard text.
 */
export function formatFixed(
  value: number,
  decimals: number,
  options: { ascii?: boolean } = {},
): string {
  assertFinite("Value", value);
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 20) {
    throw new NumberFormatError(`Decimals must be an integer from 0 to 20, got ${decimals}.`);
  }
  return signed(value, fixedAbs(value, decimals), options.ascii ?? false);
}

/**
 * Like formatFixed, with an explicit "+" on positive values (for differences and
 * coefficients): formatSigned(0.25, 2) → "+0.25", formatSigned(-0.25, 2) → "−0.25",
 * and "0.00" for a value that rounds to zero.
 */
export function formatSigned(value: number, decimals: number): string {
  const text = formatFixed(value, decimals);
  return value > 0 && /[1-9]/.test(text) ? `+${text}` : text;
}

/**
 * Up to `digits` significant digits, trailing zeros dropped: formatSignificant(0.785398, 4)
 * → "0.7854", formatSignificant(-2, 6) → "−2". Very large or small values keep the
 * shortest exact notation of JavaScript with a true minus ("1.5e−7").
 */
export function formatSignificant(value: number, digits: number): string {
  assertFinite("Value", value);
  return withMinus(String(Number(value.toPrecision(digits))));
}

/** Superscript digits of an exponent: −11 → "⁻¹¹". */
export function superscript(e: number): string {
  return String(e)
    .split("")
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join("");
}

/**
 * Scientific notation with `decimals` decimals in the mantissa: formatExponential(0.0000123, 1)
 * → "1.2 × 10⁻⁵". Zero is "0".
 */
export function formatExponential(value: number, decimals = 1): string {
  assertFinite("Value", value);
  if (value === 0) return "0";
  const [mantissa, exponent] = value.toExponential(decimals).split("e");
  return `${withMinus(mantissa!)} × 10${superscript(Number(exponent))}`;
}

/**
 * A fraction as a percentage with a space before the sign, as everywhere in the product:
 * formatPercent(0.125, 1) → "12.5 %", formatPercent(0.4567) → "46 %". `trim` drops trailing
 * zeros (formatPercent(0.01, 2, { trim: true }) → "1 %", 0.005 → "0.5 %").
 */
export function formatPercent(
  ratio: number,
  decimals = 0,
  options: { trim?: boolean } = {},
): string {
  const text = options.trim
    ? formatNumber(ratio * 100, decimals)
    : formatFixed(ratio * 100, decimals);
  return `${text} %`;
}
