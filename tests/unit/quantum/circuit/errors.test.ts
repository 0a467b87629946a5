/**
 * Every rejected program gives an EngineError with the right code, a message saying what
 * was expected, and the 1-based line/column of the culprit, at ["circuit", "source"].
 * What counts as an error follows the OpenQASM 2.0 paper (arXiv:1707.03429 §3: only U
 * and CX without the include, broadcast sizes, declaration before use) and Ketwise's
 * documented OpenQASM 3 subset (DEVELOPERS.md, "Circuits").
 */
import { describe, expect, it } from "vitest";
import { parseProgram } from "@/lib/quantum/circuit";
import { EngineError } from "@/lib/quantum/errors";

const H2 = 'OPENQASM 2.0;\ninclude "qelib1.inc";\n';
const H3 = 'OPENQASM 3.0;\ninclude "stdgates.inc";\n';

type Case = [
  name: string,
  format: "qasm2" | "qasm3",
  source: string,
  code: string,
  message: string,
  line: number,
  column: number,
];

const CASES: Case[] = [
  [
    "missing semicolon",
    "qasm2",
    H2 + "qreg q[2]\nh q[0];\n",
    "qasm_syntax",
    "expected ';' after ']' but found 'h'",
    3,
    10,
  ],
  [
    "program ends mid-statement",
    "qasm2",
    H2 + "qreg q[1];\nh q[0]",
    "qasm_syntax",
    "expected ';' after ']' but the program ended",
    4,
    7,
  ],
  [
    "stray character",
    "qasm2",
    H2 + "qreg q[1];\nh q[0];\n@",
    "qasm_syntax",
    "unexpected character '@'",
    5,
    1,
  ],
  [
    "missing header",
    "qasm2",
    "qreg q[1];\n",
    "qasm_syntax",
    "an OpenQASM 2.0 program must start with 'OPENQASM 2.0;'",
    1,
    1,
  ],
  [
    "unknown gate",
    "qasm2",
    H2 + "qreg q[2];\nfoo q[0];\n",
    "qasm_semantic",
    "unknown gate 'foo'",
    4,
    1,
  ],
  [
    "standard gate without the include",
    "qasm2",
    "OPENQASM 2.0;\nqreg q[1];\nh q[0];\n",
    "qasm_semantic",
    "unknown gate 'h' (it is defined in qelib1.inc: add 'include \"qelib1.inc\";')",
    3,
    1,
  ],
  [
    "parameter count",
    "qasm2",
    H2 + "qreg q[2];\nrx(0.1, 0.2) q[0];\n",
    "qasm_semantic",
    "gate 'rx' takes 1 parameter, got 2",
    4,
    1,
  ],
  [
    "qubit count",
    "qasm2",
    H2 + "qreg q[2];\ncx q[0];\n",
    "qasm_semantic",
    "gate 'cx' acts on 2 qubits, got 1",
    4,
    1,
  ],
  [
    "index out of range",
    "qasm2",
    H2 + "qreg q[3];\nx q[5];\n",
    "qasm_semantic",
    "qubit q[5] out of range: register q has 3 qubits",
    4,
    3,
  ],
  [
    "qubit twice",
    "qasm2",
    H2 + "qreg q[3];\ncx q[0], q[0];\n",
    "qasm_semantic",
    "qubit q[0] used twice in one gate",
    4,
    10,
  ],
  [
    "qubit twice through broadcasting",
    "qasm2",
    H2 + "qreg q[3];\ncx q[1], q;\n",
    "qasm_semantic",
    "qubit q[1] used twice in one gate",
    4,
    10,
  ],
  [
    "undefined register",
    "qasm2",
    H2 + "qreg q[3];\nh r[0];\n",
    "qasm_semantic",
    "undefined quantum register 'r'",
    4,
    3,
  ],
  [
    "classical register as qubit",
    "qasm2",
    H2 + "creg c[1];\nqreg q[1];\nh c[0];\n",
    "qasm_semantic",
    "'c' is a classical register; a qubit or quantum register is expected here",
    5,
    3,
  ],
  [
    "broadcast sizes",
    "qasm2",
    H2 + "qreg a[2];\nqreg b[3];\ncx a, b;\n",
    "qasm_semantic",
    "registers in one gate call must have the same size: a has 2 qubits, b has 3 qubits",
    5,
    7,
  ],
  [
    "measure sizes",
    "qasm2",
    H2 + "qreg q[2];\ncreg c[3];\nmeasure q -> c;\n",
    "qasm_semantic",
    "measure needs a qubit and a bit, or two registers of the same size: q has 2 qubits, c has 3 bits",
    5,
    14,
  ],
  [
    "undefined parameter in a gate body",
    "qasm2",
    H2 + "gate g(a) x { rx(b) x; }\n",
    "qasm_semantic",
    "undefined parameter 'b' in gate 'g' (parameters: a)",
    3,
    18,
  ],
  [
    "name in a top-level OpenQASM 2.0 expression",
    "qasm2",
    H2 + "qreg q[1];\nrx(theta) q[0];\n",
    "qasm_semantic",
    "undefined name 'theta': OpenQASM 2.0 gate parameters outside a gate definition must be numbers, 'pi' or functions of them",
    4,
    4,
  ],
  [
    "division by zero",
    "qasm2",
    H2 + "qreg q[1];\nrx(0.5 + 1/0) q[0];\n",
    "qasm_semantic",
    "expression '1/0' does not evaluate to a finite number (Infinity)",
    4,
    10,
  ],
  [
    "square root of a negative number",
    "qasm2",
    H2 + "qreg q[1];\nrx(sqrt(-1)) q[0];\n",
    "qasm_semantic",
    "expression 'sqrt(-1)' does not evaluate to a finite number (NaN)",
    4,
    4,
  ],
  [
    "function arity",
    "qasm2",
    H2 + "qreg q[1];\nrx(sin(1, 2)) q[0];\n",
    "qasm_semantic",
    "function 'sin' takes 1 argument, got 2",
    4,
    4,
  ],
  [
    "unknown function",
    "qasm2",
    H2 + "qreg q[1];\nrx(foo(1)) q[0];\n",
    "qasm_semantic",
    "unknown function 'foo' (available: sin, cos, tan, exp, ln, sqrt)",
    4,
    4,
  ],
  [
    "opaque gate used",
    "qasm2",
    H2 + "opaque magic(a) x;\nqreg q[1];\nmagic(0.1) q[0];\n",
    "qasm_semantic",
    "gate 'magic' is opaque: it has no definition, so it cannot be simulated",
    5,
    1,
  ],
  [
    "classical control",
    "qasm2",
    H2 + "qreg q[1];\ncreg c[1];\nmeasure q -> c;\nif(c==1) x q[0];\n",
    "qasm_semantic",
    "classically controlled gates are not supported ('if')",
    6,
    1,
  ],
  [
    "redefining a qelib1.inc gate",
    "qasm2",
    H2 + "gate h a { U(0,0,0) a; }\n",
    "qasm_semantic",
    "gate 'h' is already defined (qelib1.inc)",
    3,
    6,
  ],
  [
    "indexed qubit in a gate body",
    "qasm2",
    H2 + "gate g a, b { cx a[0], b; }\n",
    "qasm_semantic",
    "inside a gate body, qubits are referred to by argument name only ('a', not 'a[0]')",
    3,
    18,
  ],
  [
    "qubit argument twice in a gate body",
    "qasm2",
    H2 + "gate g a, b { cx a, a; }\n",
    "qasm_semantic",
    "qubit argument 'a' used twice in one gate",
    3,
    21,
  ],
  [
    "other include file",
    "qasm2",
    H2 + 'include "other.inc";\n',
    "qasm_semantic",
    "cannot include 'other.inc': only \"qelib1.inc\" is available in OpenQASM 2.0 (no files are read)",
    3,
    1,
  ],
  [
    "empty register",
    "qasm2",
    H2 + "qreg q[0];\n",
    "qasm_semantic",
    "register 'q' must have at least 1 qubit",
    3,
    8,
  ],
  // 10^30 written out: the real problem is "too many", not "fewer than one"
  [
    "register of 10^30 qubits",
    "qasm2",
    H2 + "qreg q[1000000000000000000000000000000];\n",
    "too_large",
    "register 'q' declares 1,000,000,000,000,000,000,000,000,000,000 qubits: too many; a circuit may declare at most 1024 (simulation handles at most 26 qubits with the statevector method, 12 with the density matrix)",
    3,
    8,
  ],
  [
    "register of 10^30 qubits written as a power",
    "qasm2",
    H2 + "qreg q[10^30];\n",
    "too_large",
    "register 'q' declares 1,000,000,000,000,000,000,000,000,000,000 qubits: too many; a circuit may declare at most 1024 (simulation handles at most 26 qubits with the statevector method, 12 with the density matrix)",
    3,
    8,
  ],
  [
    "OpenQASM 2.0 register size as an expression",
    "qasm2",
    H2 + "qreg q[2^3];\n",
    "qasm_syntax",
    "the size of register 'q' must be an integer literal in OpenQASM 2.0 (write 8)",
    3,
    8,
  ],
  [
    "OpenQASM 3 register of 10^30 qubits",
    "qasm3",
    H3 + "qubit[1000000000000000000000000000000] q;\n",
    "too_large",
    "register 'q' declares 1,000,000,000,000,000,000,000,000,000,000 qubits: too many; a circuit may declare at most 1024 (simulation handles at most 26 qubits with the statevector method, 12 with the density matrix)",
    3,
    7,
  ],
  [
    "OpenQASM 3 power operator in 2.0",
    "qasm2",
    H2 + "qreg q[1];\nrx(2**2) q[0];\n",
    "qasm_semantic",
    "'**' is not OpenQASM 2.0; use '^' for powers",
    4,
    4,
  ],
  [
    "OpenQASM 3 assignment in 2.0",
    "qasm2",
    H2 + "qreg q[1];\ncreg c[1];\nc = measure q;\n",
    "qasm_semantic",
    "'c = measure q;' is OpenQASM 3; in OpenQASM 2.0 write 'measure q -> c;'",
    5,
    1,
  ],
  [
    "version mismatch",
    "qasm2",
    "OPENQASM 3.0;\nqreg q[1];\n",
    "qasm_semantic",
    "this program declares OpenQASM 3.0; choose the qasm3 format",
    1,
    1,
  ],
  [
    "while loop",
    "qasm3",
    H3 + "qubit[2] q;\nwhile (true) { h q[0]; }\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: 'while' (classical control flow)",
    4,
    1,
  ],
  [
    "loop over a huge range",
    "qasm3",
    H3 + "qubit[2] q;\nfor int i in [0:1000000000] { h q[0]; }\n",
    "too_large",
    "the loops of this program run more than 10000 iterations in total (at most 10000 are accepted)",
    4,
    14,
  ],
  [
    "loop index out of range",
    "qasm3",
    H3 + "qubit[2] q;\nfor int i in [0:2] { h q[i]; }\n",
    "qasm_semantic",
    "qubit q[2] out of range: register q has 2 qubits",
    4,
    24,
  ],
  [
    "loop range from an input",
    "qasm3",
    H3 + "input float t;\nqubit[2] q;\nfor int i in [0:t] { h q[0]; }\n",
    "qasm_semantic",
    "the end of the loop range must be known before the run: 't' depends on an input",
    5,
    17,
  ],
  [
    "constant from an input",
    "qasm3",
    H3 + "input float t;\nconst float a = 2*t;\n",
    "qasm_semantic",
    "the value of constant 'a' must be known before the run: '2*t' depends on an input",
    4,
    17,
  ],
  [
    "non-integer int constant",
    "qasm3",
    H3 + "const int n = 1.5;\n",
    "qasm_semantic",
    "the value of int constant 'n' must be an integer, got 1.5",
    3,
    15,
  ],
  [
    "if statement",
    "qasm3",
    H3 + "qubit[1] q;\nbit c;\nif (c) x q[0];\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: 'if' (classical control flow)",
    5,
    1,
  ],
  [
    "non-integer power of a gate",
    "qasm3",
    H3 + "qubit[2] q;\npow(0.5) @ x q[0];\n",
    "qasm_semantic",
    "the exponent of 'pow(k) @' must be an integer, got 0.5: only integer powers of gates are supported",
    4,
    5,
  ],
  [
    "power from an input",
    "qasm3",
    H3 + "input float k;\nqubit[2] q;\npow(k) @ x q[0];\n",
    "qasm_semantic",
    "the exponent of 'pow(k) @' must be an integer known before the run (it cannot depend on an input or a gate parameter)",
    5,
    5,
  ],
  [
    "control count",
    "qasm3",
    H3 + "qubit[2] q;\nctrl @ x q[0];\n",
    "qasm_semantic",
    "the modified gate 'x' acts on 2 qubits (1 control + 1), got 1",
    4,
    8,
  ],
  [
    "too many controls",
    "qasm3",
    H3 + "qubit[12] q;\nctrl(9) @ x q[0], q[1], q[2], q[3], q[4], q[5], q[6], q[7], q[8], q[9];\n",
    "too_large",
    "'ctrl(9) @': a gate may act on at most 8 qubits",
    4,
    1,
  ],
  [
    "unknown modifier",
    "qasm3",
    H3 + "qubit[2] q;\nsqrt @ x q[0];\n",
    "qasm_semantic",
    "unknown gate modifier 'sqrt' (the modifiers are ctrl, negctrl, inv and pow(k))",
    4,
    1,
  ],
  [
    "negative control count",
    "qasm3",
    H3 + "qubit[2] q;\nctrl(0) @ x q[0];\n",
    "qasm_semantic",
    "'ctrl(0) @' needs at least one control qubit",
    4,
    6,
  ],
  [
    "classical variable",
    "qasm3",
    H3 + "qubit[2] q;\nint n = 3;\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: classical variables ('int'); declare a constant with 'const int name = …;'",
    4,
    1,
  ],
  [
    "register slice",
    "qasm3",
    H3 + "qubit[2] q;\nh q[0:1];\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: register slices (q[a:b])",
    4,
    6,
  ],
  [
    "integer input",
    "qasm3",
    H3 + "input int n;\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: input of type 'int' (inputs must be 'float' or 'angle')",
    3,
    7,
  ],
  [
    "XOR operator",
    "qasm3",
    H3 + "qubit[1] q;\nrx(2^2) q[0];\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: '^' (bitwise XOR on integers); use '**' for powers",
    4,
    4,
  ],
  [
    "undeclared input",
    "qasm3",
    H3 + "qubit[1] q;\nrx(theta) q[0];\n",
    "qasm_semantic",
    "undefined parameter 'theta' (declare it with 'input float theta;' before use)",
    4,
    4,
  ],
  [
    "stdgates without the include",
    "qasm3",
    "OPENQASM 3.0;\nqubit[1] q;\nh q[0];\n",
    "qasm_semantic",
    "unknown gate 'h' (it is defined in stdgates.inc: add 'include \"stdgates.inc\";')",
    3,
    1,
  ],
  [
    "physical qubit",
    "qasm3",
    H3 + "x $0;\n",
    "qasm_semantic",
    "not supported in Ketwise's OpenQASM 3 subset: physical qubits ('$0'); declare 'qubit[n] q;' and use q[i]",
    3,
    3,
  ],
];

describe("parse errors carry code, message and position", () => {
  it.each(CASES)("%s", (_name, format, source, code, message, line, column) => {
    let error: unknown;
    try {
      parseProgram(format, source);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(EngineError);
    const e = error as EngineError;
    expect(e.code).toBe(code);
    expect(e.issues).toEqual([{ path: ["circuit", "source"], message, line, column }]);
    expect(e.message).toBe(`${message} (line ${line}, column ${column})`);
  });
});

describe("bind errors name the parameter or the expression", () => {
  const program = parseProgram(
    "qasm3",
    H3 + "input float x;\ninput angle y;\nqubit[1] q;\nrx(1/x) q[0];\nry(y) q[0];\n",
  );

  it.each([
    ["missing value", { x: 1 }, "missing value for parameter 'y'", "y"],
    [
      "unknown name",
      { x: 1, y: 2, z: 3 },
      "unknown parameter 'z' (the circuit declares: x, y)",
      "z",
    ],
    ["NaN", { x: Number.NaN, y: 0 }, "parameter 'x' must be a finite number, got NaN", "x"],
    [
      "Infinity",
      { x: 1, y: Number.POSITIVE_INFINITY },
      "parameter 'y' must be a finite number, got Infinity",
      "y",
    ],
    ["not a number", { x: "1", y: 0 }, "parameter 'x' must be a finite number, got 1", "x"],
  ])("%s", (_name, params, message, name) => {
    expect(() => program.bind(params as unknown as Record<string, number>)).toThrow(
      expect.objectContaining({
        code: "invalid_request",
        message,
        issues: [{ path: ["parameters", name], message }],
      }),
    );
  });

  it("a non-finite value of an input-dependent expression names the expression (x = 0 in 1/x)", () => {
    expect(() => program.bind({ x: 0, y: 0 })).toThrow(
      expect.objectContaining({
        code: "qasm_semantic",
        issues: [
          {
            path: ["circuit", "source"],
            message:
              "expression '1/x' does not evaluate to a finite number (Infinity) for the given parameter values",
            line: 6,
            column: 4,
          },
        ],
      }),
    );
  });

  it("rejects a format other than qasm2/qasm3", () => {
    expect(() => parseProgram("qasm4" as "qasm2", "")).toThrow(
      expect.objectContaining({ code: "invalid_request" }),
    );
  });
});
