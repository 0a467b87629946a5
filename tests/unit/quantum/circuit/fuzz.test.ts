/**
 * Property tests (fast-check): whatever text arrives, the circuit front end answers
 * with a program or an EngineError — never another exception (common practice for
 * parsers facing untrusted input). Inputs: random strings, random token soups and
 * random mutations of valid programs.
 */
import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { circuitStats, measurementCircuitQasm, parseProgram } from "@/lib/quantum/circuit";
import { isEngineError } from "@/lib/quantum/errors";

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/qasm/${name}`, import.meta.url), "utf8");
const VALID: ["qasm2" | "qasm3", string][] = [
  ["qasm2", fixture("two-registers.qasm")],
  ["qasm3", fixture("parametrised.qasm3")],
];

/** Runs the whole front end; returns "ok" or the error code, rethrows anything else. */
function exercise(format: "qasm2" | "qasm3", source: string): string {
  try {
    const program = parseProgram(format, source);
    const circuit = program.bind(Object.fromEntries(program.inputs.map((i) => [i.name, 0.5])));
    circuitStats(circuit);
    measurementCircuitQasm(
      program,
      Object.fromEntries(program.inputs.map((i) => [i.name, 0.5])),
      "Z".repeat(program.numQubits),
    );
    return "ok";
  } catch (e) {
    if (isEngineError(e)) {
      // Every circuit problem points somewhere sensible in the source.
      for (const issue of e.issues) {
        if (issue.line !== undefined) expect(issue.line).toBeGreaterThanOrEqual(1);
        if (issue.column !== undefined) expect(issue.column).toBeGreaterThanOrEqual(1);
      }
      return e.code;
    }
    throw e;
  }
}

const TOKENS = [
  "OPENQASM",
  "2.0",
  "3.0",
  "3",
  "include",
  '"qelib1.inc"',
  '"stdgates.inc"',
  "qreg",
  "creg",
  "qubit",
  "bit",
  "input",
  "float",
  "angle",
  "gate",
  "opaque",
  "barrier",
  "measure",
  "reset",
  "if",
  "for",
  "ctrl",
  "@",
  "U",
  "CX",
  "h",
  "cx",
  "rx",
  "cu3",
  "ccx",
  "swap",
  "g",
  "q",
  "c",
  "a",
  "theta",
  "pi",
  "π",
  "sin",
  "ln",
  "sqrt",
  "0",
  "1",
  "7",
  "0.5",
  "1e3",
  ".5",
  "(",
  ")",
  "[",
  "]",
  "{",
  "}",
  ";",
  ",",
  "->",
  "=",
  "==",
  "+",
  "-",
  "*",
  "/",
  "^",
  "**",
  ":",
  "$0",
  "//",
  "/*",
  "*/",
  "\n",
  "#pragma x",
];

const tokenSoup = fc.array(fc.constantFrom(...TOKENS), { maxLength: 60 }).map((t) => t.join(" "));

/** A random edit of a valid program: delete, duplicate, insert a token or a character. */
const mutation = fc.tuple(
  fc.constantFrom(...VALID),
  fc.array(
    fc.tuple(
      fc.nat(),
      fc.nat({ max: 40 }),
      fc.constantFrom("delete", "duplicate", "token", "char"),
      fc.constantFrom(...TOKENS),
      fc.string({ maxLength: 1 }),
    ),
    { minLength: 1, maxLength: 4 },
  ),
);

function mutate(source: string, edits: [number, number, string, string, string][]): string {
  let s = source;
  for (const [at, len, kind, token, ch] of edits) {
    const i = at % (s.length + 1);
    if (kind === "delete") s = s.slice(0, i) + s.slice(i + len);
    else if (kind === "duplicate") s = s.slice(0, i) + s.slice(i, i + len) + s.slice(i);
    else if (kind === "token") s = `${s.slice(0, i)} ${token} ${s.slice(i)}`;
    else s = s.slice(0, i) + ch + s.slice(i + 1);
  }
  return s;
}

describe("parseProgram never throws anything but an EngineError", () => {
  it("on random strings", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("qasm2" as const, "qasm3" as const),
        fc.string({ unit: "binary", maxLength: 200 }),
        (format, s) => {
          exercise(format, s);
        },
      ),
      { numRuns: 200, seed: 1 },
    );
  });

  it("on random token sequences", () => {
    fc.assert(
      fc.property(fc.constantFrom("qasm2" as const, "qasm3" as const), tokenSoup, (format, s) => {
        exercise(format, `OPENQASM ${format === "qasm2" ? "2.0" : "3.0"};\n${s}`);
      }),
      { numRuns: 300, seed: 2 },
    );
  });

  it("on random mutations of valid programs", () => {
    const codes = new Set<string>();
    fc.assert(
      fc.property(mutation, ([[format, source], edits]) => {
        codes.add(exercise(format, mutate(source, edits)));
      }),
      { numRuns: 300, seed: 3 },
    );
    // The mutations reach both the syntax and the semantic checks (and some stay valid).
    expect(codes.has("qasm_syntax")).toBe(true);
    expect(codes.has("qasm_semantic")).toBe(true);
  });

  it("on pathological nesting", () => {
    expect(
      exercise(
        "qasm2",
        `OPENQASM 2.0;\nqreg q[1];\nU(${"(".repeat(20000)}1${")".repeat(20000)},0,0) q[0];`,
      ),
    ).toMatch(/^(ok|qasm_syntax)$/);
    expect(
      exercise("qasm2", `OPENQASM 2.0;\nqreg q[1];\nU(${"-".repeat(20000)}1,0,0) q[0];`),
    ).toMatch(/^(ok|qasm_syntax)$/);
  });
});
