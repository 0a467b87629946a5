/**
 * circuitOutline: the diagram's data from a parsed program. Expected operations are
 * read off the OpenQASM programs below (one top-level operation per statement; a call
 * of a user gate is one operation); the 0 placeholder is the project's own convention.
 */
import { describe, expect, it } from "vitest";
import { circuitOutline, parseProgram } from "@/lib/quantum";

const PROGRAM = [
  "OPENQASM 3.0;",
  'include "stdgates.inc";',
  "input float a;",
  "input angle b;",
  "gate pair(t) x, y { rx(t) x; cx x, y; }",
  "qubit[2] q;",
  "qubit[1] anc;",
  "bit[1] c;",
  "pair(a) q[0], q[1];",
  "barrier q;",
  "ry(b) anc[0];",
  "reset q[1];",
  "c[0] = measure anc[0];",
].join("\n");

describe("circuitOutline", () => {
  it("labels the qubits, lists the inputs and binds the given values", () => {
    const outline = circuitOutline(parseProgram("qasm3", PROGRAM), { a: 0.25, b: 1.5 });
    expect(outline).toEqual({
      qubits: 3,
      qubitLabels: ["q[0]", "q[1]", "anc[0]"],
      inputs: [
        { name: "a", type: "float" },
        { name: "b", type: "angle" },
      ],
      ops: [
        { kind: "gate", name: "pair", qubits: [0, 1], params: [0.25] },
        { kind: "barrier", qubits: [0, 1] },
        { kind: "gate", name: "ry", qubits: [2], params: [1.5] },
        { kind: "reset", qubit: 1 },
        { kind: "measure", qubit: 2, clbit: 0 },
      ],
      omitted: 0,
      placeholders: [],
    });
  });

  it("draws inputs without a finite value at 0 and ignores names that are not inputs", () => {
    const outline = circuitOutline(parseProgram("qasm3", PROGRAM), {
      a: Number.NaN,
      gone: 3,
    });
    expect(outline.placeholders).toEqual(["a", "b"]);
    expect(outline.ops[0]).toEqual({ kind: "gate", name: "pair", qubits: [0, 1], params: [0] });
  });

  it("keeps the first maxOps operations and counts the rest", () => {
    const program = parseProgram(
      "qasm2",
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q;\nx q;\n',
    );
    const outline = circuitOutline(program, {}, 3);
    expect(outline.ops.map((op) => op.kind === "gate" && op.name)).toEqual(["h", "h", "x"]);
    expect(outline.omitted).toBe(1);
  });
});
