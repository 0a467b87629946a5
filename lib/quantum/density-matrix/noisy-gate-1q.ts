/**
 * Straight-line one-pass noisy 1-qubit gates for a dense U (noisy-gate.ts has the semantics):
 * per 2×2 block [[a, b], [c, e]] over qubit q, B ← U B U†, then depolarizing p and damping
 * γ, λ — the formulas of noise/channels.ts (noiseAfter1q), N&C §8.3.4–8.3.6.
 */
import type { DensityMatrix } from "../types";
import { wasmNoisy1q } from "../wasm/kernels";
import { wasmBinding } from "../wasm/runtime";
import type { GateNoise } from "./noisy-gate";

/**
 * Dense 1-qubit U and its noise, straight-line: per 2×2 block [[a, b], [c, e]] over qubit q,
 * B ← U B U†, then depolarizing p and damping γ, λ (formulas as in channels.ts noiseAfter1q).
 */
export function noisy1qDense(
  rho: DensityMatrix,
  q: number,
  m: Float64Array,
  noise: GateNoise,
): void {
  const { re, im } = rho;
  const c1 = 1 << q;
  const r1 = 1 << (q + rho.n);
  const rc = r1 | c1;
  const notMask = ~rc;
  const p = noise.p;
  const gamma = noise.gamma[0] ?? 0;
  const lambda = noise.lambda[0] ?? 0;
  const keep = 1 - p;
  const mix = p / 2;
  const coh = keep * Math.sqrt(1 - gamma) * Math.sqrt(1 - lambda);
  const pop = 1 - gamma;
  const ar = m[0],
    ai = m[1],
    br = m[2],
    bi = m[3],
    cr = m[4],
    ci = m[5],
    er = m[6],
    ei = m[7];
  const count = re.length >>> 2;
  const real = ai === 0 && bi === 0 && ci === 0 && ei === 0;
  // ρ in a kernel memory: the SIMD kernel (bit-identical; qubit 0 pairs inside a vector stay here)
  const w = q >= 1 ? wasmBinding(re, im) : undefined;
  if (w) {
    wasmNoisy1q(w, re, im, rho.n, q, m, real, [keep, mix, gamma, pop, coh]);
    return;
  }
  if (real) {
    noisy1qReal(rho, q, ar, br, cr, er, keep, mix, gamma, pop, coh);
    return;
  }
  for (let t = 0, b = 0; t < count; t++, b = ((b | rc) + 1) & notMask) {
    const i01 = b | c1,
      i10 = b | r1,
      i11 = b | rc;
    const x0r = re[b],
      x0i = im[b],
      x1r = re[i01],
      x1i = im[i01];
    const x2r = re[i10],
      x2i = im[i10],
      x3r = re[i11],
      x3i = im[i11];
    // T = U B (B = [[x0, x1], [x2, x3]])
    const t0r = ar * x0r - ai * x0i + br * x2r - bi * x2i;
    const t0i = ar * x0i + ai * x0r + br * x2i + bi * x2r;
    const t1r = ar * x1r - ai * x1i + br * x3r - bi * x3i;
    const t1i = ar * x1i + ai * x1r + br * x3i + bi * x3r;
    const t2r = cr * x0r - ci * x0i + er * x2r - ei * x2i;
    const t2i = cr * x0i + ci * x0r + er * x2i + ei * x2r;
    const t3r = cr * x1r - ci * x1i + er * x3r - ei * x3i;
    const t3i = cr * x1i + ci * x1r + er * x3i + ei * x3r;
    // B' = T U†: B'_{rc} = Σ_j T_{rj} conj(U_{cj})
    const y0r = t0r * ar + t0i * ai + t1r * br + t1i * bi;
    const y0i = t0i * ar - t0r * ai + t1i * br - t1r * bi;
    const y1r = t0r * cr + t0i * ci + t1r * er + t1i * ei;
    const y1i = t0i * cr - t0r * ci + t1i * er - t1r * ei;
    const y2r = t2r * ar + t2i * ai + t3r * br + t3i * bi;
    const y2i = t2i * ar - t2r * ai + t3i * br - t3r * bi;
    const y3r = t2r * cr + t2i * ci + t3r * er + t3i * ei;
    const y3i = t2i * cr - t2r * ci + t3i * er - t3r * ei;
    // depolarizing, then damping
    const mr = mix * (y0r + y3r),
      mi = mix * (y0i + y3i);
    const e3r = keep * y3r + mr,
      e3i = keep * y3i + mi;
    re[b] = keep * y0r + mr + gamma * e3r;
    im[b] = keep * y0i + mi + gamma * e3i;
    re[i11] = pop * e3r;
    im[i11] = pop * e3i;
    re[i01] = coh * y1r;
    im[i01] = coh * y1i;
    re[i10] = coh * y2r;
    im[i10] = coh * y2i;
  }
}

/** noisy1qDense for a real U = [[a, b], [c, e]] (ry, h, …): half the products. */
function noisy1qReal(
  rho: DensityMatrix,
  q: number,
  ar: number,
  br: number,
  cr: number,
  er: number,
  keep: number,
  mix: number,
  gamma: number,
  pop: number,
  coh: number,
): void {
  const { re, im } = rho;
  const c1 = 1 << q;
  const r1 = 1 << (q + rho.n);
  const rc = r1 | c1;
  const notMask = ~rc;
  const count = re.length >>> 2;
  for (let t = 0, b = 0; t < count; t++, b = ((b | rc) + 1) & notMask) {
    const i01 = b | c1,
      i10 = b | r1,
      i11 = b | rc;
    const x0r = re[b],
      x0i = im[b],
      x1r = re[i01],
      x1i = im[i01];
    const x2r = re[i10],
      x2i = im[i10],
      x3r = re[i11],
      x3i = im[i11];
    const t0r = ar * x0r + br * x2r,
      t0i = ar * x0i + br * x2i;
    const t1r = ar * x1r + br * x3r,
      t1i = ar * x1i + br * x3i;
    const t2r = cr * x0r + er * x2r,
      t2i = cr * x0i + er * x2i;
    const t3r = cr * x1r + er * x3r,
      t3i = cr * x1i + er * x3i;
    const y0r = t0r * ar + t1r * br,
      y0i = t0i * ar + t1i * br;
    const y1r = t0r * cr + t1r * er,
      y1i = t0i * cr + t1i * er;
    const y2r = t2r * ar + t3r * br,
      y2i = t2i * ar + t3i * br;
    const y3r = t2r * cr + t3r * er,
      y3i = t2i * cr + t3i * er;
    const mr = mix * (y0r + y3r),
      mi = mix * (y0i + y3i);
    const e3r = keep * y3r + mr,
      e3i = keep * y3i + mi;
    re[b] = keep * y0r + mr + gamma * e3r;
    im[b] = keep * y0i + mi + gamma * e3i;
    re[i11] = pop * e3r;
    im[i11] = pop * e3i;
    re[i01] = coh * y1r;
    im[i01] = coh * y1i;
    re[i10] = coh * y2r;
    im[i10] = coh * y2i;
  }
}
