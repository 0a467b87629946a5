import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { NumberFormatError, formatFixed } from "@/lib/format/numbers";
import {
  UncertaintyFormatError,
  formatPlusMinus,
  formatUncertainty,
  roundUncertainty,
} from "@/lib/format/uncertainty";

const M = "\u2212"; // minus sign

describe("roundUncertainty — Particle Data Group rounding rule", () => {
  // Source: PDG Review of Particle Physics, Introduction, "Rounding" (three highest-order
  // digits 100–354 → 2 significant digits, 355–949 → 1, 950–999 → 1000 with 2 digits).
  // Wording and examples value from memory.
  it("keeps two digits for 100–354", () => {
    expect(roundUncertainty(0.119)).toMatchObject({ digitsValue: 12, decimals: 2 });
    expect(roundUncertainty(0.354)).toMatchObject({ digitsValue: 35, decimals: 2 });
    expect(roundUncertainty(1.0)).toMatchObject({ digitsValue: 10, decimals: 1 });
  });
  it("keeps one digit for 355–949", () => {
    expect(roundUncertainty(0.367)).toMatchObject({ digitsValue: 4, decimals: 1 });
    expect(roundUncertainty(0.355)).toMatchObject({ digitsValue: 4, decimals: 1 });
    expect(roundUncertainty(0.949)).toMatchObject({ digitsValue: 9, decimals: 1 });
  });
  it("rounds 950–999 up to the next decade with two digits", () => {
    expect(roundUncertainty(0.95)).toMatchObject({ digitsValue: 10, decimals: 1 });
    expect(roundUncertainty(0.00099)).toMatchObject({ digitsValue: 10, decimals: 4 });
  });
  it("supports fixed 1 or 2 significant digits (common practice)", () => {
    expect(roundUncertainty(0.00082, 2)).toMatchObject({ digitsValue: 82, decimals: 5 });
    expect(roundUncertainty(0.00082, 1)).toMatchObject({ digitsValue: 8, decimals: 4 });
    expect(roundUncertainty(0.096, 1)).toMatchObject({ digitsValue: 1, decimals: 1 });
    expect(roundUncertainty(0.0996, 2)).toMatchObject({ digitsValue: 10, decimals: 2 });
  });
  it("handles uncertainties at or above 1", () => {
    expect(roundUncertainty(230)).toMatchObject({ digitsValue: 23, decimals: -1, rounded: 230 });
    expect(roundUncertainty(5.6)).toMatchObject({ digitsValue: 6, decimals: 0 });
  });
  it("rejects zero, negative and non-finite uncertainties with a typed error", () => {
    for (const bad of [0, -1, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => roundUncertainty(bad)).toThrow(UncertaintyFormatError);
    }
  });
});

describe("formatUncertainty — concise notation", () => {
  it("prints the product's own example", () => {
    expect(formatUncertainty(-1.13718, 0.00082)).toBe(`${M}1.1372(8)`);
  });
  it("matches the PDG worked examples (value from memory)", () => {
    // PDG: 0.827 ± 0.119 → 0.83 ± 0.12; 0.827 ± 0.367 → 0.8 ± 0.4.
    expect(formatUncertainty(0.827, 0.119)).toBe("0.83(12)");
    expect(formatUncertainty(0.827, 0.367)).toBe("0.8(4)");
    expect(formatPlusMinus(0.827, 0.119)).toBe("0.83 ± 0.12");
    expect(formatPlusMinus(0.827, 0.367)).toBe("0.8 ± 0.4");
  });
  it("matches the GUM example of concise notation", () => {
    // JCGM 100:2008 (GUM) §7.2.2: m_S = 100.021 47(35) g for u_c = 0.35 mg.
    expect(formatUncertainty(100.02147, 0.00035)).toBe("100.02147(35)");
  });
  it("matches CODATA 2018 recommended values as published (two-digit uncertainties)", () => {
    // CODATA 2018 (physics.nist.gov/constants); CODATA always quotes two digits of u.
    // inverse fine-structure constant 137.035 999 084(21)
    expect(formatUncertainty(137.035999084, 0.000000021, { digits: 2 })).toBe("137.035999084(21)");
    // Newtonian constant of gravitation 6.674 30(15) × 10⁻¹¹
    expect(formatUncertainty(6.6743e-11, 0.00015e-11, { digits: 2 })).toBe("6.67430(15) × 10⁻¹¹");
    // electron mass 9.109 383 7015(28) × 10⁻³¹ kg
    expect(formatUncertainty(9.1093837015e-31, 0.0000000028e-31, { digits: 2 })).toBe(
      "9.1093837015(28) × 10⁻³¹",
    );
    // proton mass 1.672 621 923 69(51) × 10⁻²⁷ kg
    expect(formatUncertainty(1.67262192369e-27, 0.00000000051e-27, { digits: 2 })).toBe(
      "1.67262192369(51) × 10⁻²⁷",
    );
  });
  it("applies the PDG rule by default where CODATA keeps two digits", () => {
    // u of the proton mass has leading digits 510 → one digit under the PDG rule.
    expect(formatUncertainty(1.67262192369e-27, 0.00000000051e-27)).toBe("1.6726219237(5) × 10⁻²⁷");
  });
  it("uses scientific layout when the last digit is left of the units place", () => {
    expect(formatUncertainty(12345, 230)).toBe("1.235(23) × 10⁴");
    expect(formatUncertainty(12345, 230, { ascii: true })).toBe("1.235(23)e4");
  });
  it("renormalises when rounding carries into a new decade", () => {
    expect(formatUncertainty(9.96e6, 6e5)).toBe("1.00(6) × 10⁷");
  });
  it("keeps small values plain while few decimals are needed", () => {
    expect(formatUncertainty(1e-10, 0.5)).toBe("0.0(5)");
    expect(formatUncertainty(0, 0.0123)).toBe("0.000(12)");
  });
  it("never prints a negative zero", () => {
    expect(formatUncertainty(-0.0004, 0.03)).toBe("0.000(30)");
    expect(formatUncertainty(-0.004, 0.5)).toBe("0.0(5)");
  });
  it("prints a true minus sign, or '-' in ASCII mode", () => {
    expect(formatUncertainty(-0.5, 0.021)).toBe(`${M}0.500(21)`);
    expect(formatUncertainty(-0.5, 0.021, { ascii: true })).toBe("-0.500(21)");
    expect(formatPlusMinus(-0.5, 0.021, { ascii: true })).toBe("-0.500 +/- 0.021");
  });
  it("prints exact values (u = 0) with fixed decimals", () => {
    expect(formatUncertainty(-1.137283834, 0)).toBe(`${M}1.137284`);
    expect(formatUncertainty(-1.137283834, 0, { exactDecimals: 3 })).toBe(`${M}1.137`);
  });
  it("rejects NaN, infinities and negative uncertainties", () => {
    expect(() => formatUncertainty(Number.NaN, 0.1)).toThrow(UncertaintyFormatError);
    expect(() => formatUncertainty(1, Number.POSITIVE_INFINITY)).toThrow(/finite/);
    expect(() => formatUncertainty(1, -0.1)).toThrow(/negative/);
  });
});

describe("formatFixed", () => {
  it("rounds half away from zero and uses the minus sign", () => {
    expect(formatFixed(2.5, 0)).toBe("3");
    expect(formatFixed(-2.5, 0)).toBe(`${M}3`);
    expect(formatFixed(-0.0000001, 3)).toBe("0.000");
  });
  it("rejects bad decimal counts", () => {
    expect(() => formatFixed(1, -1)).toThrow(NumberFormatError);
    expect(() => formatFixed(1, 1.5)).toThrow(NumberFormatError);
  });
});

/** Reads concise notation back: "−1.1372(8)" → { value, u }. */
function parseConcise(s: string): { value: number; u: number } {
  const m = /^(-?)(\d+)(?:\.(\d+))?\((\d+)\)(?:e(-?\d+))?$/.exec(s);
  if (!m) throw new Error(`unparsable: ${s}`);
  const decimals = m[3]?.length ?? 0;
  const exp = m[5] ? Number(m[5]) : 0;
  const value = Number(`${m[1]}${m[2]}.${m[3] ?? "0"}`) * 10 ** exp;
  const u = Number(m[4]) * 10 ** (exp - decimals);
  return { value, u };
}

describe("formatUncertainty — properties (definition of concise notation, GUM §7.2.2)", () => {
  const finite = fc.double({ min: -1e9, max: 1e9, noNaN: true, noDefaultInfinity: true });
  const positive = fc.double({ min: 1e-9, max: 1e7, noNaN: true, noDefaultInfinity: true });

  it("reads back to a value within half a last digit and an uncertainty within rounding", () => {
    fc.assert(
      fc.property(finite, positive, (value, u) => {
        const { value: v, u: uu } = parseConcise(formatUncertainty(value, u, { ascii: true }));
        const lastDigit = roundUncertainty(u).rounded / roundUncertainty(u).digitsValue;
        // value rounded to the last kept digit (tolerance for binary representation)
        expect(Math.abs(v - value)).toBeLessThanOrEqual(
          lastDigit / 2 + 1e-9 * Math.max(1, Math.abs(value)),
        );
        // u rounded by the PDG rule: worst case is one digit from 0.355 (0.05 / 0.355 ≈ 14.1 %)
        expect(Math.abs(uu - u) / u).toBeLessThanOrEqual(0.05 / 0.355 + 1e-12);
      }),
      { numRuns: 2000 },
    );
  });
});
