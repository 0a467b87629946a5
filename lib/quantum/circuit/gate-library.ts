/**
 * The standard gates of both dialects as primitives: each has a closed-form matrix
 * (gate-matrices.ts) and an OpenQASM 2.0 rendering that uses only the gates of the
 * OpenQASM 2.0 paper's qelib1.inc (so exported text runs on any OpenQASM 2.0 tool).
 *
 * Sources of the definitions:
 * - OpenQASM 2.0 built-ins `U`, `CX` and qelib1.inc (u3 … cu3): Cross, Bishop, Smolin,
 *   Gambetta, arXiv:1707.03429, §2–3. Each matrix equals the paper's decomposition up to
 *   a global phase of the whole gate (checked gate by gate in the unit tests); e.g. the
 *   paper's crz is diag(1, 1, e^{−iλ/2}, e^{iλ/2}), cu1 is diag(1, 1, 1, e^{iλ}), and cu3
 *   is exactly controlled-[Rz(φ)Ry(θ)Rz(λ)] (not controlled-U3, which differs by a phase
 *   on the control).
 * - Later additions to qelib1.inc (not in the paper): `swap`, `cswap`, `sx`, `p`, `cp`,
 *   `crx`, `cry` and 4-parameter `cu(θ,φ,λ,γ)` follow the OpenQASM 3 stdgates.inc
 *   definitions (openqasm.com live specification); `u(θ,φ,λ)` is an alias of the
 *   built-in U; `sxdg` = sx†; `rxx(θ)` = e^{−iθX⊗X/2} and `rzz(θ)` = e^{−iθZ⊗Z/2}
 *   (common practice for these interaction gates).
 * - OpenQASM 3 stdgates.inc, including its OpenQASM 2 compatibility names
 *   (CX, phase, cphase, id, u1, u2, u3); the built-in U is U3 above.
 */
import * as M from "./gate-matrices";
import type { GateModification } from "./modified-gates";

export interface PrimitiveGate {
  /** Lower-case name of the primitive (GateApplication.name). */
  name: string;
  numParams: number;
  numQubits: number;
  /** Closed-form unitary for numeric parameters (fresh array). */
  matrix(p: readonly number[]): Float64Array;
  /** OpenQASM 2.0 statements (paper qelib1.inc gates only) for numeric parameters. */
  emit(p: readonly number[], q: readonly string[]): string[];
  /** Set on gates made by OpenQASM 3 modifiers (`ctrl @`, `inv @`…): see modified-gates.ts. */
  modification?: GateModification;
}

/**
 * Formats a number as an OpenQASM 2.0 real (the grammar requires a '.' before an
 * exponent), shortest round-trip digits: 0.1 → "0.1", 1e-7 → "1.0e-7", 3 → "3".
 */
export function qasmNumber(x: number): string {
  if (Object.is(x, -0)) return "0";
  const s = String(x);
  const e = s.indexOf("e");
  if (e >= 0 && !s.slice(0, e).includes(".")) return `${s.slice(0, e)}.0${s.slice(e)}`;
  return s;
}

/** One OpenQASM 2.0 gate statement, e.g. `cu3(0.1,0,3.14) q[0],q[1];`. */
export function qasmCall(name: string, p: readonly number[], q: readonly string[]): string {
  const params = p.length > 0 ? `(${p.map(qasmNumber).join(",")})` : "";
  return `${name}${params} ${q.join(",")};`;
}

function gate(
  name: string,
  numParams: number,
  numQubits: number,
  matrix: (p: readonly number[]) => Float64Array,
  emit?: (p: readonly number[], q: readonly string[]) => string[],
): PrimitiveGate {
  return { name, numParams, numQubits, matrix, emit: emit ?? ((p, q) => [qasmCall(name, p, q)]) };
}

const HALF_PI = Math.PI / 2;

// One-qubit gates. A standalone one-qubit gate's global phase is unobservable, so the
// OpenQASM 2.0 rendering may use any qelib1 gate equal up to phase.
const u = gate(
  "u",
  3,
  1,
  (p) => M.uQasm2(p[0], p[1], p[2]),
  (p, q) => [qasmCall("u3", p, q)],
);
const uStd = gate(
  "u",
  3,
  1,
  (p) => M.u3(p[0], p[1], p[2]),
  (p, q) => [qasmCall("u3", p, q)],
);
// u3/u2 = U_2.0 exactly: qelib1.inc defines them as U (= Rz Ry Rz), stdgates.inc as
// gphase(−(φ+λ)/2); U(…) — the same matrix, which matters under `ctrl @`.
const u3 = gate("u3", 3, 1, (p) => M.uQasm2(p[0], p[1], p[2]));
const u2 = gate("u2", 2, 1, (p) => M.uQasm2(HALF_PI, p[0], p[1]));
const u1 = gate("u1", 1, 1, (p) => M.phase(p[0]));
const p = gate(
  "p",
  1,
  1,
  (a) => M.phase(a[0]),
  (a, q) => [qasmCall("u1", a, q)],
);
const id = gate("id", 0, 1, () => M.ID.slice());
const x = gate("x", 0, 1, () => M.X.slice());
const y = gate("y", 0, 1, () => M.Y.slice());
const z = gate("z", 0, 1, () => M.Z.slice());
const h = gate("h", 0, 1, () => M.H.slice());
const s = gate("s", 0, 1, () => M.phase(HALF_PI));
const sdg = gate("sdg", 0, 1, () => M.phase(-HALF_PI));
const t = gate("t", 0, 1, () => M.phase(Math.PI / 4));
const tdg = gate("tdg", 0, 1, () => M.phase(-Math.PI / 4));
const rx = gate("rx", 1, 1, (a) => M.rx(a[0]));
const ry = gate("ry", 1, 1, (a) => M.ry(a[0]));
const rz = gate("rz", 1, 1, (a) => M.rz(a[0]));
// √X = e^{iπ/4}·Rx(π/2) and Rx(θ) = U(θ, −π/2, π/2).
const sx = gate(
  "sx",
  0,
  1,
  () => M.SX.slice(),
  (_, q) => [qasmCall("u3", [HALF_PI, -HALF_PI, HALF_PI], q)],
);
const sxdg = gate(
  "sxdg",
  0,
  1,
  () => M.SXDG.slice(),
  (_, q) => [qasmCall("u3", [-HALF_PI, -HALF_PI, HALF_PI], q)],
);

// Two- and three-qubit gates (control first).
const cx = gate("cx", 0, 2, () => M.controlled(M.X));
const cy = gate("cy", 0, 2, () => M.controlled(M.Y));
const cz = gate("cz", 0, 2, () => M.controlled(M.Z));
const ch = gate("ch", 0, 2, () => M.controlled(M.H));
const crz = gate("crz", 1, 2, (a) => M.controlled(M.rz(a[0])));
// Controlled-Rx(θ) = controlled-[Rz(−π/2)Ry(θ)Rz(π/2)] = cu3(θ, −π/2, π/2) exactly.
const crx = gate(
  "crx",
  1,
  2,
  (a) => M.controlled(M.rx(a[0])),
  (a, q) => [qasmCall("cu3", [a[0], -HALF_PI, HALF_PI], q)],
);
const cry = gate(
  "cry",
  1,
  2,
  (a) => M.controlled(M.ry(a[0])),
  (a, q) => [qasmCall("cu3", [a[0], 0, 0], q)],
);
const cu1 = gate("cu1", 1, 2, (a) => M.controlled(M.phase(a[0])));
const cp = gate(
  "cp",
  1,
  2,
  (a) => M.controlled(M.phase(a[0])),
  (a, q) => [qasmCall("cu1", a, q)],
);
const cu3 = gate("cu3", 3, 2, (a) => M.controlled(M.uQasm2(a[0], a[1], a[2])));
// cu(θ,φ,λ,γ) = P(γ) on the control then controlled-U3; U3 = e^{i(φ+λ)/2}·U_2.0, so it is
// u1(γ + (φ+λ)/2) on the control followed by cu3(θ,φ,λ).
const cu = gate(
  "cu",
  4,
  2,
  (a) => M.controlled(M.u3WithPhase(a[0], a[1], a[2], a[3])),
  (a, q) => [
    qasmCall("u1", [a[3] + (a[1] + a[2]) / 2], [q[0]]),
    qasmCall("cu3", [a[0], a[1], a[2]], q),
  ],
);
const swap = gate(
  "swap",
  0,
  2,
  () => M.SWAP.slice(),
  (_, q) => [
    qasmCall("cx", [], [q[0], q[1]]),
    qasmCall("cx", [], [q[1], q[0]]),
    qasmCall("cx", [], [q[0], q[1]]),
  ],
);
// Rzz(θ) = CX·(I⊗Rz(θ))·CX; Rxx(θ) = (H⊗H)·Rzz(θ)·(H⊗H).
const rzz = gate(
  "rzz",
  1,
  2,
  (a) => M.rzz(a[0]),
  (a, q) => [qasmCall("cx", [], q), qasmCall("rz", a, [q[1]]), qasmCall("cx", [], q)],
);
const rxx = gate(
  "rxx",
  1,
  2,
  (a) => M.rxx(a[0]),
  (a, q) => [
    qasmCall("h", [], [q[0]]),
    qasmCall("h", [], [q[1]]),
    qasmCall("cx", [], q),
    qasmCall("rz", a, [q[1]]),
    qasmCall("cx", [], q),
    qasmCall("h", [], [q[0]]),
    qasmCall("h", [], [q[1]]),
  ],
);
const ccx = gate("ccx", 0, 3, () => M.controlled(M.controlled(M.X)));
// Fredkin = CX(c→b)·Toffoli(a,b→c)·CX(c→b).
const cswap = gate(
  "cswap",
  0,
  3,
  () => M.controlled(M.SWAP),
  (_, q) => [
    qasmCall("cx", [], [q[2], q[1]]),
    qasmCall("ccx", [], q),
    qasmCall("cx", [], [q[2], q[1]]),
  ],
);

export type GateTable = ReadonlyMap<string, PrimitiveGate>;

/** OpenQASM 2.0 built-ins (available without any include). */
export const QASM2_BUILTINS: GateTable = table(
  [],
  [
    ["U", u],
    ["CX", cx],
  ],
);

/** qelib1.inc as published with the OpenQASM 2.0 paper. */
function table(gates: PrimitiveGate[], extra: [string, PrimitiveGate][] = []): GateTable {
  return new Map<string, PrimitiveGate>([
    ...gates.map((g): [string, PrimitiveGate] => [g.name, g]),
    ...extra,
  ]);
}

export const QELIB1: GateTable = table([
  u3,
  u2,
  u1,
  cx,
  id,
  x,
  y,
  z,
  h,
  s,
  sdg,
  t,
  tdg,
  rx,
  ry,
  rz,
  cz,
  cy,
  ch,
  ccx,
  crz,
  cu1,
  cu3,
]);

/** Common later additions to qelib1.inc; a user `gate` of the same name replaces one. */
export const QELIB1_ADDITIONS: GateTable = table([
  swap,
  cswap,
  rxx,
  rzz,
  sx,
  sxdg,
  p,
  cp,
  crx,
  cry,
  cu,
  u,
]);

/**
 * OpenQASM 3 `gphase(γ)`: the global phase e^{iγ} on no qubit. Alone it changes nothing
 * observable (it is dropped); inside a gate body or under `ctrl @` it is a relative phase.
 */
const gphase = gate(
  "gphase",
  1,
  0,
  (a) => new Float64Array([Math.cos(a[0]), Math.sin(a[0])]),
  () => [],
);

/** OpenQASM 3 built-ins (no include needed): U and gphase. */
export const QASM3_BUILTINS: GateTable = table([gphase], [["U", uStd]]);

/** OpenQASM 3 stdgates.inc. */
export const STDGATES: GateTable = table(
  [
    p,
    x,
    y,
    z,
    h,
    s,
    sdg,
    t,
    tdg,
    sx,
    rx,
    ry,
    rz,
    cx,
    cy,
    cz,
    cp,
    crx,
    cry,
    crz,
    ch,
    swap,
    ccx,
    cswap,
    cu,
    id,
    u1,
    u2,
    u3,
  ],
  [
    ["CX", cx],
    ["phase", { ...p, name: "phase" }],
    ["cphase", { ...cp, name: "cphase" }],
  ],
);
