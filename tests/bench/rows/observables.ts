/**
 * Observable and sampling rows.
 * - Exact ⟨A⟩ of a 100-, 1,000- and 10,000-term random Pauli sum on a random 16-qubit state:
 *   time per term divided by one baseline pass (copy of the state); terms sharing a flip mask
 *   share one pass over the state, so ≤ 1.0 means a term costs no more than a copy of the state.
 *   Copy and evaluation are timed back to back in process CPU time (bench-kit.ts), on one
 *   engine thread (the threads rows measure the Pauli sum on several).
 * - 10⁶ shots from a random 20-qubit state (alias-table set-up over 2^20 outcomes, draws,
 *   histogram and running sums of a 3-term setting), divided by one baseline pass at n = 20.
 */
import {
  pauliExpectationsOnState,
  weightedTotal,
} from "@/lib/quantum/observable/pauli-expectation";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { drawSetting } from "@/lib/quantum/sampling/draw-setting";
import { createRng } from "@/lib/quantum/sampling/rng";
import { allocateAmplitudes } from "@/lib/quantum/statevector/state";
import { pauliSettingModel } from "@/lib/quantum/sampling/setting-model";
import type { StateVector } from "@/lib/quantum/types";
import {
  type BenchContext,
  type BenchRow,
  type RowResult,
  REPS,
  STEADY_SPREAD,
  fmtClocks,
  fmtMs,
  paired,
  ratioResult,
  sample,
  sampleAsync,
  spreadOf,
  stats,
} from "../bench-kit";

/** A random state, allocated as the engine allocates states (a kernel memory unless KETWISE_ENGINE_WASM=0). */
export function randomState(n: number, seed: number): StateVector {
  const rng = createRng(seed);
  const d = 2 ** n;
  const { re, im } = allocateAmplitudes(n);
  let s = 0;
  for (let i = 0; i < d; i++) {
    re[i] = (rng.next() >>> 0) / 2 ** 32 - 0.5;
    im[i] = (rng.next() >>> 0) / 2 ** 32 - 0.5;
    s += re[i] * re[i] + im[i] * im[i];
  }
  const k = 1 / Math.sqrt(s);
  for (let i = 0; i < d; i++) {
    re[i] *= k;
    im[i] *= k;
  }
  return { n, re, im };
}

export function randomPauliText(n: number, terms: number, seed: number): string {
  const rng = createRng(seed);
  const parts: string[] = [];
  for (let t = 0; t < terms; t++) {
    let w = "";
    for (let q = 0; q < n; q++) w += "IXYZ"[(rng.next() >>> 0) % 4];
    parts.push(`${(((rng.next() >>> 0) / 2 ** 32) * 2 - 1).toFixed(6)} ${w}`);
  }
  return parts.join(" + ").replace(/\+ -/g, "- ");
}

/** One row: exact ⟨A⟩ of a random `terms`-term Pauli sum on a random n-qubit state, per term ÷ copy. */
function pauliRow(ctx: BenchContext, n: number, terms: number): RowResult {
  const state = randomState(n, 1);
  const sum = padPauliSum(parsePauliSum(randomPauliText(n, terms, 2)), n);
  let value = 0;
  const count = sum.terms.length;
  const p = paired(
    () => (value = weightedTotal(sum, pauliExpectationsOnState(state, sum, undefined, 1))),
    ctx.copy(n),
    { baseRepeat: 20 },
  );
  const perTerm = {
    ...p,
    ratio: { median: p.ratio.median / count, min: p.ratio.min / count, max: p.ratio.max / count },
  };
  return ratioResult(
    perTerm,
    `exact ⟨A⟩, ${count}-term random Pauli sum, n=${n} (per term ÷ copy pass)`,
    `${fmtClocks(p.row)} total, ${((p.row.cpu.median / count) * 1000).toFixed(1)} µs/term; copy ${(p.base.cpu.median * 1000).toFixed(1)} µs (⟨A⟩ = ${value.toFixed(4)})`,
    "≤ 1.0",
    (r) => r <= 1.0,
  );
}

export const observableRows: BenchRow = async (ctx) => {
  const out: RowResult[] = [];
  for (const terms of [100, 1000, 10000]) out.push(pauliRow(ctx, 16, terms));
  {
    const n = 20;
    const shots = 1_000_000;
    const state = randomState(n, 3);
    const p = new Float64Array(2 ** n);
    for (let i = 0; i < p.length; i++) p[i] = state.re[i] ** 2 + state.im[i] ** 2;
    const sum = padPauliSum(parsePauliSum("0.5 Z0 Z1 + 0.3 Z5 + 0.2 Z3 Z19"), n);
    const model = pauliSettingModel(sum, [0, 1, 2], null);
    const copy = ctx.copy(n);
    const ratios: number[] = [];
    const rows: number[] = [];
    const walls: number[] = [];
    const bases: number[] = [];
    for (let rep = 0; rep < REPS; rep++) {
      const b = sample(copy);
      const r = await sampleAsync(() =>
        drawSetting({ distribution: p, shots, rng: createRng(rep), model, checkpoints: [] }),
      );
      bases.push(b.cpuMs);
      rows.push(r.cpuMs);
      walls.push(r.wallMs);
      ratios.push(r.cpuMs / b.cpuMs);
    }
    const st = stats(ratios);
    const ms = stats(rows).median;
    out.push({
      row: `10^6 shots from an n=${n} state (÷ copy pass)`,
      measured: `cpu ${fmtMs(ms)} / wall ${fmtMs(stats(walls).median)}; copy ${fmtMs(stats(bases).median)}; ${((ms / shots) * 1e6).toFixed(0)} ns/shot`,
      value: st.median,
      range: [st.min, st.max],
      target: "",
      steady: spreadOf(st) <= STEADY_SPREAD,
    });
  }
  return out;
};
