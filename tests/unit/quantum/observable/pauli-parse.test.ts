/**
 * Pauli-sum text grammar. Expected words follow the project's fixed
 * convention: dense words read qubit 0 first; bit k of the masks is qubit k.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EngineError } from "@/lib/quantum/errors";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";

const words = (text: string) => parsePauliSum(text).terms.map((t) => [t.coefficient, t.word]);

function errorOf(text: string): EngineError {
  try {
    parsePauliSum(text);
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error(`expected "${text}" to be rejected`);
}

describe("Pauli-sum syntax forms", () => {
  it("sparse words with spaces and glued factors", () => {
    expect(words("0.5 Z0 Z1 + 0.2 X0")).toEqual([
      [0.5, "ZZ"],
      [0.2, "XI"],
    ]);
    expect(words("X0Y3")).toEqual([[1, "XIIY"]]);
    expect(words("X0 Y3 Z12")[0][1]).toBe("XIIYIIIIIIIIZ");
  });

  it("dense words use one letter per qubit, qubit 0 first", () => {
    const s = parsePauliSum("XIZY - 2*IIZZ");
    expect(s.numQubits).toBe(4);
    expect(s.denseLength).toBe(4);
    expect(s.terms[0]).toMatchObject({ word: "XIZY", xMask: 0b1001, zMask: 0b1100 });
    expect(s.terms[1]).toMatchObject({ coefficient: -2, word: "IIZZ" });
  });

  it("coefficients: decimal, exponent, leading dot, optional '*', signs", () => {
    expect(words("2.5 X0 - 1e-3 * Z1 + .5Y2 - 2E+2 Z0")).toEqual([
      [2.5, "XII"],
      [-0.001, "IZI"],
      [0.5, "IIY"],
      [-200, "ZII"],
    ]);
    expect(words("-X0")).toEqual([[-1, "X"]]);
    expect(words("+ 3 * Z0")).toEqual([[3, "Z"]]);
    expect(words("\u2212X0 \u2212 Z0")).toEqual([
      [-1, "X"],
      [-1, "Z"],
    ]);
    // a second sign directly before a number, as machine-written sums often have
    expect(words("X0 + -0.5 Z1 - -2 Z0")).toEqual([
      [1, "XI"],
      [-0.5, "IZ"],
      [2, "ZI"],
    ]);
  });

  it("'*' between factors, as written in papers and notes (e.g. H = −J Σ Z_i*Z_{i+1} − h Σ X_i)", () => {
    expect(words("0.5*Z0*Z1")).toEqual([[0.5, "ZZ"]]);
    expect(words("0.5 * X0 * Y2")).toEqual([[0.5, "XIY"]]);
    expect(words("-1.0*Z0*Z1 - 0.5*X0 + Z1*X2")).toEqual([
      [-1, "ZZI"],
      [-0.5, "XII"],
      [1, "IZX"],
    ]);
    expect(words("2 \u00d7 X0 \u00b7 Z1")).toEqual([[2, "XZ"]]);
    // the same operator as the space-separated text
    expect(parsePauliSum("0.25*X0*Y1*Z3 - 0.1*Z2").terms).toEqual(
      parsePauliSum("0.25 X0 Y1 Z3 - 0.1 Z2").terms,
    );
  });

  it("a bare number is a multiple of the identity; 'I' alone is the identity", () => {
    expect(words("1.5")).toEqual([[1.5, ""]]);
    expect(words("I")).toEqual([[1, ""]]);
    expect(words("2 I + 3 + Z0")).toEqual([
      [5, "I"],
      [1, "Z"],
    ]);
    // 'I' alone combines with dense words of any length
    expect(words("XZ + 0.5 I")).toEqual([
      [1, "XZ"],
      [0.5, "II"],
    ]);
  });

  it("repeated words are summed, cancelled words dropped", () => {
    expect(words("Z0 Z1 + 0.5 Z1 Z0 - 0.25 ZZ")).toEqual([[1.25, "ZZ"]]);
    expect(words("X0 - X0 + Y1")).toEqual([[1, "IY"]]);
    expect(words("X0 - X0")).toEqual([[0, "I"]]);
  });

  it("terms may span lines", () => {
    expect(words("0.5 Z0\n+ 0.25 X1\n\t- Y0")).toEqual([
      [0.5, "ZI"],
      [0.25, "IX"],
      [-1, "YI"],
    ]);
  });

  it("padPauliSum pads on the higher qubits and rejects qubits beyond the circuit", () => {
    const s = padPauliSum(parsePauliSum("X0 Z2"), 5);
    expect(s.terms[0].word).toBe("XIZII");
    expect(() => padPauliSum(parsePauliSum("Z5 + X0"), 4)).toThrow(
      "observable acts on qubit 5 but the circuit has 4 qubits",
    );
  });
});

describe("Pauli-sum errors: code, path, line, column, message", () => {
  const cases: [string, string, number, number, string | RegExp][] = [
    ["", "observable_syntax", 1, 1, /the observable is empty/],
    ["   \n ", "observable_syntax", 1, 1, /the observable is empty/],
    [
      "0.5j X1",
      "observable_invalid",
      1,
      1,
      'term 1 ("0.5j X1") has a complex coefficient 0.5j; a Pauli sum with non-real coefficients is not an observable',
    ],
    [
      "X0 +\n  2i Z1",
      "observable_invalid",
      2,
      3,
      /term 2 \("2i Z1"\) has a complex coefficient 2i/,
    ],
    ["NaN Z0", "observable_invalid", 1, 1, /"NaN" is not a finite real number/],
    ["Z0 + Infinity", "observable_invalid", 1, 6, /"Infinity" is not a finite real number/],
    ["1e400 Z0", "observable_invalid", 1, 1, /the coefficient 1e400 is not a finite number/],
    ["X0 Z0", "observable_invalid", 1, 4, /qubit 0 appears twice in one Pauli word/],
    ["X1Y1", "observable_invalid", 1, 1, /qubit 1 appears twice/],
    [
      "XZ + XYZ",
      "observable_invalid",
      1,
      6,
      'dense word "XYZ" has 3 letters but the earlier dense word "XZ" has 2; dense words need one letter per qubit',
    ],
    ["Z5 + XZ", "observable_invalid", 1, 1, /names qubit 5 but the dense words have 2 letters/],
    ["X0 +", "observable_syntax", 1, 5, 'expected a term after "+", found the end of the text'],
    ["2 3", "observable_syntax", 1, 3, 'missing "+" or "-" before "3"'],
    ["X0 * 2", "observable_syntax", 1, 4, /put the coefficient before the Pauli word/],
    ["2 * + X0", "observable_syntax", 1, 5, 'expected a Pauli word after "*", found "+"'],
    [
      "+ - X0",
      "observable_invalid",
      1,
      3,
      'two signs in a row before "X0"; write one "+" or "-" (a second sign may only stand directly before a number)',
    ],
    ["Z0 - - -0.5 X1", "observable_invalid", 1, 8, /two signs in a row before "0.5 X1"/],
    ["Z0 +", "observable_syntax", 1, 5, 'expected a term after "+", found the end of the text'],
    ["Z0 + * X1", "observable_syntax", 1, 6, 'expected a term after "+", found "*"'],
    ["XZ ZX", "observable_invalid", 1, 4, 'missing "+" or "-" between "XZ" and "ZX"'],
    ["Y1 Z", "observable_invalid", 1, 4, /mixes sparse factors \("Y1"\) with a dense word \("Z"\)/],
    ["XZ0", "observable_invalid", 1, 1, /mixes dense letters and qubit numbers/],
    [
      "x0 + Z1",
      "observable_invalid",
      1,
      1,
      'Pauli letters are upper-case (X, Y, Z, I): write "X0" instead of "x0"',
    ],
    ["0.5 foo", "observable_invalid", 1, 5, /unknown word "foo"/],
    [
      "(X0)",
      "observable_syntax",
      1,
      1,
      /unexpected character "\(" \(parentheses are not supported/,
    ],
    ["Z0 @ X1", "observable_syntax", 1, 4, 'unexpected character "@"'],
    ["X40", "observable_invalid", 1, 1, /qubit index 40 is too large/],
    // with '*' between factors the message still names the real problem
    [
      "0.5*Z0*",
      "observable_syntax",
      1,
      8,
      'expected a Pauli word after "*", found the end of the text',
    ],
    [
      "0.5*Z0*z1",
      "observable_invalid",
      1,
      8,
      'Pauli letters are upper-case (X, Y, Z, I): write "Z1" instead of "z1"',
    ],
    ["0.5*Z0*Z0", "observable_invalid", 1, 8, /qubit 0 appears twice in one Pauli word/],
    [
      "0.5*Z0*0.3*Z1",
      "observable_syntax",
      1,
      7,
      /a term has one coefficient; put the coefficient before the Pauli word/,
    ],
    ["0.5*Z0*+Z1", "observable_syntax", 1, 8, 'expected a Pauli word after "*", found "+"'],
    ["0.5*Z0*Z1j", "observable_invalid", 1, 8, /unknown word "Z1j"/],
  ];
  it.each(cases)("%j", (text, code, line, column, message) => {
    const e = errorOf(text);
    expect(e.code).toBe(code);
    expect(e.issues[0].path).toEqual(["observable", "terms"]);
    expect(e.issues[0].line).toBe(line);
    expect(e.issues[0].column).toBe(column);
    if (typeof message === "string") expect(e.message).toBe(message);
    else expect(e.message).toMatch(message);
    expect(e.issues[0].message).toBe(e.message);
  });
});

describe("robustness (fast-check)", () => {
  it("random strings never throw anything but EngineError", () => {
    const alphabet = fc.constantFrom(..."XYZIxyzij0123456789.eE+-*− \n\t()@_abNnfF".split(""));
    fc.assert(
      fc.property(fc.string({ unit: alphabet, maxLength: 40 }), (s) => {
        try {
          const r = parsePauliSum(s);
          for (const t of r.terms) expect(Number.isFinite(t.coefficient)).toBe(true);
        } catch (e) {
          expect(e).toBeInstanceOf(EngineError);
        }
      }),
      { numRuns: 3000, seed: 20240611 },
    );
  });

  it("arbitrary unicode never throws anything but EngineError", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 30 }), (s) => {
        try {
          parsePauliSum(s);
        } catch (e) {
          expect(e).toBeInstanceOf(EngineError);
        }
      }),
      { numRuns: 2000, seed: 7 },
    );
  });
});
