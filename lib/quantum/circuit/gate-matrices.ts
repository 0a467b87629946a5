/**
 * Closed-form unitaries of the standard gates, in the layout of types.ts: row-major,
 * interleaved (re, im), first operand = most significant bit of the local index.
 *
 * Formulas (angles in radians, c = cos(θ/2), s = sin(θ/2)):
 * - U3(θ,φ,λ) = [[c, −e^{iλ}s], [e^{iφ}s, e^{i(φ+λ)}c]]  (OpenQASM 3 `U`).
 * - U_2.0(θ,φ,λ) = Rz(φ)Ry(θ)Rz(λ) = e^{−i(φ+λ)/2}·U3(θ,φ,λ)  (OpenQASM 2.0 `U`,
 *   arXiv:1707.03429 §2); the two differ by a global phase only.
 * - Rx(θ) = e^{−iθX/2}, Ry(θ) = e^{−iθY/2}, Rz(λ) = diag(e^{−iλ/2}, e^{iλ/2}), P(λ) = diag(1, e^{iλ}).
 * - Controlled gates are diag-block [I, V] with the control(s) first.
 * - Rxx(θ) = e^{−iθ X⊗X/2}, Rzz(θ) = e^{−iθ Z⊗Z/2}.
 */

/** A complex number as [re, im]. */
export type Cx = readonly [number, number];

const ZERO: Cx = [0, 0];
const ONE: Cx = [1, 0];
const I: Cx = [0, 1];

export function cis(a: number): Cx {
  return [Math.cos(a), Math.sin(a)];
}

function scale(a: Cx, r: number): Cx {
  return [a[0] * r, a[1] * r];
}

/** Builds the interleaved row-major matrix of a square array of complex entries. */
export function fromRows(rows: Cx[][]): Float64Array {
  const d = rows.length;
  const out = new Float64Array(2 * d * d);
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) {
      out[2 * (r * d + c)] = rows[r][c][0];
      out[2 * (r * d + c) + 1] = rows[r][c][1];
    }
  }
  return out;
}

export function diag(entries: Cx[]): Float64Array {
  return fromRows(entries.map((e, r) => entries.map((_, c) => (r === c ? e : ZERO))));
}

/** Multiplies every entry by the complex number z. */
export function scaled(m: Float64Array, z: Cx): Float64Array {
  const out = new Float64Array(m.length);
  for (let k = 0; k < m.length; k += 2) {
    out[k] = m[k] * z[0] - m[k + 1] * z[1];
    out[k + 1] = m[k] * z[1] + m[k + 1] * z[0];
  }
  return out;
}

/** Block-diagonal [I, V]: one control qubit (first operand) on the gate V. */
export function controlled(v: Float64Array): Float64Array {
  const dv = Math.round(Math.sqrt(v.length / 2));
  const d = 2 * dv;
  const out = new Float64Array(2 * d * d);
  for (let k = 0; k < dv; k++) out[2 * (k * d + k)] = 1;
  for (let r = 0; r < dv; r++) {
    for (let c = 0; c < dv; c++) {
      const o = 2 * ((dv + r) * d + dv + c);
      out[o] = v[2 * (r * dv + c)];
      out[o + 1] = v[2 * (r * dv + c) + 1];
    }
  }
  return out;
}

export function u3(theta: number, phi: number, lambda: number): Float64Array {
  const c = Math.cos(theta / 2);
  const s = Math.sin(theta / 2);
  return fromRows([
    [[c, 0], scale(cis(lambda), -s)],
    [scale(cis(phi), s), scale(cis(phi + lambda), c)],
  ]);
}

/** OpenQASM 2.0 built-in U(θ,φ,λ) = Rz(φ)Ry(θ)Rz(λ). */
export function uQasm2(theta: number, phi: number, lambda: number): Float64Array {
  return scaled(u3(theta, phi, lambda), cis(-(phi + lambda) / 2));
}

export function rx(theta: number): Float64Array {
  const c = Math.cos(theta / 2);
  const s = Math.sin(theta / 2);
  return fromRows([
    [
      [c, 0],
      [0, -s],
    ],
    [
      [0, -s],
      [c, 0],
    ],
  ]);
}

export function ry(theta: number): Float64Array {
  const c = Math.cos(theta / 2);
  const s = Math.sin(theta / 2);
  return fromRows([
    [
      [c, 0],
      [-s, 0],
    ],
    [
      [s, 0],
      [c, 0],
    ],
  ]);
}

export function rz(lambda: number): Float64Array {
  return diag([cis(-lambda / 2), cis(lambda / 2)]);
}

export function phase(lambda: number): Float64Array {
  return diag([ONE, cis(lambda)]);
}

const R = Math.SQRT1_2;
export const X = fromRows([
  [ZERO, ONE],
  [ONE, ZERO],
]);
export const Y = fromRows([
  [ZERO, [0, -1]],
  [I, ZERO],
]);
export const Z = diag([ONE, [-1, 0]]);
export const H = fromRows([
  [
    [R, 0],
    [R, 0],
  ],
  [
    [R, 0],
    [-R, 0],
  ],
]);
export const ID = diag([ONE, ONE]);
/** √X = ½[[1+i, 1−i], [1−i, 1+i]] (principal square root of X). */
export const SX = fromRows([
  [
    [0.5, 0.5],
    [0.5, -0.5],
  ],
  [
    [0.5, -0.5],
    [0.5, 0.5],
  ],
]);
export const SXDG = fromRows([
  [
    [0.5, -0.5],
    [0.5, 0.5],
  ],
  [
    [0.5, 0.5],
    [0.5, -0.5],
  ],
]);

export const SWAP = fromRows([
  [ONE, ZERO, ZERO, ZERO],
  [ZERO, ZERO, ONE, ZERO],
  [ZERO, ONE, ZERO, ZERO],
  [ZERO, ZERO, ZERO, ONE],
]);

export function rxx(theta: number): Float64Array {
  const c: Cx = [Math.cos(theta / 2), 0];
  const m: Cx = [0, -Math.sin(theta / 2)];
  return fromRows([
    [c, ZERO, ZERO, m],
    [ZERO, c, m, ZERO],
    [ZERO, m, c, ZERO],
    [m, ZERO, ZERO, c],
  ]);
}

export function rzz(theta: number): Float64Array {
  const a = cis(-theta / 2);
  const b = cis(theta / 2);
  return diag([a, b, b, a]);
}

/** e^{iγ}·U3(θ,φ,λ), the target block of OpenQASM 3 `cu`. */
export function u3WithPhase(
  theta: number,
  phi: number,
  lambda: number,
  gamma: number,
): Float64Array {
  return scaled(u3(theta, phi, lambda), cis(gamma));
}
