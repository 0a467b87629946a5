/**
 * Gates changed by OpenQASM 3 modifiers (live specification, "Quantum gate modifiers"):
 * - `inv @ g` is g† (conjugate transpose, global phase included);
 * - `ctrl @ g` / `negctrl @ g` is g controlled on |1⟩ / |0⟩ of one more qubit, written
 *   first: block-diagonal with g in the block where the control reads 1 (resp. 0) and the
 *   identity elsewhere, so the global phase of g becomes a relative phase;
 * - `pow(k) @ g` for an integer k is g applied k times (g† applied |k| times for k < 0);
 *   it is expanded into repeated parts and never reaches this module.
 *
 * A modified primitive is a PrimitiveGate like any other (its matrix is exact, phases
 * included), with `modification` telling which base gate it derives from. Consumers that
 * need more than the matrix (e.g. the derivative with respect to a parameter) can use
 * it: the matrix is `embed(controls, inverse ? B(p)† : B(p))` with B the base matrix, so
 * ∂/∂p of it is the same embedding of ∂B/∂p (or (∂B/∂p)†) with zeros outside the g block.
 */
import { EngineError } from "../errors";
import { qasmCall, type PrimitiveGate } from "./gate-library";
import { plural } from "./circuit-errors";

export interface GateModification {
  /** The unmodified primitive (never itself modified). */
  base: PrimitiveGate;
  /** One entry per control qubit, in operand order: true = ctrl (on |1⟩), false = negctrl (on |0⟩). */
  controls: readonly boolean[];
  /** True when the base matrix is replaced by its conjugate transpose. */
  inverse: boolean;
}

/** Conjugate transpose of an interleaved square matrix. */
export function adjoint(m: Float64Array): Float64Array {
  const d = Math.round(Math.sqrt(m.length / 2));
  const out = new Float64Array(m.length);
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) {
      out[2 * (c * d + r)] = m[2 * (r * d + c)];
      out[2 * (c * d + r) + 1] = -m[2 * (r * d + c) + 1];
    }
  }
  return out;
}

/** Identity, except the block where the control qubits (first operands) read `controls`. */
export function withControls(v: Float64Array, controls: readonly boolean[]): Float64Array {
  if (controls.length === 0) return v;
  const dv = Math.round(Math.sqrt(v.length / 2));
  const d = dv << controls.length;
  let block = 0;
  for (const c of controls) block = (block << 1) | (c ? 1 : 0);
  const out = new Float64Array(2 * d * d);
  for (let k = 0; k < d; k++) out[2 * (k * d + k)] = 1;
  const o = block * dv;
  for (let r = 0; r < dv; r++) {
    out[2 * ((o + r) * d + o + r)] = 0;
    for (let c = 0; c < dv; c++) {
      out[2 * ((o + r) * d + o + c)] = v[2 * (r * dv + c)];
      out[2 * ((o + r) * d + o + c) + 1] = v[2 * (r * dv + c) + 1];
    }
  }
  return out;
}

/**
 * Z-Y-Z angles of a 2×2 unitary W = e^{iα}·Rz(β)Ry(γ)Rz(δ) (N&C Theorem 4.1). With the
 * OpenQASM 2.0 built-in U(θ,φ,λ) = Rz(φ)Ry(θ)Rz(λ), W = e^{iα}·u3(γ, β, δ).
 */
export function zyz(w: Float64Array): {
  alpha: number;
  beta: number;
  gamma: number;
  delta: number;
} {
  const detRe = w[0] * w[6] - w[1] * w[7] - (w[2] * w[4] - w[3] * w[5]);
  const detIm = w[0] * w[7] + w[1] * w[6] - (w[2] * w[5] + w[3] * w[4]);
  const alpha = Math.atan2(detIm, detRe) / 2;
  // V = e^{−iα}W = [[e^{−i(β+δ)/2}c, ·], [e^{i(β−δ)/2}s, ·]].
  const ca = Math.cos(-alpha);
  const sa = Math.sin(-alpha);
  const aRe = w[0] * ca - w[1] * sa;
  const aIm = w[0] * sa + w[1] * ca;
  const bRe = w[4] * ca - w[5] * sa;
  const bIm = w[4] * sa + w[5] * ca;
  const gamma = 2 * Math.atan2(Math.hypot(bRe, bIm), Math.hypot(aRe, aIm));
  const sum = Math.hypot(aRe, aIm) > 1e-12 ? -2 * Math.atan2(aIm, aRe) : 0;
  const diff = Math.hypot(bRe, bIm) > 1e-12 ? 2 * Math.atan2(bIm, bRe) : 0;
  return { alpha, beta: (sum + diff) / 2, gamma, delta: (sum - diff) / 2 };
}

const cache = new WeakMap<PrimitiveGate, Map<string, PrimitiveGate>>();

/**
 * `gate` with `controls` added in front of its operands (outermost first) and, when
 * `invert`, inverted. Modifying a modified gate composes: inv(ctrl(g)) = ctrl(inv(g)).
 * The same (base, modification) always returns the same object.
 */
export function modifyGate(
  gate: PrimitiveGate,
  controls: readonly boolean[],
  invert: boolean,
): PrimitiveGate {
  const m = gate.modification ?? { base: gate, controls: [], inverse: false };
  const all = [...controls, ...m.controls];
  const inverse = m.inverse !== invert;
  if (all.length === 0 && !inverse) return m.base;
  const key = `${all.map((c) => (c ? "1" : "0")).join("")}${inverse ? "i" : ""}`;
  let byKey = cache.get(m.base);
  if (byKey === undefined) {
    byKey = new Map();
    cache.set(m.base, byKey);
  }
  let g = byKey.get(key);
  if (g === undefined) {
    g = build({ base: m.base, controls: all, inverse });
    byKey.set(key, g);
  }
  return g;
}

function build(mod: GateModification): PrimitiveGate {
  const { base, controls, inverse } = mod;
  const words = [...controls.map((c) => (c ? "ctrl" : "negctrl")), ...(inverse ? ["inv"] : [])];
  return {
    name: `${words.join(" @ ")} @ ${base.name}`,
    numParams: base.numParams,
    numQubits: base.numQubits + controls.length,
    matrix: (p) => {
      const b = base.matrix(p);
      return withControls(inverse ? adjoint(b) : b, controls);
    },
    emit: (p, q) => emitModified(mod, p, q),
    modification: mod,
  };
}

function notExportable(mod: GateModification, name: string): EngineError {
  return new EngineError(
    "unsupported",
    `'${name}' (${plural(mod.controls.length, "control")} on '${mod.base.name}') has no rendering with the gates of qelib1.inc, so this circuit cannot be exported as OpenQASM 2.0`,
  );
}

const IS_X = (v: Float64Array) =>
  v.length === 8 && Math.abs(v[2] - 1) < 1e-12 && Math.abs(v[4] - 1) < 1e-12;

/**
 * OpenQASM 2.0 (paper qelib1.inc) statements equal to the modified gate — up to a global
 * phase when there is no control, exactly otherwise. Covered: any inverse of a one-qubit
 * gate (u3), the inverse of a self-inverse or angle-negating multi-qubit gate, one
 * control (negated ones conjugated by x) on a one-qubit gate (u1 + cu3 from the Z-Y-Z
 * angles, N&C Corollary 4.2) or on gphase (u1), two controls on x (ccx), one control on
 * cx (ccx) or swap (cswap). Anything else is refused with an "unsupported" error.
 */
function emitModified(mod: GateModification, p: readonly number[], q: readonly string[]): string[] {
  const { base, controls, inverse } = mod;
  const name = `${controls.map((c) => (c ? "ctrl" : "negctrl")).join(" @ ")}${inverse ? " @ inv" : ""} @ ${base.name}`;
  const v = inverse ? adjoint(base.matrix(p)) : base.matrix(p);
  const c = controls.length;
  if (c === 0) {
    if (base.numQubits === 0) return [];
    if (base.numQubits === 1) {
      const a = zyz(v);
      return [qasmCall("u3", [a.gamma, a.beta, a.delta], q)];
    }
    const inv = INVERSE_PARAMS[base.name];
    if (inv !== undefined) return base.emit(inv(p), q);
    throw notExportable(mod, name);
  }
  const flips = controls.flatMap((on, i) => (on ? [] : [qasmCall("x", [], [q[i]])]));
  const body = (): string[] => {
    const t = q.slice(c);
    if (base.numQubits === 0 && c === 1) return [qasmCall("u1", [Math.atan2(v[1], v[0])], [q[0]])];
    if (base.numQubits === 1 && c === 1) {
      const a = zyz(v);
      return [
        qasmCall("u1", [a.alpha], [q[0]]),
        qasmCall("cu3", [a.gamma, a.beta, a.delta], [q[0], t[0]]),
      ];
    }
    if (base.numQubits === 1 && c === 2 && IS_X(v)) return [qasmCall("ccx", [], q)];
    if (c === 1 && !inverse && base.name === "cx") return [qasmCall("ccx", [], q)];
    if (c === 1 && base.name === "swap")
      return [
        qasmCall("cx", [], [t[1], t[0]]),
        qasmCall("ccx", [], q),
        qasmCall("cx", [], [t[1], t[0]]),
      ];
    throw notExportable(mod, name);
  };
  return [...flips, ...body(), ...flips];
}

const negate = (p: readonly number[]) => p.map((x) => -x);
const same = (p: readonly number[]) => [...p];

/** Parameters of the inverse of a multi-qubit primitive, as the same primitive (exact). */
const INVERSE_PARAMS: Record<string, (p: readonly number[]) => number[]> = {
  cx: same,
  CX: same,
  cy: same,
  cz: same,
  ch: same,
  swap: same,
  ccx: same,
  cswap: same,
  crx: negate,
  cry: negate,
  crz: negate,
  cp: negate,
  cphase: negate,
  cu1: negate,
  rxx: negate,
  rzz: negate,
  // U(θ,φ,λ)† = U(−θ,−λ,−φ) for both forms of U, so the controlled versions invert alike.
  cu3: ([t, ph, l]) => [-t, -l, -ph],
  cu: ([t, ph, l, g]) => [-t, -l, -ph, -g],
};
