/**
 * Observables as data ({ format: "terms" }): the same observable as Pauli-sum text gives
 * the same results (seeded shots included), and every bad entry is refused with the
 * Pauli-text rule's message at observable.terms[i].pauli / .coefficient. Reference
 * values: the Bell state's ⟨ZZ⟩ = ⟨XX⟩ = 1, ⟨YY⟩ = −1 (textbook values).
 */
import { describe, expect, it } from "vitest";
import {
  EngineError,
  estimate,
  estimateRequestSchema,
  parsePauliSum,
  parsePauliTerms,
  pauliTermsToText,
} from "@/lib/quantum";

const BELL = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[3];\nh q[0];\ncx q[0],q[1];\n';
const circuit = { format: "qasm2" as const, source: BELL };

async function issueOf(terms: unknown): Promise<EngineError> {
  try {
    await estimate({ circuit, observable: { format: "terms", terms } as never });
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

describe("term-list observables", () => {
  it("equal the Pauli-text observable: exact values, terms and seeded shots", async () => {
    const list = [
      { coefficient: 0.5, pauli: "Z0 Z1" },
      { coefficient: -1.5, pauli: "YYI" },
      { coefficient: 2, pauli: "X0X1" },
      { coefficient: 0.25, pauli: "I" },
      { coefficient: 1, pauli: "Z0 Z1" },
    ];
    const a = await estimate({
      circuit,
      observable: { format: "terms", terms: list },
      shots: 3000,
      seed: 11,
    });
    const b = await estimate({
      circuit,
      observable: { format: "pauli", terms: "1.5 Z0 Z1 - 1.5 YYI + 2 X0 X1 + 0.25" },
      shots: 3000,
      seed: 11,
    });
    expect(a.exact.value).toBeCloseTo(1.5 + 1.5 + 2 + 0.25, 12);
    expect(a.exact.value).toBe(b.exact.value);
    expect(a.sampled).toEqual(b.sampled);
    expect(a.terms.map((t) => [t.pauli, t.coefficient])).toEqual(
      b.terms.map((t) => [t.pauli, t.coefficient]),
    );
  });

  it("the parser itself refuses shapes the schema would (direct engine callers)", () => {
    expect(() => parsePauliTerms([{ coefficient: Number.NaN, pauli: "Z0" }])).toThrow(
      "observable.terms[0].coefficient must be a finite real number",
    );
    expect(() => parsePauliTerms("Z0")).toThrow("observable.terms must be a non-empty list");
  });

  it("pauliTermsToText gives text with the same words and numbers", () => {
    const list = [
      { coefficient: -0.1, pauli: "X0 Z3" },
      { coefficient: 1e-7, pauli: "Y1" },
      { coefficient: 3, pauli: "ZIII" },
    ];
    const text = parsePauliSum(pauliTermsToText(list));
    const terms = parsePauliTerms(list);
    expect(text.terms).toEqual(terms.terms);
  });

  it("is accepted by the request schema and refused there when malformed", () => {
    const base = {
      circuit,
      observable: { format: "terms", terms: [{ coefficient: 1, pauli: "Z0" }] },
    };
    expect(estimateRequestSchema.safeParse(base).success).toBe(true);
    const bad = estimateRequestSchema.safeParse({
      ...base,
      observable: { format: "terms", terms: [{ coefficient: "1", pauli: "Z0" }] },
    });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(["observable", "terms", 0, "coefficient"]);
    expect(
      estimateRequestSchema.safeParse({ ...base, observable: { format: "terms", terms: [] } })
        .success,
    ).toBe(false);
  });

  const CASES: [string, unknown, (string | number)[], string][] = [
    [
      "qubit twice",
      [
        { coefficient: 1, pauli: "Z0" },
        { coefficient: 1, pauli: "X0 X0" },
      ],
      ["observable", "terms", 1, "pauli"],
      "qubit 0 appears twice in one Pauli word",
    ],
    [
      "lower-case letters",
      [{ coefficient: 1, pauli: "x0" }],
      ["observable", "terms", 0, "pauli"],
      'Pauli letters are upper-case (X, Y, Z, I): write "X0" instead of "x0"',
    ],
    [
      "a coefficient in the word",
      [{ coefficient: 1, pauli: "2 X0" }],
      ["observable", "terms", 0, "pauli"],
      "must be one Pauli word",
    ],
    [
      "two words",
      [{ coefficient: 1, pauli: "X0 + Z1" }],
      ["observable", "terms", 0, "pauli"],
      "must be one Pauli word",
    ],
    [
      "mixed dense and sparse",
      [{ coefficient: 1, pauli: "XZ Y3" }],
      ["observable", "terms", 0, "pauli"],
      "mixes a dense word",
    ],
    [
      "dense lengths disagree",
      [
        { coefficient: 1, pauli: "XZI" },
        { coefficient: 1, pauli: "ZZ" },
      ],
      ["observable", "terms", 1, "pauli"],
      'dense word "ZZ" has 2 letters but the earlier dense word (terms[0]) has 3',
    ],
    [
      "dense word longer than the circuit",
      [{ coefficient: 1, pauli: "XZIZ" }],
      ["observable", "terms", 0, "pauli"],
      "they have 4 letters but the circuit has 3 qubits",
    ],
    [
      "qubit beyond the circuit",
      [
        { coefficient: 1, pauli: "Z0" },
        { coefficient: 2, pauli: "X7" },
      ],
      ["observable", "terms", 1, "pauli"],
      "observable acts on qubit 7 but the circuit has 3 qubits",
    ],
    [
      "non-finite coefficient",
      [{ coefficient: Number.POSITIVE_INFINITY, pauli: "Z0" }],
      ["observable", "terms", 0, "coefficient"],
      "must be a finite real number",
    ],
    ["not a list", "Z0", ["observable", "terms"], "must be a non-empty list"],
  ];
  for (const [name, terms, path, message] of CASES) {
    it(`refuses ${name} at ${path.join(".")}`, async () => {
      const e = await issueOf(terms);
      // Shape problems are caught by the request schema (invalid_request), word problems by the parser.
      expect(e.code).toBe(
        typeof terms === "string" || name.startsWith("non-finite")
          ? "invalid_request"
          : "observable_invalid",
      );
      expect(e.issues[0].path).toEqual(path);
      if (e.code === "observable_invalid") expect(e.issues[0].message).toContain(message);
    });
  }
});
