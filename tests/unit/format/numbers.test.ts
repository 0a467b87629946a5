import { describe, expect, it } from "vitest";
import {
  MINUS,
  NumberFormatError,
  THIN_SPACE,
  formatCompact,
  formatCount,
  formatExponential,
  formatFixed,
  formatNumber,
  formatPercent,
  formatSignificant,
  formatSigned,
  withMinus,
} from "@/lib/format/numbers";

// The minus sign is U+2212 (Unicode Standard, chapter 22 "Symbols": U+2212 MINUS SIGN is
// the mathematical minus; U+002D is the ambiguous hyphen-minus).
describe("the minus sign", () => {
  it("is U+2212", () => {
    expect(MINUS).toBe("\u2212");
    expect(MINUS.codePointAt(0)).toBe(0x2212);
  });
  it("replaces the ASCII hyphen-minus before digits, mantissa and exponent alike", () => {
    expect(withMinus("-1.5")).toBe("\u22121.5");
    expect(withMinus("-1.5e-7")).toBe("\u22121.5e\u22127");
    expect(withMinus("-.5")).toBe("\u2212.5");
    expect(withMinus("a-b")).toBe("a-b");
  });
  it("drops the sign of a value that rounded to zero (negative zero)", () => {
    expect(withMinus("-0")).toBe("0");
    expect(withMinus("-0.00")).toBe("0.00");
    expect(formatFixed(-0, 2)).toBe("0.00");
    expect(formatFixed(-0.004, 2)).toBe("0.00");
    expect(formatNumber(-0, 1)).toBe("0");
    expect(formatCount(-0.4)).toBe("0");
    expect(formatSigned(-0.001, 2)).toBe("0.00");
    expect(formatSigned(0.001, 2)).toBe("0.00");
  });
});

describe("formatFixed (rounding half away from zero, common practice for display)", () => {
  it("rounds ties away from zero on both sides", () => {
    expect(formatFixed(0.125, 2)).toBe("0.13");
    expect(formatFixed(-0.125, 2)).toBe(`${MINUS}0.13`);
    // 1.005 is 1.00499999999999989… in binary; toFixed(2) gives "1.00", the decimal reading "1.01"
    expect(formatFixed(1.005, 2)).toBe("1.01");
    expect(formatFixed(-1.137283834, 6)).toBe(`${MINUS}1.137284`);
  });
  it("keeps the ASCII minus when asked (CSV)", () => {
    expect(formatFixed(-2.5, 1, { ascii: true })).toBe("-2.5");
  });
  it("refuses non-finite values", () => {
    expect(() => formatFixed(Number.NaN, 2)).toThrow(NumberFormatError);
  });
});

describe("formatSigned", () => {
  it("shows + and − explicitly", () => {
    expect(formatSigned(0.25, 2)).toBe("+0.25");
    expect(formatSigned(-0.25, 2)).toBe(`${MINUS}0.25`);
    expect(formatSigned(0, 1)).toBe("0.0");
  });
});

describe("counts and numbers (en-US grouping, Unicode CLDR)", () => {
  it("groups thousands with commas", () => {
    expect(formatCount(0)).toBe("0");
    expect(formatCount(999)).toBe("999");
    expect(formatCount(1000)).toBe("1,000");
    expect(formatCount(1234567)).toBe("1,234,567");
    expect(formatCount(-1234)).toBe(`${MINUS}1,234`);
    expect(formatCount(Number.POSITIVE_INFINITY)).toBe("∞");
    expect(formatCount(Number.NEGATIVE_INFINITY)).toBe(`${MINUS}∞`);
  });
  it("groups with a narrow no-break space on request", () => {
    expect(formatCount(100000, { group: "thin" })).toBe(`100${THIN_SPACE}000`);
  });
  it("rounds to the requested decimals, dropping trailing zeros", () => {
    expect(formatCount(2.5)).toBe("3");
    expect(formatNumber(1234.56, 1)).toBe("1,234.6");
    expect(formatNumber(2, 1)).toBe("2");
    expect(formatNumber(-0.25, 2)).toBe(`${MINUS}0.25`);
  });
  it("abbreviates for meters", () => {
    expect(formatCompact(600)).toBe("600");
    expect(formatCompact(36_000)).toBe("36K");
    expect(formatCompact(1_200_000)).toBe("1.2M");
    expect(formatCompact(-1_500)).toBe(`${MINUS}1.5K`);
  });
});

describe("significant digits, powers of ten, percentages", () => {
  it("keeps up to n significant digits", () => {
    expect(formatSignificant(Math.PI / 4, 4)).toBe("0.7854");
    expect(formatSignificant(-2, 6)).toBe(`${MINUS}2`);
    expect(formatSignificant(-1.5e-7, 3)).toBe(`${MINUS}1.5e${MINUS}7`);
  });
  it("writes scientific notation with superscript exponents", () => {
    expect(formatExponential(0.0000123, 1)).toBe("1.2 × 10⁻⁵");
    expect(formatExponential(-45600, 2)).toBe(`${MINUS}4.56 × 10⁴`);
    expect(formatExponential(0)).toBe("0");
  });
  it("writes percentages with a space before the sign", () => {
    expect(formatPercent(0.125, 1)).toBe("12.5 %");
    expect(formatPercent(0.4567)).toBe("46 %");
    expect(formatPercent(1)).toBe("100 %");
    expect(formatPercent(-0.001)).toBe("0 %");
    // 0.07 × 100 = 7.000000000000001 in binary floating point
    expect(formatPercent(0.07, 2, { trim: true })).toBe("7 %");
    expect(formatPercent(0.005, 2, { trim: true })).toBe("0.5 %");
  });
});
