/**
 * Observable and sampling rows.
 * - Exact ⟨A⟩ of a 1,000-term random Pauli sum on a random 16-qubit state: time per term
 *   divided by one baseline pass (copy of the state); each off-diagonal term reads the state
 *   once (pairs b, b⊕x), so ≤ 1.0 means a term costs no more than a copy of the state.
 *   Copy and evaluation are timed interleaved in process CPU time (process.cpuUsage), and the
 *   minimum of each is used, so load from other processes on a shared machine distorts less.
 * - 10⁶ shots from a random 20-qubit state (alias-table set-up over 2^20 outcomes, draws,
 *   histogram and running sums of a 3-term setting), divided by one baseline pass at n = 20.
 */
import { pauliExpectationsOnState, weightedTotal } from "@/lib/quantum/observable/pauli-expectation";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { padPauliSum } from "@/lib/quantum/observable/pauli-word";
import { drawSetting } from "@/lib/quantum/sampling/draw-setting";
import { createRng } from "@/lib/quantum/sampling/rng";
import { pauliSettingModel } from "@/lib/quantum/sampling/setting-model";
import type { StateVector } from "@/lib/quantum/types";
import { type BenchRow, type RowResult, fmtMs } from "../bench-kit";

function randomState(n: number, seed: number): StateVector {
  const rng = createRng(seed);
  const d = 2 ** n;
  const re = new Float64Array(d);
  const im = new Float64Array(d);
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

function randomPauliText(n: number, terms: number, seed: number): string {
  const rng = createRng(seed);
  const parts: string[] = [];
  for (let t = 0; t < terms; t++) {
    let w = "";
    for (let q = 0; q < n; q++) w += "IXYZ"[(rng.next() >>> 0) % 4];
    parts.push(`${(((rng.next() >>> 0) / 2 ** 32) * 2 - 1).toFixed(6)} ${w}`);
  }
  return parts.join(" + ").replace(/\+ -/g, "- ");
}

/** Process CPU time (user + system) of one call, in ms. */
function cpuMs(fn: () => void): number {
  const t0 = process.cpuUsage();
  fn();
  const d = process.cpuUsage(t0);
  return (d.user + d.system) / 1000;
}

export const observableRows: BenchRow = async (ctx) => {
  const out: RowResult[] = [];
  {
    const n = 16;
    const terms = 1000;
    const state = randomState(n, 1);
    const sum = padPauliSum(parsePauliSum(randomPauliText(n, terms, 2)), n);
    const copyRe = new Float64Array(state.re.length);
    const copyIm = new Float64Array(state.re.length);
    let value = 0;
    let base = Infinity;
    let ms = Infinity;
    for (let rep = 0; rep < 7; rep++) {
      base = Math.min(base, cpuMs(() => {
        for (let k = 0; k < 20; k++) {
          copyRe.set(state.re);
          copyIm.set(state.im);
        }
      }) / 20);
      ms = Math.min(ms, cpuMs(() => {
        value = weightedTotal(sum, pauliExpectationsOnState(state, sum));
      }));
    }
    const perTerm = ms / sum.terms.length;
    const r = perTerm / base;
    out.push({
      row: `exact ⟨A⟩, ${sum.terms.length}-term random Pauli sum, n=${n} (per term ÷ copy pass)`,
      measured: `${fmtMs(ms)} total, ${(perTerm * 1000).toFixed(1)} µs/term; copy ${(base * 1000).toFixed(1)} µs (⟨A⟩ = ${value.toFixed(4)})`,
      value: r,
      target: "≤ 1.0",
      pass: r <= 1.0,
    });
  }
  {
    const n = 20;
    const shots = 1_000_000;
    const base = ctx.copyMs(n);
    const state = randomState(n, 3);
    const p = new Float64Array(2 ** n);
    for (let i = 0; i < p.length; i++) p[i] = state.re[i] ** 2 + state.im[i] ** 2;
    const sum = padPauliSum(parsePauliSum("0.5 Z0 Z1 + 0.3 Z5 + 0.2 Z3 Z19"), n);
    const model = pauliSettingModel(sum, [0, 1, 2], null);
    let ms = Infinity;
    let baseCpu = Infinity;
    const copyRe = new Float64Array(state.re.length);
    const copyIm = new Float64Array(state.re.length);
    for (let rep = 0; rep < 4; rep++) {
      baseCpu = Math.min(baseCpu, cpuMs(() => {
        copyRe.set(state.re);
        copyIm.set(state.im);
      }));
      const t0 = process.cpuUsage();
      await drawSetting({ distribution: p, shots, rng: createRng(rep), model, checkpoints: [] });
      const d = process.cpuUsage(t0);
      ms = Math.min(ms, (d.user + d.system) / 1000);
    }
    out.push({
      row: `10^6 shots from an n=${n} state (÷ copy pass)`,
      measured: `${fmtMs(ms)} CPU; copy ${fmtMs(Math.min(base, baseCpu))}; ${((ms / shots) * 1e6).toFixed(0)} ns/shot`,
      value: ms / Math.min(base, baseCpu),
      target: "",
    });
  }
  return out;
};
