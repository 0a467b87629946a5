/**
 * Printing a value with its standard uncertainty.
 *
 * Concise notation (GUM, JCGM 100:2008 §7.2.2): the number in parentheses is the
 * uncertainty expressed in units of the last digits of the value, so
 * −1.1372(8) means −1.1372 ± 0.0008 and 6.67430(15) × 10⁻¹¹ means
 * (6.67430 ± 0.00015) × 10⁻¹¹.
 *
 * Rounding of the uncertainty follows the Particle Data Group rule (default): take
 * the three highest-order digits of u; 100–354 → two significant digits, 355–949 →
 * one, 950–999 → round up to 1000 and keep two. Alternatively a fixed 1 or 2
 * significant digits. The value is then rounded to the same decimal place as u
 * (half away from zero).
 *
 * Layout: plain decimals when |value| < 10⁶, the last kept digit is at or right of the
 * units place, and either |value| ≥ 10⁻³ or at most 6 decimals are needed; otherwise
 * scientific, "m(u) × 10ᵉ" with the exponent of the larger of |value| and u. The minus sign is
 * U+2212 and the exponent uses superscript digits, unless `ascii` is set, which gives
 * "-1.1372(8)" and "6.67430(15)e-11" (for CSV and clipboard).
 */

import { fixedAbs, formatFixed, signed, superscript } from "./numbers";

export class UncertaintyFormatError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = "UncertaintyFormatError";
  }
}

export type UncertaintyDigits = 1 | 2 | "pdg";

export type UncertaintyFormatOptions = {
  /** Significant digits of the uncertainty: fixed 1 or 2, or the PDG rule (default). */
  digits?: UncertaintyDigits;
  /** ASCII output: "-" for minus and "e" exponents. */
  ascii?: boolean;
};

export type RoundedUncertainty = {
  /** The uncertainty's significant digits as an integer, e.g. 8 or 15. */
  digitsValue: number;
  /** Decimal places of the last kept digit (negative = left of the units place). */
  decimals: number;
  /** The rounded uncertainty as a number (digitsValue × 10^−decimals). */
  rounded: number;
};

function assertFinite(name: string, x: number): void {
  if (typeof x !== "number" || !Number.isFinite(x)) {
    throw new UncertaintyFormatError(`${name} must be a finite number, got ${String(x)}.`);
  }
}

/** Decimal exponent of |x| (x ≠ 0), robust to values like 0.001 that log10 misjudges. */
function exponentOf(x: number): number {
  return Number(Math.abs(x).toExponential().split("e")[1]);
}

/**
 * Rounds a positive uncertainty to 1 or 2 significant digits (see module doc).
 * @throws UncertaintyFormatError when u is not a positive finite number.
 */
export function roundUncertainty(u: number, digits: UncertaintyDigits = "pdg"): RoundedUncertainty {
  assertFinite("Uncertainty", u);
  if (u <= 0) throw new UncertaintyFormatError(`Uncertainty must be positive, got ${u}.`);
  // Three leading digits, from a decimal representation (no log10 rounding surprises).
  const [mant, exp] = u.toExponential(2).split("e");
  let e = Number(exp);
  const lead = Math.round(Number(mant) * 100); // 100 … 999
  let sig: 1 | 2;
  if (digits === "pdg") sig = lead <= 354 ? 2 : lead <= 949 ? 1 : 2;
  else sig = digits;
  let value = Math.round(lead / (sig === 2 ? 10 : 100)); // keep sig digits
  if (value >= (sig === 2 ? 100 : 10) || (digits === "pdg" && lead >= 950)) {
    // Rounded up into the next decade (e.g. 0.96 → 1.0): keep the digit count.
    value = sig === 2 ? 10 : 1;
    e += 1;
  }
  const decimals = sig - 1 - e;
  return { digitsValue: value, decimals, rounded: value * 10 ** -decimals };
}

/** Plain decimals read well: last digit at or right of units, below 10⁶, not a long run of 0.000… */
function isPlain(abs: number, decimals: number): boolean {
  return decimals >= 0 && abs < 1e6 && (abs >= 1e-3 || decimals <= 6);
}

function sign(x: number, ascii: boolean, text: string): string {
  return signed(x, text, ascii);
}

function exponentText(e: number, ascii: boolean): string {
  if (ascii) return `e${e}`;
  return ` × 10${superscript(e)}`;
}

/**
 * Formats `value` with standard uncertainty `u` in concise notation, e.g.
 * formatUncertainty(-1.13718, 0.00082) → "−1.1372(8)".
 * With u = 0 the value is printed alone with `exactDecimals` places (default 6).
 * @throws UncertaintyFormatError for a non-finite value or a negative / non-finite u.
 */
export function formatUncertainty(
  value: number,
  u: number,
  options: UncertaintyFormatOptions & { exactDecimals?: number } = {},
): string {
  const ascii = options.ascii ?? false;
  assertFinite("Value", value);
  assertFinite("Uncertainty", u);
  if (u < 0) throw new UncertaintyFormatError(`Uncertainty must not be negative, got ${u}.`);
  if (u === 0) return formatFixed(value, options.exactDecimals ?? 6, { ascii });

  const r = roundUncertainty(u, options.digits ?? "pdg");
  const abs = Math.abs(value);
  if (isPlain(abs, r.decimals)) {
    return `${sign(value, ascii, fixedAbs(value, r.decimals))}(${r.digitsValue})`;
  }
  // Scientific: exponent from the larger of |value| and u, mantissa to u's decimal place.
  // Mantissa decimals = u's decimals + E (≥ 0, since E ≥ exponent of the rounded u).
  let E = exponentOf(abs >= r.rounded ? value : r.rounded);
  let m = fixedAbs(value / 10 ** E, r.decimals + E);
  if (Number(m) >= 10) {
    // Rounding carried into a new digit (9.996 → 10.00): renormalise to one more decade.
    E += 1;
    m = fixedAbs(value / 10 ** E, r.decimals + E);
  }
  return `${sign(value, ascii, m)}(${r.digitsValue})${exponentText(E, ascii)}`;
}

/**
 * Formats the value and uncertainty as "v ± u" with both rounded as in concise notation,
 * e.g. formatPlusMinus(-1.13718, 0.00082) → "−1.1372 ± 0.0008" (plain layout only;
 * falls back to concise notation where that would need an exponent).
 */
export function formatPlusMinus(
  value: number,
  u: number,
  options: UncertaintyFormatOptions = {},
): string {
  const ascii = options.ascii ?? false;
  assertFinite("Value", value);
  assertFinite("Uncertainty", u);
  if (u <= 0) return formatUncertainty(value, u, options);
  const r = roundUncertainty(u, options.digits ?? "pdg");
  const abs = Math.abs(value);
  if (!isPlain(abs, r.decimals)) return formatUncertainty(value, u, options);
  return `${sign(value, ascii, fixedAbs(value, r.decimals))} ${ascii ? "+/-" : "±"} ${fixedAbs(r.rounded, r.decimals)}`;
}
