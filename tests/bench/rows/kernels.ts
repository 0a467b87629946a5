/**
 * Kernel bandwidth rows: one dense 1-qubit and one dense 2-qubit gate applied to a 22-qubit
 * state on low / middle / high qubits. Each pass reads and writes the whole state
 * (2 × 64 MiB), so the ratio to the copy baseline is t_copy / t_kernel. The state comes from
 * createZeroState, so the rows measure the default path (WebAssembly SIMD kernels unless
 * KETWISE_ENGINE_WASM=0); two rows repeat the middle positions on plain arrays (JavaScript).
 */
import { applyToAmplitudes } from "@/lib/quantum/statevector/dispatch";
import { createZeroState } from "@/lib/quantum/statevector/state";
import { statevectorBytes } from "@/lib/quantum/statevector/memory";
import {
  type BenchRow,
  type RowResult,
  fmtClocks,
  fmtMs,
  gbPerS,
  paired,
  ratioResult,
} from "../bench-kit";

const N = 22;

/** A fixed dense unitary (complex): 1q = e^{iα}·rz·ry·rz form; 2q = a product of such on both + a cx-like mixing. */
function dense1q(a: number, b: number, c: number): Float64Array {
  const ct = Math.cos(b / 2),
    st = Math.sin(b / 2);
  // u(θ=b, φ=a, λ=c) = [[cos, −e^{iλ} sin], [e^{iφ} sin, e^{i(φ+λ)} cos]]
  return Float64Array.of(
    ct,
    0,
    -Math.cos(c) * st,
    -Math.sin(c) * st,
    Math.cos(a) * st,
    Math.sin(a) * st,
    Math.cos(a + c) * ct,
    Math.sin(a + c) * ct,
  );
}

function dense2q(): Float64Array {
  const u = dense1q(0.3, 1.1, 0.7);
  const v = dense1q(1.9, 0.4, 2.2);
  const out = new Float64Array(32);
  // u ⊗ v then a √SWAP-like mixing of |01⟩,|10⟩ makes every entry non-zero in general
  for (let a = 0; a < 2; a++)
    for (let b = 0; b < 2; b++)
      for (let c = 0; c < 2; c++)
        for (let d = 0; d < 2; d++) {
          const ur = u[2 * (2 * a + c)],
            ui = u[2 * (2 * a + c) + 1];
          const vr = v[2 * (2 * b + d)],
            vi = v[2 * (2 * b + d) + 1];
          out[2 * ((2 * a + b) * 4 + 2 * c + d)] = ur * vr - ui * vi;
          out[2 * ((2 * a + b) * 4 + 2 * c + d) + 1] = ur * vi + ui * vr;
        }
  const mix = new Float64Array(32);
  const h = Math.SQRT1_2;
  mix[0] = 1;
  mix[2 * 5] = h;
  mix[2 * 6 + 1] = h;
  mix[2 * 9 + 1] = h;
  mix[2 * 10] = h;
  mix[2 * 15] = 1;
  const res = new Float64Array(32);
  for (let r = 0; r < 4; r++)
    for (let c = 0; c < 4; c++) {
      let sr = 0,
        si = 0;
      for (let j = 0; j < 4; j++) {
        const ar = mix[2 * (4 * r + j)],
          ai = mix[2 * (4 * r + j) + 1];
        const br = out[2 * (4 * j + c)],
          bi = out[2 * (4 * j + c) + 1];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      res[2 * (4 * r + c)] = sr;
      res[2 * (4 * r + c) + 1] = si;
    }
  return res;
}

export const kernelRows: BenchRow = (ctx) => {
  const copy = ctx.copy(N);
  const bytes = 2 * statevectorBytes(N);
  const state = createZeroState(N);
  state.re.fill(1 / Math.sqrt(2 ** N));
  const out: RowResult[] = [];
  const u1 = dense1q(0.8, 1.3, 2.1);
  let baseMs = 0;
  for (const [label, q] of [
    ["low", 0],
    ["middle", 11],
    ["high", 21],
  ] as const) {
    const p = paired(() => applyToAmplitudes(state.re, state.im, [q], u1), copy, { reps: 7 });
    baseMs = p.base.cpu.median;
    const measured = `${fmtClocks(p.row)} (${gbPerS(bytes, p.row.cpu.median)})`;
    out.push(
      ratioResult(
        p,
        `1q dense kernel n=${N}, ${label} qubit ${q}`,
        measured,
        "≥ 0.8",
        (r) => r >= 0.8,
        true,
      ),
    );
  }
  const u2 = dense2q();
  for (const [label, qs] of [
    ["low", [1, 0]],
    ["middle", [11, 10]],
    ["high", [21, 20]],
  ] as const) {
    const p = paired(() => applyToAmplitudes(state.re, state.im, [...qs], u2), copy, { reps: 7 });
    const measured = `${fmtClocks(p.row)} (${gbPerS(bytes, p.row.cpu.median)})`;
    out.push(
      ratioResult(
        p,
        `2q dense kernel n=${N}, ${label} qubits ${qs.join(",")}`,
        measured,
        "≥ 0.5",
        (r) => r >= 0.5,
        true,
      ),
    );
  }
  // the JavaScript kernels (the reference path, KETWISE_ENGINE_WASM=0) on plain arrays
  const js = { re: state.re.slice(), im: state.im.slice() };
  for (const [label, qs, m] of [
    ["1q dense kernel", [11], u1],
    ["2q dense kernel", [11, 10], u2],
  ] as const) {
    const p = paired(() => applyToAmplitudes(js.re, js.im, [...qs], m), copy, { reps: 7 });
    const measured = `${fmtClocks(p.row)} (${gbPerS(bytes, p.row.cpu.median)})`;
    out.push(
      ratioResult(
        p,
        `${label} n=${N}, JavaScript path, qubit(s) ${qs.join(",")}`,
        measured,
        "",
        undefined,
        true,
      ),
    );
  }
  out.unshift({
    row: `baseline: copy re+im, n=${N} (64 MiB)`,
    measured: `cpu ${fmtMs(baseMs)} (${gbPerS(bytes, baseMs)})`,
    value: 1,
    target: "",
  });
  return out;
};
