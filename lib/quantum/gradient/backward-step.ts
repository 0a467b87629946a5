/**
 * One backward step of the adjoint sweep on a fused block of one or two qubits, in a
 * single pass over both vectors (adjoint.ts): per group of amplitudes,
 *   φ ← U φ (U = B†);  R[a][b] += conj(λ_a)·φ_b for the requested entries;  λ ← U λ,
 * instead of three passes (two kernel applications and a cross-matrix pass). The cross
 * matrix is the one of local-cross.ts (λ after the block, φ before it).
 *
 * Two-qubit steps are generated per structure — the non-zero pattern of U and the set of
 * R entries — and cached, so the loop holds U and the sums in locals with the zero
 * entries of U left out (a cx fused with rotations on its target has 8 of 16). U's values
 * are read at the start of each call; only bit positions enter the generated source.
 */

type Step2q = (
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  o1: number,
  o2: number,
  u: Float64Array,
  out: Float64Array,
  updateLambda: boolean,
) => void;

const cache = new Map<string, Step2q>();
const MAX_CACHED = 256;

function product(v: string, pattern: number, r: number): { re: string; im: string } {
  const re: string[] = [];
  const im: string[] = [];
  for (let c = 0; c < 4; c++) {
    if (!((pattern >> (4 * r + c)) & 1)) continue;
    re.push(`u${r}${c}r * ${v}r${c} - u${r}${c}i * ${v}i${c}`);
    im.push(`u${r}${c}r * ${v}i${c} + u${r}${c}i * ${v}r${c}`);
  }
  return { re: re.join(" + ") || "0", im: im.join(" + ") || "0" };
}

function compile2q(pattern: number, needed: number, transform: boolean): Step2q {
  const entries: number[] = [];
  for (let e = 0; e < 16; e++) if ((pattern >> e) & 1) entries.push(e);
  const used: number[] = [];
  for (let e = 0; e < 16; e++) if ((needed >> e) & 1) used.push(e);
  const L: string[] = [];
  for (const e of entries)
    L.push(`const u${e >> 2}${e & 3}r = u[${2 * e}], u${e >> 2}${e & 3}i = u[${2 * e + 1}];`);
  for (const e of used) L.push(`let s${e}r = 0, s${e}i = 0;`);
  L.push("const mask = o1 | o2, notMask = ~mask, count = pre.length >>> 2;");
  L.push("for (let t = 0, b0 = 0; t < count; t++, b0 = ((b0 | mask) + 1) & notMask) {");
  L.push("const b1 = b0 | o1, b2 = b0 | o2, b3 = b0 | mask;");
  for (let a = 0; a < 4; a++) L.push(`const pr${a} = pre[b${a}], pi${a} = pim[b${a}];`);
  for (let r = 0; r < 4; r++) {
    if (!transform) {
      L.push(`const qr${r} = pr${r}, qi${r} = pi${r};`);
      continue;
    }
    const p = product("p", pattern, r);
    L.push(`const qr${r} = ${p.re}, qi${r} = ${p.im};`);
    L.push(`pre[b${r}] = qr${r}; pim[b${r}] = qi${r};`);
  }
  for (let a = 0; a < 4; a++) L.push(`const lr${a} = lre[b${a}], li${a} = lim[b${a}];`);
  for (const e of used) {
    const a = e >> 2,
      b = e & 3;
    L.push(`s${e}r += lr${a} * qr${b} + li${a} * qi${b};`);
    L.push(`s${e}i += lr${a} * qi${b} - li${a} * qr${b};`);
  }
  if (transform) {
    L.push("if (updateLambda) {");
    for (let r = 0; r < 4; r++) {
      const p = product("l", pattern, r);
      L.push(`lre[b${r}] = ${p.re}; lim[b${r}] = ${p.im};`);
    }
    L.push("}");
  }
  L.push("}");
  for (const e of used) L.push(`out[${2 * e}] = s${e}r; out[${2 * e + 1}] = s${e}i;`);
  return new Function(
    "lre",
    "lim",
    "pre",
    "pim",
    "o1",
    "o2",
    "u",
    "out",
    "updateLambda",
    L.join("\n"),
  ) as Step2q;
}

/** Bit e set when entry e of the interleaved d×d matrix is not exactly zero. */
export function nonZeroPattern(m: Float64Array): number {
  let bits = 0;
  for (let e = 0; 2 * e < m.length; e++) if (m[2 * e] !== 0 || m[2 * e + 1] !== 0) bits |= 1 << e;
  return bits;
}

/**
 * The step on bits `bits` (one or two) with U = B† (interleaved 2^k × 2^k): updates φ and,
 * when `updateLambda`, λ in place; returns R (entries outside `needed` are 0).
 */
export function backwardStep(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  u: Float64Array,
  needed: number,
  updateLambda: boolean,
): Float64Array {
  if (bits.length === 1) return step1q(lre, lim, pre, pim, bits[0], u, updateLambda);
  return run2q(lre, lim, pre, pim, bits, u, needed, updateLambda, true);
}

/**
 * R alone (no update), for vectors in a kernel memory: there B† runs faster through the
 * SIMD kernels (two extra passes) than inside the scalar one-pass step.
 */
export function crossOnly(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  needed: number,
): Float64Array {
  if (bits.length === 1)
    return step1q(lre, lim, pre, pim, bits[0], Float64Array.of(1, 0, 0, 0, 0, 0, 1, 0), false);
  return run2q(lre, lim, pre, pim, bits, new Float64Array(32), needed, false, false);
}

function run2q(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  bits: readonly number[],
  u: Float64Array,
  needed: number,
  updateLambda: boolean,
  transform: boolean,
): Float64Array {
  const pattern = transform ? nonZeroPattern(u) : 0;
  const key = `${pattern}:${needed}:${transform}`;
  let step = cache.get(key);
  if (!step) {
    step = compile2q(pattern, needed, transform);
    if (cache.size < MAX_CACHED) cache.set(key, step);
  }
  const out = new Float64Array(32);
  const o1 = 1 << bits[1];
  const o2 = 1 << bits[0];
  step(lre, lim, pre, pim, o1, o2, u, out, updateLambda);
  return out;
}

function step1q(
  lre: Float64Array,
  lim: Float64Array,
  pre: Float64Array,
  pim: Float64Array,
  q: number,
  u: Float64Array,
  updateLambda: boolean,
): Float64Array {
  const ar = u[0],
    ai = u[1],
    br = u[2],
    bi = u[3],
    cr = u[4],
    ci = u[5],
    dr = u[6],
    di = u[7];
  const len = pre.length;
  const half = 1 << q;
  const step = half << 1;
  let r00 = 0,
    i00 = 0,
    r01 = 0,
    i01 = 0,
    r10 = 0,
    i10 = 0,
    r11 = 0,
    i11 = 0;
  for (let blk = 0; blk < len; blk += step) {
    for (let i = blk, j = blk + half, end = blk + half; i < end; i++, j++) {
      const x0 = pre[i],
        y0 = pim[i],
        x1 = pre[j],
        y1 = pim[j];
      const p0 = ar * x0 - ai * y0 + br * x1 - bi * y1;
      const q0 = ar * y0 + ai * x0 + br * y1 + bi * x1;
      const p1 = cr * x0 - ci * y0 + dr * x1 - di * y1;
      const q1 = cr * y0 + ci * x0 + dr * y1 + di * x1;
      pre[i] = p0;
      pim[i] = q0;
      pre[j] = p1;
      pim[j] = q1;
      const a0 = lre[i],
        b0 = lim[i],
        a1 = lre[j],
        b1 = lim[j];
      r00 += a0 * p0 + b0 * q0;
      i00 += a0 * q0 - b0 * p0;
      r01 += a0 * p1 + b0 * q1;
      i01 += a0 * q1 - b0 * p1;
      r10 += a1 * p0 + b1 * q0;
      i10 += a1 * q0 - b1 * p0;
      r11 += a1 * p1 + b1 * q1;
      i11 += a1 * q1 - b1 * p1;
      if (updateLambda) {
        lre[i] = ar * a0 - ai * b0 + br * a1 - bi * b1;
        lim[i] = ar * b0 + ai * a0 + br * b1 + bi * a1;
        lre[j] = cr * a0 - ci * b0 + dr * a1 - di * b1;
        lim[j] = cr * b0 + ci * a0 + dr * b1 + di * a1;
      }
    }
  }
  return Float64Array.of(r00, i00, r01, i01, r10, i10, r11, i11);
}
