/**
 * Generators (fast-check) of hostile input for the parsers and the API:
 * OpenQASM programs (a valid header, then a mix of well-formed gate lines,
 * loops, definitions and token garbage), Pauli-sum texts (terms with odd
 * numbers, indices, dense words and garbage) and JSON bodies (random JSON,
 * and valid run requests with one part swapped for random JSON).
 */
import fc from "fast-check";

const GATES_1Q = ["h", "x", "y", "z", "s", "sdg", "t", "tdg", "id"];
const GATES_P = ["rx", "ry", "rz", "u1", "p"];
const GATES_2Q = ["cx", "cz", "swap", "cy"];
const JUNK = [
  "(",
  ")",
  "[",
  "]",
  "{",
  "}",
  ";",
  ",",
  "->",
  "==",
  "pi",
  "π",
  "1e309",
  "-0",
  "NaN",
  "@",
  "ctrl",
  "inv",
  "//",
  "/*",
  "\u0000",
  "\u202e",
  "q[99999999]",
  "gate",
  "measure",
  "reset",
  "if(c==1)",
];

const angle = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map((x) => x.toString()),
  fc.constantFrom("pi", "pi/2", "-pi/4", "2*pi", "theta", "sin(0.3)", "1e-300", "(((pi)))"),
);

function qasmLine(n: number): fc.Arbitrary<string> {
  const q = fc.nat({ max: n + 1 }).map((i) => `q[${i}]`);
  return fc.oneof(
    {
      weight: 4,
      arbitrary: fc.tuple(fc.constantFrom(...GATES_1Q), q).map(([g, a]) => `${g} ${a};`),
    },
    {
      weight: 3,
      arbitrary: fc
        .tuple(fc.constantFrom(...GATES_P), angle, q)
        .map(([g, t, a]) => `${g}(${t}) ${a};`),
    },
    {
      weight: 3,
      arbitrary: fc.tuple(fc.constantFrom(...GATES_2Q), q, q).map(([g, a, b]) => `${g} ${a},${b};`),
    },
    {
      weight: 1,
      arbitrary: fc.constantFrom("h q;", "barrier q;", "measure q -> c;", "reset q[0];"),
    },
    {
      weight: 1,
      arbitrary: fc.array(fc.constantFrom(...JUNK), { maxLength: 6 }).map((t) => t.join(" ")),
    },
    { weight: 1, arbitrary: fc.string({ maxLength: 12 }) },
  );
}

/** An OpenQASM 2.0 or 3 program: a header, registers, then up to 40 lines. */
export const qasmProgram: fc.Arbitrary<{ format: "qasm2" | "qasm3"; source: string }> = fc
  .tuple(
    fc.constantFrom("qasm2" as const, "qasm3" as const),
    fc.integer({ min: 1, max: 6 }),
    fc.boolean(),
  )
  .chain(([format, n, header]) =>
    fc.array(qasmLine(n), { maxLength: 40 }).map((lines) => {
      const head =
        format === "qasm2"
          ? ["OPENQASM 2.0;", 'include "qelib1.inc";', `qreg q[${n}];`, `creg c[${n}];`]
          : [
              "OPENQASM 3.0;",
              'include "stdgates.inc";',
              `qubit[${n}] q;`,
              `bit[${n}] c;`,
              "input float[64] theta;",
            ];
      return { format, source: [...(header ? head : head.slice(1)), ...lines].join("\n") };
    }),
  );

const coefficient = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map((x) => x.toString()),
  fc.constantFrom("", "1e309", "-1e-320", "0.5j", "1/2", "--1", "+", "*", ".", "1e", "0x10"),
);
const sparseWord = fc
  .array(
    fc.tuple(
      fc.constantFrom("X", "Y", "Z", "I", "x", "W"),
      fc.oneof(fc.nat({ max: 8 }), fc.constantFrom(29, 30, 99999)),
    ),
    { minLength: 1, maxLength: 5 },
  )
  .map((ps) => ps.map(([p, i]) => `${p}${i}`).join(" "));
const denseWord = fc
  .array(fc.constantFrom("I", "X", "Y", "Z"), { minLength: 1, maxLength: 8 })
  .map((a) => a.join(""));

/** A Pauli-sum text of up to 12 terms, with garbage now and then. */
export const pauliText: fc.Arbitrary<string> = fc
  .array(
    fc.oneof(
      {
        weight: 6,
        arbitrary: fc
          .tuple(coefficient, fc.constantFrom(" ", "*", " * ", ""), fc.oneof(sparseWord, denseWord))
          .map(([c, s, w]) => `${c}${s}${w}`),
      },
      { weight: 1, arbitrary: coefficient },
      { weight: 1, arbitrary: fc.string({ maxLength: 10 }) },
    ),
    { minLength: 0, maxLength: 12 },
  )
  .chain((terms) =>
    fc
      .array(fc.constantFrom(" + ", " - ", "+", "-", " ++ ", " "), {
        minLength: terms.length,
        maxLength: terms.length,
      })
      .map((ops) => terms.map((t, i) => (i ? ops[i] : "") + t).join("")),
  );

const BELL = {
  format: "qasm2",
  source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n',
};

/** A valid-looking run request built from the generators above. */
export const runRequest = fc.record(
  {
    circuit: qasmProgram,
    observable: fc.oneof(
      pauliText.map((terms) => ({ format: "pauli", terms })),
      fc
        .array(
          fc.array(fc.double({ noNaN: true, min: -2, max: 2 }), { minLength: 1, maxLength: 4 }),
          { minLength: 1, maxLength: 4 },
        )
        .map((real) => ({ format: "matrix", real })),
    ),
    method: fc.constantFrom("statevector", "density_matrix"),
    shots: fc.oneof(fc.nat({ max: 5000 }), fc.constant(-1), fc.constant(1.5)),
    seed: fc.nat(),
    targetPrecision: fc.oneof(fc.double({ min: 1e-4, max: 1, noNaN: true }), fc.constant(0)),
    parameters: fc.dictionary(
      fc.constantFrom("theta", "phi", "x"),
      fc.double({ noNaN: true, min: -10, max: 10 }),
      { maxKeys: 2 },
    ),
    sweep: fc.dictionary(
      fc.constantFrom("theta", "phi"),
      fc.array(fc.double({ noNaN: true, min: -3, max: 3 }), { maxLength: 5 }),
      { maxKeys: 1 },
    ),
  },
  { requiredKeys: ["circuit", "observable"] },
);

/** JSON bodies: random JSON, valid requests, and valid requests with one part swapped for random JSON. */
export const jsonBody: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 4 }) },
  { weight: 3, arbitrary: runRequest },
  {
    weight: 2,
    arbitrary: fc
      .tuple(
        runRequest,
        fc.constantFrom(
          "circuit",
          "observable",
          "method",
          "shots",
          "seed",
          "sweep",
          "name",
          "noise",
          "points",
          "gradient",
          "__proto__",
          "circuit.source",
        ),
        fc.jsonValue({ maxDepth: 3 }),
      )
      .map(([req, key, value]) => {
        const body: Record<string, unknown> = { ...req };
        if (key === "circuit.source") body.circuit = { ...BELL, source: value };
        else body[key] = value;
        return body;
      }),
  },
);
