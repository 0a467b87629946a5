/**
 * OpenQASM 3 gate modifiers, `gphase`, `const` and `for`, checked against the definitions
 * of the OpenQASM 3 live specification (openqasm.com, sections "Quantum gate modifiers",
 * "Built-in gates" (gphase) and "Looping and branching"; typed from memory of the text):
 * - ctrl @ g = block-diagonal [I, g] with the control first; negctrl @ g = [g, I];
 *   ctrl(n) @ g = ctrl @ … @ ctrl @ g (n times); the global phase of g becomes relative.
 * - inv @ g = g† exactly; pow(k) @ g = g^k for an integer k (g†^|k| for k < 0).
 * - gphase(γ) multiplies the state by e^{iγ}; `ctrl @ gphase(γ) q` = p(γ) q.
 * - `for int i in [a:b]` takes a, a+1, …, b (both ends included), `[a:s:b]` steps by s.
 * References are the test-only dense matrices of spec-gates.ts (stdgates.inc bodies) —
 * compared EXACTLY (no phase freedom) where a modifier makes the phase observable.
 */
import { describe, expect, it } from "vitest";
import { measurementCircuitQasm, parseProgram } from "@/lib/quantum/circuit";
import {
  circuitUnitary,
  controlled,
  dagger,
  embed,
  identity,
  mul,
  phaseDistance,
  type CMat,
} from "./dense-reference";
import { OPENQASM3, specUnitary } from "./spec-gates";

const H3 = 'OPENQASM 3.0;\ninclude "stdgates.inc";\n';

function unitary(body: string, n: number): CMat {
  return circuitUnitary(parseProgram("qasm3", `${H3}qubit[${n}] q;\n${body}`).bind());
}

function maxDiff(a: CMat, b: CMat): number {
  let m = 0;
  for (let i = 0; i < a.re.length; i++)
    m = Math.max(m, Math.abs(a.re[i] - b.re[i]), Math.abs(a.im[i] - b.im[i]));
  return m;
}

/** [g, I]: controlled on |0⟩ of the first qubit. */
function negControlled(v: CMat): CMat {
  const d = 2 * v.d;
  const out = identity(d);
  for (let r = 0; r < v.d; r++)
    for (let c = 0; c < v.d; c++) {
      out.re[r * d + c] = v.re[r * v.d + c];
      out.im[r * d + c] = v.im[r * v.d + c];
    }
  return out;
}

const ANGLES = [0.37, -1.21, 2.05, 0.8];
const qubits = (k: number) => Array.from({ length: k }, (_, i) => `q[${i}]`).join(", ");
const call = (name: string) => {
  const def = OPENQASM3[name];
  const p = def.params > 0 ? `(${ANGLES.slice(0, def.params).join(", ")})` : "";
  return { def, text: `${name}${p}`, params: ANGLES.slice(0, def.params) };
};

describe("modifiers on every stdgates.inc gate equal the specification's definitions exactly", () => {
  for (const name of Object.keys(OPENQASM3)) {
    const { def, text, params } = call(name);
    const g = specUnitary(OPENQASM3, name, params);
    const k = def.qubits;
    it(`ctrl @ ${name} = [I, ${name}] (phase included)`, () => {
      expect(
        maxDiff(unitary(`ctrl @ ${text} ${qubits(k + 1)};`, k + 1), controlled(g)),
      ).toBeLessThan(1e-12);
    });
    it(`negctrl @ ${name} = [${name}, I]`, () => {
      expect(
        maxDiff(unitary(`negctrl @ ${text} ${qubits(k + 1)};`, k + 1), negControlled(g)),
      ).toBeLessThan(1e-12);
    });
    it(`inv @ ${name} = ${name}† and pow(3) @ ${name} = ${name}³, pow(-2) @ ${name} = (${name}†)²`, () => {
      expect(maxDiff(unitary(`inv @ ${text} ${qubits(k)};`, k), dagger(g))).toBeLessThan(1e-12);
      expect(maxDiff(unitary(`pow(3) @ ${text} ${qubits(k)};`, k), mul(g, mul(g, g)))).toBeLessThan(
        1e-12,
      );
      expect(
        maxDiff(unitary(`pow(-2) @ ${text} ${qubits(k)};`, k), mul(dagger(g), dagger(g))),
      ).toBeLessThan(1e-12);
    });
  }
});

describe("composition, gphase and gate bodies", () => {
  const rz = (t: number) => specUnitary(OPENQASM3, "rz", [t]);

  it("modifiers apply right to left: ctrl @ inv @ g = ctrl(g†), ctrl(2) @ g = ctrl(ctrl(g)), negctrl @ ctrl @ g", () => {
    expect(
      maxDiff(unitary("ctrl @ inv @ rz(0.7) q[0], q[1];", 2), controlled(dagger(rz(0.7)))),
    ).toBeLessThan(1e-12);
    expect(
      maxDiff(unitary("ctrl(2) @ rz(0.7) q[0], q[1], q[2];", 3), controlled(controlled(rz(0.7)))),
    ).toBeLessThan(1e-12);
    expect(
      maxDiff(
        unitary("negctrl @ ctrl @ rz(0.7) q[0], q[1], q[2];", 3),
        negControlled(controlled(rz(0.7))),
      ),
    ).toBeLessThan(1e-12);
    // ctrl @ ctrl @ x is the Toffoli of stdgates.inc.
    expect(
      maxDiff(unitary("ctrl @ ctrl @ x q[0], q[1], q[2];", 3), specUnitary(OPENQASM3, "ccx", [])),
    ).toBeLessThan(1e-12);
  });

  it("the check can fail: ctrl @ rz differs from ctrl @ u1 (rz carries the phase e^{−iλ/2})", () => {
    const a = unitary("ctrl @ rz(0.7) q[0], q[1];", 2);
    const b = unitary("ctrl @ u1(0.7) q[0], q[1];", 2);
    expect(phaseDistance(a, b)).toBeGreaterThan(0.1);
    expect(maxDiff(a, b)).toBeGreaterThan(0.1);
  });

  it("gphase: alone unobservable and dropped; under ctrl it is the phase gate p (stdgates.inc's definition of p)", () => {
    const alone = parseProgram("qasm3", `${H3}qubit[1] q;\ngphase(0.4);\nh q[0];\n`).bind();
    expect(alone.ops).toHaveLength(1);
    expect(
      maxDiff(unitary("ctrl @ gphase(0.4) q[0];", 1), specUnitary(OPENQASM3, "p", [0.4])),
    ).toBeLessThan(1e-12);
  });

  it("a modified call of a user gate controls its whole body, gphase included", () => {
    const src =
      "gate g(a) s, t { gphase(a); rx(a) s; cx s, t; }\nctrl @ g(0.9) q[0], q[1], q[2];\n";
    const body = mul(
      embed(specUnitary(OPENQASM3, "cx", []), [0, 1], 2),
      embed(specUnitary(OPENQASM3, "rx", [0.9]), [0], 2),
    );
    const withPhase = {
      d: 4,
      re: body.re.map((x, i) => x * Math.cos(0.9) - body.im[i] * Math.sin(0.9)),
      im: body.re.map((x, i) => x * Math.sin(0.9) + body.im[i] * Math.cos(0.9)),
    };
    expect(maxDiff(unitary(src, 3), controlled(withPhase))).toBeLessThan(1e-12);
  });

  it("modifiers inside a gate body, and inputs in a modified gate's angle", () => {
    const program = parseProgram(
      "qasm3",
      `${H3}input float t;\nqubit[2] q;\ngate cr(a) c, x { ctrl @ inv @ ry(a) c, x; }\ncr(2*t) q[1], q[0];\n`,
    );
    const u = circuitUnitary(program.bind({ t: 0.3 }));
    const expected = embed(controlled(dagger(specUnitary(OPENQASM3, "ry", [0.6]))), [1, 0], 2);
    expect(maxDiff(u, expected)).toBeLessThan(1e-12);
  });

  it("names a modified call as written, normalised", () => {
    const c = parseProgram(
      "qasm3",
      `${H3}qubit[3] q;\nctrl(2)@x q[0], q[1], q[2];\npow(2) @ inv @ s q[0];\n`,
    ).bind();
    expect(c.ops.map((op) => (op.kind === "gate" ? op.name : op.kind))).toEqual([
      "ctrl(2) @ x",
      "pow(2) @ inv @ s",
    ]);
  });
});

describe("const declarations and for loops", () => {
  it("a loop equals its unrolling; ranges include both ends; steps and sets are honoured", () => {
    const loop = unitary(
      "for int i in [0:3] { h q[i]; }\nfor uint i in [0:2:3] { ctrl @ x q[i], q[i+1]; }\nfor i in {3, 1} rz(0.1*i) q[i];\n",
      4,
    );
    const unrolled = unitary(
      "h q[0]; h q[1]; h q[2]; h q[3];\ncx q[0], q[1]; cx q[2], q[3];\nrz(0.3) q[3]; rz(0.1) q[1];\n",
      4,
    );
    expect(maxDiff(loop, unrolled)).toBeLessThan(1e-12);
  });

  it("nested loops, descending ranges and empty ranges", () => {
    const c = parseProgram(
      "qasm3",
      `${H3}qubit[3] q;\nfor int i in [2:-1:0] { for int j in [0:i-1] { cx q[j], q[i]; } }\nfor int k in [3:1] { x q[0]; }\n`,
    ).bind();
    expect(c.ops.map((op) => (op.kind === "gate" ? op.qubits : []))).toEqual([
      [0, 2],
      [1, 2],
      [0, 1],
    ]);
  });

  it("constants size registers, index qubits, feed angles and gate bodies", () => {
    const src = `${H3}const int n = 2 + 1;\nconst float half = pi / 2;\ninput float t;\nqubit[n] q;\ngate turn a { rx(half) a; }\nturn q[n - 1];\nry(half * t) q[0];\n`;
    const program = parseProgram("qasm3", src);
    expect(program.numQubits).toBe(3);
    const u = circuitUnitary(program.bind({ t: 0.5 }));
    const expected = mul(
      embed(specUnitary(OPENQASM3, "ry", [Math.PI / 4]), [0], 3),
      embed(specUnitary(OPENQASM3, "rx", [Math.PI / 2]), [2], 3),
    );
    expect(maxDiff(u, expected)).toBeLessThan(1e-12);
  });

  it("loop variables are scoped to the loop and cannot shadow other names", () => {
    expect(() =>
      parseProgram("qasm3", `${H3}qubit[2] q;\nfor int i in [0:1] { h q[i]; }\nh q[i];\n`),
    ).toThrow(/undefined name|undefined parameter 'i'/);
    expect(() =>
      parseProgram("qasm3", `${H3}const int i = 1;\nqubit[2] q;\nfor int i in [0:1] { h q[i]; }\n`),
    ).toThrow("'i' is already declared as a constant");
  });

  it("`pow` stays a function in expressions", () => {
    expect(
      maxDiff(unitary("rx(pow(2, 3)) q[0];", 1), specUnitary(OPENQASM3, "rx", [8])),
    ).toBeLessThan(1e-12);
  });
});

describe("OpenQASM 2.0 export of modified gates (qelib1.inc only)", () => {
  it("re-parses as OpenQASM 2.0 with the same unitary up to one global phase", () => {
    const src = `${H3}input float a;\nqubit[3] q;\nh q;\nctrl @ rz(a) q[0], q[1];\nnegctrl @ s q[2], q[0];\ninv @ cu(a, 0.2, -0.5, 0.9) q[1], q[2];\nctrl(2) @ x q[0], q[1], q[2];\nctrl @ swap q[2], q[0], q[1];\ninv @ u3(a, 1.1, 0.4) q[1];\npow(2) @ sx q[0];\nctrl @ gphase(a) q[2];\nnegctrl @ inv @ ry(a) q[1], q[0];\nctrl @ cx q[1], q[2], q[0];\ninv @ crx(a) q[0], q[2];\n`;
    const program = parseProgram("qasm3", src);
    const params = { a: 0.83 };
    const text = measurementCircuitQasm(program, params, "III");
    const again = parseProgram("qasm2", text).bind();
    expect(phaseDistance(circuitUnitary(again), circuitUnitary(program.bind(params)))).toBeLessThan(
      1e-12,
    );
  });

  it("refuses what qelib1.inc cannot express, with the gate named", () => {
    const program = parseProgram(
      "qasm3",
      `${H3}qubit[3] q;\nctrl(2) @ rz(0.3) q[0], q[1], q[2];\n`,
    );
    expect(() => measurementCircuitQasm(program, {}, "ZZZ")).toThrow(
      /'ctrl @ ctrl @ rz' .*cannot be exported as OpenQASM 2\.0/,
    );
  });
});
