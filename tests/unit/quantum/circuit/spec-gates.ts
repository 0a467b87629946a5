/**
 * Test-only reference definitions of the standard gates, written as the specifications
 * decompose them, and a small composer that multiplies them out with dense matrices.
 * Nothing here uses the engine's gate code.
 *
 * Sources:
 * - OPENQASM2: A. W. Cross, L. S. Bishop, J. A. Smolin, J. M. Gambetta, "Open Quantum
 *   Assembly Language", arXiv:1707.03429 (2017): built-ins U(θ,φ,λ) := Rz(φ)Ry(θ)Rz(λ)
 *   and CX (§2), qelib1.inc (§3). The qelib1.inc bodies below were typed by hand from the
 *   published file (compared with the copy in the openqasm/openqasm repository); the U
 *   matrix formula is typed from memory of the paper.
 * - OPENQASM3: the OpenQASM 3 live specification's stdgates.inc (openqasm.com), typed by
 *   hand from the openqasm/openqasm repository's examples/stdgates.inc; the built-in
 *   U(θ,φ,λ) = [[cos θ/2, −e^{iλ} sin θ/2], [e^{iφ} sin θ/2, e^{i(φ+λ)} cos θ/2]] and the
 *   modifiers ctrl @ (block-diagonal [I, G]), inv @ (G†), pow(1/2) @ (principal square
 *   root) and gphase(γ) (a factor e^{iγ}) as the specification defines them (from memory).
 */
import {
  controlled,
  dagger,
  embed,
  fromRows,
  identity,
  mul,
  scale,
  type CMat,
} from "./dense-reference";

type Item =
  | { g: string; p: number[]; q: number[] } // call of another gate of the same table
  | { m: CMat; q: number[] } // an explicit matrix (a modifier's result)
  | { phase: number }; // gphase(γ)

export interface SpecGate {
  params: number;
  qubits: number;
  body: (p: number[]) => Item[];
}

export type SpecTable = Record<string, SpecGate>;

const PI = Math.PI;
const cis = (a: number): [number, number] => [Math.cos(a), Math.sin(a)];
const times = ([a, b]: [number, number], r: number): [number, number] => [a * r, b * r];

/** OpenQASM 2.0 built-in U(θ,φ,λ) = Rz(φ)Ry(θ)Rz(λ) (arXiv:1707.03429 §2). */
export function uQasm2Reference(t: number, p: number, l: number): CMat {
  const c = Math.cos(t / 2);
  const s = Math.sin(t / 2);
  return fromRows([
    [times(cis(-(p + l) / 2), c), times(cis(-(p - l) / 2), -s)],
    [times(cis((p - l) / 2), s), times(cis((p + l) / 2), c)],
  ]);
}

/** OpenQASM 3 built-in U(θ,φ,λ). */
export function uQasm3Reference(t: number, p: number, l: number): CMat {
  const c = Math.cos(t / 2);
  const s = Math.sin(t / 2);
  return fromRows([
    [[c, 0], times(cis(l), -s)],
    [times(cis(p), s), times(cis(p + l), c)],
  ]);
}

const CX = fromRows([
  [
    [1, 0],
    [0, 0],
    [0, 0],
    [0, 0],
  ],
  [
    [0, 0],
    [1, 0],
    [0, 0],
    [0, 0],
  ],
  [
    [0, 0],
    [0, 0],
    [0, 0],
    [1, 0],
  ],
  [
    [0, 0],
    [0, 0],
    [1, 0],
    [0, 0],
  ],
]);

const call = (g: string, p: number[], q: number[]): Item => ({ g, p, q });

/** OpenQASM 2.0: built-ins plus qelib1.inc exactly as published. */
export const OPENQASM2: SpecTable = {
  U: { params: 3, qubits: 1, body: ([t, p, l]) => [{ m: uQasm2Reference(t, p, l), q: [0] }] },
  CX: { params: 0, qubits: 2, body: () => [{ m: CX, q: [0, 1] }] },
  u3: { params: 3, qubits: 1, body: ([t, p, l]) => [call("U", [t, p, l], [0])] },
  u2: { params: 2, qubits: 1, body: ([p, l]) => [call("U", [PI / 2, p, l], [0])] },
  u1: { params: 1, qubits: 1, body: ([l]) => [call("U", [0, 0, l], [0])] },
  cx: { params: 0, qubits: 2, body: () => [call("CX", [], [0, 1])] },
  id: { params: 0, qubits: 1, body: () => [call("U", [0, 0, 0], [0])] },
  x: { params: 0, qubits: 1, body: () => [call("u3", [PI, 0, PI], [0])] },
  y: { params: 0, qubits: 1, body: () => [call("u3", [PI, PI / 2, PI / 2], [0])] },
  z: { params: 0, qubits: 1, body: () => [call("u1", [PI], [0])] },
  h: { params: 0, qubits: 1, body: () => [call("u2", [0, PI], [0])] },
  s: { params: 0, qubits: 1, body: () => [call("u1", [PI / 2], [0])] },
  sdg: { params: 0, qubits: 1, body: () => [call("u1", [-PI / 2], [0])] },
  t: { params: 0, qubits: 1, body: () => [call("u1", [PI / 4], [0])] },
  tdg: { params: 0, qubits: 1, body: () => [call("u1", [-PI / 4], [0])] },
  rx: { params: 1, qubits: 1, body: ([t]) => [call("u3", [t, -PI / 2, PI / 2], [0])] },
  ry: { params: 1, qubits: 1, body: ([t]) => [call("u3", [t, 0, 0], [0])] },
  rz: { params: 1, qubits: 1, body: ([p]) => [call("u1", [p], [0])] },
  cz: {
    params: 0,
    qubits: 2,
    body: () => [call("h", [], [1]), call("cx", [], [0, 1]), call("h", [], [1])],
  },
  cy: {
    params: 0,
    qubits: 2,
    body: () => [call("sdg", [], [1]), call("cx", [], [0, 1]), call("s", [], [1])],
  },
  ch: {
    params: 0,
    qubits: 2,
    body: () => [
      call("h", [], [1]),
      call("sdg", [], [1]),
      call("cx", [], [0, 1]),
      call("h", [], [1]),
      call("t", [], [1]),
      call("cx", [], [0, 1]),
      call("t", [], [1]),
      call("h", [], [1]),
      call("s", [], [1]),
      call("x", [], [1]),
      call("s", [], [0]),
    ],
  },
  ccx: {
    params: 0,
    qubits: 3,
    body: () => [
      call("h", [], [2]),
      call("cx", [], [1, 2]),
      call("tdg", [], [2]),
      call("cx", [], [0, 2]),
      call("t", [], [2]),
      call("cx", [], [1, 2]),
      call("tdg", [], [2]),
      call("cx", [], [0, 2]),
      call("t", [], [1]),
      call("t", [], [2]),
      call("h", [], [2]),
      call("cx", [], [0, 1]),
      call("t", [], [0]),
      call("tdg", [], [1]),
      call("cx", [], [0, 1]),
    ],
  },
  crz: {
    params: 1,
    qubits: 2,
    body: ([l]) => [
      call("u1", [l / 2], [1]),
      call("cx", [], [0, 1]),
      call("u1", [-l / 2], [1]),
      call("cx", [], [0, 1]),
    ],
  },
  cu1: {
    params: 1,
    qubits: 2,
    body: ([l]) => [
      call("u1", [l / 2], [0]),
      call("cx", [], [0, 1]),
      call("u1", [-l / 2], [1]),
      call("cx", [], [0, 1]),
      call("u1", [l / 2], [1]),
    ],
  },
  cu3: {
    params: 3,
    qubits: 2,
    body: ([t, p, l]) => [
      call("u1", [(l - p) / 2], [1]),
      call("cx", [], [0, 1]),
      call("u3", [-t / 2, 0, -(p + l) / 2], [1]),
      call("cx", [], [0, 1]),
      call("u3", [t / 2, p, 0], [1]),
    ],
  },
};

/** Principal complex square root. */
function csqrt(re: number, im: number): [number, number] {
  const r = Math.hypot(re, im);
  const a = Math.sqrt((r + re) / 2);
  const b = Math.sign(im || 1) * Math.sqrt(Math.max(0, (r - re) / 2));
  return [a, b];
}

/** Principal square root of a 2×2 matrix: (M + √det·I)/√(tr M + 2√det) (common practice). */
function sqrt2x2(m: CMat): CMat {
  const [a, b, c, d] = [0, 1, 2, 3];
  const detRe = m.re[a] * m.re[d] - m.im[a] * m.im[d] - (m.re[b] * m.re[c] - m.im[b] * m.im[c]);
  const detIm = m.re[a] * m.im[d] + m.im[a] * m.re[d] - (m.re[b] * m.im[c] + m.im[b] * m.re[c]);
  const s = csqrt(detRe, detIm);
  const t = csqrt(m.re[a] + m.re[d] + 2 * s[0], m.im[a] + m.im[d] + 2 * s[1]);
  const sum: CMat = { d: 2, re: m.re.slice(), im: m.im.slice() };
  sum.re[a] += s[0];
  sum.im[a] += s[1];
  sum.re[d] += s[0];
  sum.im[d] += s[1];
  const n = t[0] * t[0] + t[1] * t[1];
  return scale(sum, t[0] / n, -t[1] / n);
}

/** Unitary of gate `name` of `table` for numeric parameters, on its own qubits. */
export function specUnitary(table: SpecTable, name: string, params: number[]): CMat {
  const def = table[name];
  if (def === undefined) throw new Error(`no reference definition of ${name}`);
  let u = identity(1 << def.qubits);
  for (const item of def.body(params)) {
    if ("phase" in item) {
      u = scale(u, Math.cos(item.phase), Math.sin(item.phase));
      continue;
    }
    const m = "m" in item ? item.m : specUnitary(table, item.g, item.p);
    u = mul(embed(m, item.q, def.qubits), u);
  }
  return u;
}

// OpenQASM 3 modifiers on gates of the OPENQASM3 table.
const G = (name: string, p: number[] = []) => specUnitary(OPENQASM3, name, p);
const ctrl = (m: CMat, q: number[]): Item => ({ m: controlled(m), q });
const gphaseMatrix = (g: number): CMat => fromRows([[cis(g)]]);

/** OpenQASM 3 stdgates.inc (and the built-in U). */
export const OPENQASM3: SpecTable = {
  U: { params: 3, qubits: 1, body: ([t, p, l]) => [{ m: uQasm3Reference(t, p, l), q: [0] }] },
  p: { params: 1, qubits: 1, body: ([l]) => [ctrl(gphaseMatrix(l), [0])] },
  x: { params: 0, qubits: 1, body: () => [call("U", [PI, 0, PI], [0])] },
  y: { params: 0, qubits: 1, body: () => [call("U", [PI, PI / 2, PI / 2], [0])] },
  z: { params: 0, qubits: 1, body: () => [call("p", [PI], [0])] },
  h: { params: 0, qubits: 1, body: () => [call("U", [PI / 2, 0, PI], [0])] },
  s: { params: 0, qubits: 1, body: () => [{ m: sqrt2x2(G("z")), q: [0] }] },
  sdg: { params: 0, qubits: 1, body: () => [{ m: dagger(sqrt2x2(G("z"))), q: [0] }] },
  t: { params: 0, qubits: 1, body: () => [{ m: sqrt2x2(G("s")), q: [0] }] },
  tdg: { params: 0, qubits: 1, body: () => [{ m: dagger(sqrt2x2(G("s"))), q: [0] }] },
  sx: { params: 0, qubits: 1, body: () => [{ m: sqrt2x2(G("x")), q: [0] }] },
  rx: { params: 1, qubits: 1, body: ([t]) => [call("U", [t, -PI / 2, PI / 2], [0])] },
  ry: { params: 1, qubits: 1, body: ([t]) => [call("U", [t, 0, 0], [0])] },
  rz: { params: 1, qubits: 1, body: ([l]) => [{ phase: -l / 2 }, call("U", [0, 0, l], [0])] },
  cx: { params: 0, qubits: 2, body: () => [ctrl(G("x"), [0, 1])] },
  cy: { params: 0, qubits: 2, body: () => [ctrl(G("y"), [0, 1])] },
  cz: { params: 0, qubits: 2, body: () => [ctrl(G("z"), [0, 1])] },
  cp: { params: 1, qubits: 2, body: ([l]) => [ctrl(G("p", [l]), [0, 1])] },
  crx: { params: 1, qubits: 2, body: ([t]) => [ctrl(G("rx", [t]), [0, 1])] },
  cry: { params: 1, qubits: 2, body: ([t]) => [ctrl(G("ry", [t]), [0, 1])] },
  crz: { params: 1, qubits: 2, body: ([t]) => [ctrl(G("rz", [t]), [0, 1])] },
  ch: { params: 0, qubits: 2, body: () => [ctrl(G("h"), [0, 1])] },
  swap: {
    params: 0,
    qubits: 2,
    body: () => [call("cx", [], [0, 1]), call("cx", [], [1, 0]), call("cx", [], [0, 1])],
  },
  ccx: { params: 0, qubits: 3, body: () => [{ m: controlled(controlled(G("x"))), q: [0, 1, 2] }] },
  cswap: { params: 0, qubits: 3, body: () => [ctrl(G("swap"), [0, 1, 2])] },
  cu: {
    params: 4,
    qubits: 2,
    body: ([t, p, l, g]) => [call("p", [g], [0]), ctrl(G("U", [t, p, l]), [0, 1])],
  },
  CX: { params: 0, qubits: 2, body: () => [ctrl(G("U", [PI, 0, PI]), [0, 1])] },
  phase: { params: 1, qubits: 1, body: ([l]) => [call("U", [0, 0, l], [0])] },
  cphase: { params: 1, qubits: 2, body: ([l]) => [ctrl(G("phase", [l]), [0, 1])] },
  id: { params: 0, qubits: 1, body: () => [call("U", [0, 0, 0], [0])] },
  u1: { params: 1, qubits: 1, body: ([l]) => [call("U", [0, 0, l], [0])] },
  u2: {
    params: 2,
    qubits: 1,
    body: ([p, l]) => [{ phase: -(p + l) / 2 }, call("U", [PI / 2, p, l], [0])],
  },
  u3: {
    params: 3,
    qubits: 1,
    body: ([t, p, l]) => [{ phase: -(p + l) / 2 }, call("U", [t, p, l], [0])],
  },
};
