/**
 * OpenQASM 2.0 export. Checks: the text re-parses with parseProgram("qasm2", …); its
 * unitary equals (basis rotations) × (original unitary) up to one global phase, using the
 * test-only dense reference; rotations are the usual ones (X: H; Y: S† then H); the
 * Hadamard test's ancilla gives ⟨Z⟩ = Re⟨ψ|P|ψ⟩ (common practice; the Hadamard test as
 * in Nielsen & Chuang's phase-estimation chapter, from memory).
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  hadamardTestQasm,
  measurementCircuitQasm,
  parseProgram,
  type ParsedProgram,
} from "@/lib/quantum/circuit";
import {
  applyToZero,
  circuitUnitary,
  embed,
  fromRows,
  identity,
  mul,
  phaseDistance,
  type CMat,
} from "./dense-reference";

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/qasm/${name}`, import.meta.url), "utf8");

const R = Math.SQRT1_2;
const H = fromRows([
  [
    [R, 0],
    [R, 0],
  ],
  [
    [R, 0],
    [-R, 0],
  ],
]);
const SDG = fromRows([
  [
    [1, 0],
    [0, 0],
  ],
  [
    [0, 0],
    [0, -1],
  ],
]);
const PAULI: Record<string, CMat> = {
  I: identity(2),
  X: fromRows([
    [
      [0, 0],
      [1, 0],
    ],
    [
      [1, 0],
      [0, 0],
    ],
  ]),
  Y: fromRows([
    [
      [0, 0],
      [0, -1],
    ],
    [
      [0, 1],
      [0, 0],
    ],
  ]),
  Z: fromRows([
    [
      [1, 0],
      [0, 0],
    ],
    [
      [0, 0],
      [-1, 0],
    ],
  ]),
};

/** Every gate of both libraries, including those exported through decompositions. */
const ALL_GATES_3 = `OPENQASM 3.0;
include "stdgates.inc";
input float a;
input angle b;
qubit[2] q;
qubit r;
gate mix(t) x, y { sx x; cry(t) x, y; swap x, y; }
U(a, b, 0.3) q[0]; p(a) q[1]; x r; y q[0]; z q[1]; h r; s q[0]; sdg q[1]; t r; tdg q[0];
sx q[1]; rx(b) r; ry(-a) q[0]; rz(a*b) q[1]; cx q[0], r; cy r, q[1]; cz q[1], q[0];
cp(b) q[0], q[1]; crx(a) r, q[0]; cry(b) q[1], r; crz(a) q[0], q[1]; ch r, q[0];
swap q[0], r; ccx q[1], r, q[0]; cswap r, q[0], q[1]; cu(a, b, 0.7, -0.4) q[1], r;
CX r, q[1]; phase(b) q[0]; cphase(a) q[1], r; id q[0]; u1(a) r; u2(a, b) q[1]; u3(a, b, 1.5) q[0];
mix(a + b) r, q[1];
`;
const ALL_ADDITIONS_2 = `OPENQASM 2.0;
include "qelib1.inc";
qreg q[3];
h q; rxx(0.4) q[0], q[2]; rzz(-1.3) q[2], q[1]; sxdg q[1]; u(0.1, 0.2, 0.3) q[0]; p(0.9) q[2];
cu1(0.3) q[1], q[0]; cu3(0.5, -0.6, 0.7) q[2], q[0]; U(1, 2, 3) q[1]; CX q[1], q[2]; cswap q[0], q[1], q[2];
`;

/** Unitary of the rotations X: H, Y: H·S†, on n qubits. */
function rotations(bases: string): CMat {
  const n = bases.length;
  let u = identity(1 << n);
  [...bases].forEach((b, i) => {
    if (b === "X") u = mul(embed(H, [i], n), u);
    if (b === "Y") u = mul(embed(H, [i], n), mul(embed(SDG, [i], n), u));
  });
  return u;
}

function checkMeasurementCircuit(
  program: ParsedProgram,
  params: Record<string, number>,
  bases: string,
) {
  const text = measurementCircuitQasm(program, params, bases);
  const reparsed = parseProgram("qasm2", text);
  expect(reparsed.numQubits).toBe(program.numQubits);
  const again = reparsed.bind();
  const expected = mul(rotations(bases), circuitUnitary(program.bind(params)));
  expect(phaseDistance(circuitUnitary(again), expected)).toBeLessThan(1e-12);
  const measured = [...bases].flatMap((b, i) => (b === "I" ? [] : [i]));
  const measures = again.ops.flatMap((op) => (op.kind === "measure" ? [[op.qubit, op.clbit]] : []));
  expect(measures).toEqual(measured.map((q, j) => [q, j]));
  expect(reparsed.numClbits).toBe(measured.length);
  return text;
}

describe("measurementCircuitQasm", () => {
  it("re-parses as OpenQASM 2.0 and realises circuit + rotations (user gates, broadcasting)", () => {
    const text = checkMeasurementCircuit(
      parseProgram("qasm2", fixture("two-registers.qasm")),
      {},
      "XYZIX",
    );
    expect(text).toMatch(/^OPENQASM 2\.0;\ninclude "qelib1\.inc";\n/);
    expect(text).not.toMatch(/measure q\[\d\] -> (out|flag)/); // original measurements dropped
  });

  it("exports every OpenQASM 3 standard gate with numeric parameters and qelib1.inc names", () => {
    const program = parseProgram("qasm3", ALL_GATES_3);
    for (const bases of ["ZZZ", "XYZ", "YIX"])
      checkMeasurementCircuit(program, { a: 0.83, b: -2.1 }, bases);
    const text = measurementCircuitQasm(program, { a: 0.83, b: -2.1 }, "ZZZ");
    // Only gates of the paper's qelib1.inc appear (arXiv:1707.03429 §3).
    const qelib1 = new Set([
      "u3",
      "u2",
      "u1",
      "cx",
      "id",
      "x",
      "y",
      "z",
      "h",
      "s",
      "sdg",
      "t",
      "tdg",
      "rx",
      "ry",
      "rz",
      "cz",
      "cy",
      "ch",
      "ccx",
      "crz",
      "cu1",
      "cu3",
    ]);
    const used = text
      .split("\n")
      .filter((l) => /^[a-z]/.test(l) && !/^(qreg|creg|include|measure|barrier|reset)\b/.test(l));
    for (const line of used) expect(qelib1.has(line.split(/[ (]/)[0]), line).toBe(true);
  });

  it("exports the qelib1.inc additions and built-ins", () => {
    checkMeasurementCircuit(parseProgram("qasm2", ALL_ADDITIONS_2), {}, "YXZ");
  });

  it("keeps parameters exactly (shortest round-trip numbers, OpenQASM 2.0 real syntax)", () => {
    const program = parseProgram(
      "qasm2",
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\nrx(0.1+0.2) q[0];\nrz(1e-7) q[0];\nry(-3) q[0];\n',
    );
    const text = measurementCircuitQasm(program, {}, "Z");
    expect(text).toContain("rx(0.30000000000000004) q[0];");
    expect(text).toContain("rz(1.0e-7) q[0];");
    const again = parseProgram("qasm2", text).bind();
    const params = again.ops.flatMap((op) => (op.kind === "gate" ? op.params : []));
    expect(params).toEqual([0.1 + 0.2, 1e-7, -3]);
  });

  it("measures nothing for all-identity bases and still re-parses", () => {
    const program = parseProgram(
      "qasm2",
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\n',
    );
    const text = checkMeasurementCircuit(program, {}, "II");
    expect(text).not.toContain("creg");
  });

  it("rejects bad bases and circuits with mid-circuit measurements", () => {
    const program = parseProgram(
      "qasm2",
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\ncreg c[2];\nmeasure q[0] -> c[0];\nh q[0];\n',
    );
    expect(() => measurementCircuitQasm(program, {}, "ZZZ")).toThrow(
      expect.objectContaining({ code: "invalid_request" }),
    );
    expect(() => measurementCircuitQasm(program, {}, "ZA")).toThrow(
      expect.objectContaining({ code: "invalid_request" }),
    );
    expect(() => measurementCircuitQasm(program, {}, "ZZ")).toThrow(
      expect.objectContaining({ code: "unsupported" }),
    );
  });

  it("binds OpenQASM 3 inputs and rejects missing ones", () => {
    const program = parseProgram("qasm3", fixture("parametrised.qasm3"));
    checkMeasurementCircuit(program, { theta: 0.4, gamma: -0.9, beta: 1.7 }, "XZYX");
    expect(() => measurementCircuitQasm(program, { theta: 0.4 }, "ZZZZ")).toThrow(
      expect.objectContaining({ code: "invalid_request" }),
    );
  });
});

/** ⟨ψ|P|ψ⟩ for the dense word P (qubit 0 first) and ψ = U|0…0⟩. */
function pauliExpectation(u: CMat, word: string): { re: number; im: number } {
  const n = word.length;
  let p = identity(1 << n);
  [...word].forEach((c, i) => (p = mul(embed(PAULI[c], [i], n), p)));
  const psi = applyToZero(u);
  const ppsi = applyToZero(mul(p, u));
  let re = 0;
  let im = 0;
  psi.re.forEach((a, k) => {
    re += a * ppsi.re[k] + psi.im[k] * ppsi.im[k];
    im += a * ppsi.im[k] - psi.im[k] * ppsi.re[k];
  });
  return { re, im };
}

/** ⟨Z⟩ of the last qubit (the ancilla register comes after q) of U|0…0⟩. */
function ancillaZ(u: CMat): number {
  const psi = applyToZero(u);
  return psi.re.reduce((acc, a, k) => acc + (k & 1 ? -1 : 1) * (a * a + psi.im[k] * psi.im[k]), 0);
}

describe("hadamardTestQasm", () => {
  const program = parseProgram("qasm3", fixture("parametrised.qasm3"));
  const params = { theta: 0.4, gamma: -0.9, beta: 1.7 };
  const u = circuitUnitary(program.bind(params));

  it.each(["XIII", "ZZII", "XXII", "IYZX", "YYYY", "IIIZ", "IIIY", "XZXI"])(
    "⟨Z_anc⟩ = Re⟨ψ|%s|ψ⟩ and the imaginary-part variant gives Im = 0",
    (word) => {
      const re = parseProgram("qasm2", hadamardTestQasm(program, params, word, "re"));
      expect(re.qubitLabels.at(-1)).toBe("anc[0]");
      const expected = pauliExpectation(u, word);
      expect(Math.abs(expected.re)).toBeGreaterThan(1e-3); // a non-trivial value, so the check can fail
      expect(ancillaZ(circuitUnitary(re.bind()))).toBeCloseTo(expected.re, 12);
      const im = parseProgram("qasm2", hadamardTestQasm(program, params, word, "im"));
      // P is Hermitian, so Im⟨ψ|P|ψ⟩ = 0; without the S† this would equal the real part.
      expect(ancillaZ(circuitUnitary(im.bind()))).toBeCloseTo(expected.im, 12);
    },
  );

  it("explains the estimator in a comment and validates its arguments", () => {
    const text = hadamardTestQasm(program, params, "XIZY", "re");
    expect(text).toMatch(/\/\/ .*Re<psi\|P\|psi>/);
    expect(() => hadamardTestQasm(program, params, "XI", "re")).toThrow(
      expect.objectContaining({ code: "invalid_request" }),
    );
    expect(() => hadamardTestQasm(program, params, "XIZY", "abs" as "re")).toThrow(
      expect.objectContaining({ code: "invalid_request" }),
    );
  });
});
