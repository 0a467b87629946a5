/**
 * parseProgram / bind on realistic programs (fixtures in tests/fixtures/qasm, invented
 * for this project). Expected values are hand-derived from the OpenQASM 2.0 semantics
 * (arXiv:1707.03429 §3: registers flatten in declaration order, broadcasting repeats a
 * single qubit) and the OpenQASM 3 specification (input declarations).
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { circuitStats, parseProgram } from "@/lib/quantum/circuit";
import type { CircuitOp } from "@/lib/quantum/types";
import { fromInterleaved, phaseDistance } from "./dense-reference";
import { OPENQASM2, OPENQASM3, specUnitary } from "./spec-gates";

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/qasm/${name}`, import.meta.url), "utf8");

function gateOps(ops: CircuitOp[]) {
  return ops.flatMap((op) => (op.kind === "gate" ? [op] : []));
}

describe("OpenQASM 2.0: two registers, user gates, broadcasting, barrier, final measures", () => {
  const program = parseProgram("qasm2", fixture("two-registers.qasm"));
  const circuit = program.bind({});

  it("flattens registers in declaration order", () => {
    expect(program.numQubits).toBe(5);
    expect(program.numClbits).toBe(5);
    expect(program.qubitLabels).toEqual(["data[0]", "data[1]", "data[2]", "anc[0]", "anc[1]"]);
    expect(program.inputs).toEqual([]);
  });

  it("gives one top-level op per call, broadcasting registers", () => {
    const summary = circuit.ops.map((op) =>
      op.kind === "gate" || op.kind === "barrier"
        ? [op.kind === "gate" ? op.name : "barrier", op.qubits]
        : [op.kind, op.qubit],
    );
    expect(summary).toEqual([
      ["h", [0]],
      ["h", [1]],
      ["h", [2]],
      ["cx", [0, 3]],
      ["cx", [0, 4]],
      ["ent", [1, 4]],
      ["block", [2, 3, 4]],
      ["u3", [0]],
      ["barrier", [0, 1, 2, 3, 4]],
      ["measure", 0],
      ["measure", 1],
      ["measure", 2],
      ["measure", 3],
      ["measure", 4],
    ]);
    const measures = circuit.ops.flatMap((op) => (op.kind === "measure" ? [op.clbit] : []));
    expect(measures).toEqual([0, 1, 2, 3, 4]); // out[0..2] then flag[0..1]
    expect(circuit.hasMidCircuitMeasurement).toBe(false);
    expect(circuit.hasReset).toBe(false);
  });

  it("inlines user gates into primitive parts (barriers inside gates dropped)", () => {
    const [ent, block] = gateOps(circuit.ops).filter(
      (op) => op.name === "ent" || op.name === "block",
    );
    expect(ent.parts.map((p) => [p.name, p.qubits])).toEqual([
      ["ry", [1]],
      ["cx", [1, 4]],
      ["rz", [4]],
      ["cx", [1, 4]],
    ]);
    expect(block.parts.map((p) => [p.name, p.qubits])).toEqual([
      ["ry", [2]],
      ["cx", [2, 3]],
      ["rz", [3]],
      ["cx", [2, 3]],
      ["ccx", [2, 3, 4]],
    ]);
    // ent(0.5, -0.15): ry(θ/2) = ry(0.25), rz(−φ + π/4) = rz(0.15 + π/4).
    expect(
      phaseDistance(fromInterleaved(ent.parts[0].matrix), specUnitary(OPENQASM2, "ry", [0.25])),
    ).toBeLessThan(1e-12);
    expect(
      phaseDistance(
        fromInterleaved(ent.parts[2].matrix),
        specUnitary(OPENQASM2, "rz", [0.15 + Math.PI / 4]),
      ),
    ).toBeLessThan(1e-12);
    expect(ent.params).toEqual([0.5, -0.15]);
  });

  it("evaluates parameter expressions with pi, ^, unary minus and the spec's functions", () => {
    const u3 = gateOps(circuit.ops).find((op) => op.name === "u3")!;
    // 2^-1 = 0.5, sin(pi/6) = 0.5, sqrt(2)*ln(exp(1)) = √2.
    expect(u3.params[0]).toBe(0.5);
    expect(u3.params[1]).toBeCloseTo(0.5, 15);
    expect(u3.params[2]).toBeCloseTo(Math.SQRT2, 15);
  });

  it("circuitStats counts top-level calls and depth (hand count; barrier not counted)", () => {
    expect(circuitStats(circuit)).toEqual({
      qubits: 5,
      gateCounts: { h: 3, cx: 2, ent: 1, block: 1, u3: 1 },
      totalGates: 8,
      twoQubitGates: 4,
      // layers: h | cx(0,3) | cx(0,4) | ent(1,4) | block(2,3,4) | measure data[2], anc[0], anc[1]
      depth: 6,
    });
  });
});

describe("OpenQASM 3 subset: inputs bound by bind", () => {
  const program = parseProgram("qasm3", fixture("parametrised.qasm3"));

  it("declares the inputs in order with their types", () => {
    expect(program.inputs).toEqual([
      { name: "theta", type: "angle" },
      { name: "gamma", type: "float" },
      { name: "beta", type: "float" },
    ]);
    expect(program.qubitLabels).toEqual(["q[0]", "q[1]", "q[2]", "anc"]);
    expect(program.numClbits).toBe(4);
  });

  it("binds parameter values into op params and part matrices (OpenQASM 3 stdgates.inc)", () => {
    const [theta, gamma, beta] = [0.3, -1.1, 0.7];
    const circuit = program.bind({ theta, gamma, beta });
    const ops = gateOps(circuit.ops);
    expect(ops.map((op) => op.name)).toEqual(["h", "h", "h", "layer", "layer", "ry", "cu"]);
    const [layer1, layer2, ry, cu] = ops.slice(3);
    expect(layer1.params).toEqual([theta, 2 * gamma]);
    expect(layer2.params).toEqual([-theta, Math.PI / 2]);
    expect(ry.params).toEqual([beta ** 2]);
    expect(cu.params).toEqual([theta, 0, Math.PI, gamma]);
    expect(
      phaseDistance(fromInterleaved(layer1.parts[0].matrix), specUnitary(OPENQASM3, "rx", [theta])),
    ).toBeLessThan(1e-12);
    expect(
      phaseDistance(
        fromInterleaved(layer1.parts[1].matrix),
        specUnitary(OPENQASM3, "cp", [2 * gamma]),
      ),
    ).toBeLessThan(1e-12);
    expect(
      phaseDistance(
        fromInterleaved(cu.parts[0].matrix),
        specUnitary(OPENQASM3, "cu", [theta, 0, Math.PI, gamma]),
      ),
    ).toBeLessThan(1e-12);
    const barrier = circuit.ops.find((op) => op.kind === "barrier");
    expect(barrier).toMatchObject({ qubits: [0, 1, 2, 3] }); // `barrier;` covers every qubit
    expect(circuit.ops.filter((op) => op.kind === "measure")).toHaveLength(4);
    expect(circuit.hasMidCircuitMeasurement).toBe(false);
  });

  it("re-binding changes only the input-dependent matrices and re-uses the parse", () => {
    const a = program.bind({ theta: 0.1, gamma: 0.2, beta: 0.3 });
    const b = program.bind({ theta: 1.1, gamma: 0.2, beta: 0.3 });
    const la = gateOps(a.ops)[3];
    const lb = gateOps(b.ops)[3];
    expect(lb.parts[2].matrix).toBe(la.parts[2].matrix); // constant cx: computed once at parse time
    expect(
      phaseDistance(fromInterleaved(lb.parts[0].matrix), specUnitary(OPENQASM3, "rx", [1.1])),
    ).toBeLessThan(1e-12);
  });

  it("accepts the other OpenQASM 3 forms of the subset", () => {
    const p = parseProgram(
      "qasm3",
      'OPENQASM 3;\ninclude "stdgates.inc";\ninput float x;\nqubit[2] q;\nbit[2] c = measure q;\n',
    );
    expect(p.bind({ x: 1 }).ops.map((op) => op.kind)).toEqual(["measure", "measure"]);
    const q = parseProgram(
      "qasm3",
      "OPENQASM 3.0;\nqubit q;\nbit c;\nU(π, 0, τ/2) q;\nmeasure q -> c;\nreset q;\n",
    );
    const c = q.bind();
    expect(c.ops.map((op) => op.kind)).toEqual(["gate", "measure", "reset"]);
    expect(c.hasReset).toBe(true);
    expect(c.hasMidCircuitMeasurement).toBe(true);
  });
});

describe("mid-circuit measurement and reset flags", () => {
  const head = 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\ncreg c[2];\n';
  const flags = (body: string) => {
    const c = parseProgram("qasm2", head + body).bind();
    return [c.hasMidCircuitMeasurement, c.hasReset];
  };
  it.each([
    ["h q; measure q -> c;", false, false, "final measurements of every qubit"],
    [
      "measure q[0] -> c[0]; h q[1]; measure q[1] -> c[1];",
      false,
      false,
      "a gate on another qubit after a measure",
    ],
    [
      "measure q[0] -> c[0]; barrier q; measure q[1] -> c[1];",
      false,
      false,
      "barrier after a measure",
    ],
    ["measure q[0] -> c[0]; x q[0];", true, false, "a gate after a measure"],
    [
      "measure q[0] -> c[0]; cx q[1], q[0];",
      true,
      false,
      "a two-qubit gate touching a measured qubit",
    ],
    [
      "measure q[0] -> c[0]; measure q[0] -> c[1];",
      true,
      false,
      "a second measure of the same qubit",
    ],
    ["measure q[0] -> c[0]; reset q[0];", true, true, "reset after a measure"],
    ["reset q; h q;", false, true, "reset at the start"],
  ])("%s", (body, mid, reset) => {
    expect(flags(body)).toEqual([mid, reset]);
  });
});

describe("later qelib1.inc additions give way to the program's own definitions", () => {
  // Older qelib1.inc files lack e.g. rzz, so programs often define it themselves.
  it.each([
    [
      "after the include",
      'include "qelib1.inc";\ngate rzz(t) a, b { cx a, b; u1(t) b; cx a, b; }\n',
      ["cx", "u1", "cx"],
    ],
    [
      "before the include",
      'gate rzz(t) a, b { CX a, b; U(0, 0, t) b; CX a, b; }\ninclude "qelib1.inc";\n',
      ["cx", "u", "cx"],
    ],
  ])("defined %s", (_name, head, parts) => {
    const circuit = parseProgram(
      "qasm2",
      `OPENQASM 2.0;\n${head}qreg q[2];\nrzz(0.3) q[0], q[1];\n`,
    ).bind();
    expect(gateOps(circuit.ops)[0].parts.map((p) => p.name)).toEqual(parts);
  });

  it("but a gate of the paper's qelib1.inc cannot be redefined", () => {
    expect(() =>
      parseProgram("qasm2", 'OPENQASM 2.0;\ngate cx a, b { CX a, b; }\ninclude "qelib1.inc";\n'),
    ).toThrow(/gate 'cx' is defined by the program \(line 2\) and again by qelib1.inc/);
  });
});
