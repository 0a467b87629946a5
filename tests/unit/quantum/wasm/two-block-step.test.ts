/**
 * The adjoint sweep's one-pass SIMD step for two-block gates (wasm/cross.ts wasmTwoBlockStep)
 * against the three-pass JavaScript step on copies (statevector/dispatch.ts applyToAmplitudes
 * for φ ← Uφ and λ ← Uλ, gradient/local-cross.ts for R in between): φ and λ bit-identical
 * (each lane evaluates the two-block kernel's expression), R to 1e-12 (lane sums add in
 * another order), for every operand order and both ctrl operands; and the cases it must
 * leave to the other paths (a bit 0, a dense U, an entry between ctrl values).
 */
import { describe, expect, it } from "vitest";
import { crossLocal } from "@/lib/quantum/gradient/local-cross";
import { applyToAmplitudes } from "@/lib/quantum/statevector/dispatch";
import { embedMatrix, multiplyMatrices } from "@/lib/quantum/statevector/matrix-ops";
import { wasmTwoBlockStep } from "@/lib/quantum/wasm/cross";
import { randomCompanionPair } from "./support";

const CX = Float64Array.from([
  1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 1, 0, 0, 0,
]);

/** A random 2×2 unitary (interleaved): e^{iα} R_z(β) R_y(γ) R_z(δ). */
function randomU2(rng: { float(): number }): Float64Array {
  const [a, b, g, d] = [0, 1, 2, 3].map(() => 2 * Math.PI * rng.float());
  const c = Math.cos(g / 2),
    s = Math.sin(g / 2);
  const e = (t: number) => [Math.cos(t), Math.sin(t)];
  const [p, q, r, t] = [
    e(a - b / 2 - d / 2),
    e(a - b / 2 + d / 2),
    e(a + b / 2 - d / 2),
    e(a + b / 2 + d / 2),
  ];
  return Float64Array.from([
    c * p[0],
    c * p[1],
    -s * q[0],
    -s * q[1],
    s * r[0],
    s * r[1],
    c * t[0],
    c * t[1],
  ]);
}

/** cx(ctrl = operand `ctrl`) followed by a random gate on the target: a two-block 4×4. */
function twoBlockU(rng: { float(): number }, ctrl: 0 | 1): Float64Array {
  const cx = ctrl === 0 ? CX : embedMatrix(CX, [1, 0], [0, 1]);
  return multiplyMatrices(embedMatrix(randomU2(rng), [1 - ctrl], [0, 1]), cx, 4);
}

describe("wasmTwoBlockStep", () => {
  const n = 9;
  const cases: [number, number, 0 | 1][] = [
    [1, 2, 0],
    [2, 1, 0],
    [8, 3, 1],
    [3, 8, 1],
    [5, 4, 0],
    [7, 1, 1],
  ];

  it.each(cases)("bits [%i, %i], ctrl operand %i: φ, λ bit-identical, R to 1e-12", (a, b, ctrl) => {
    const { w, phi, lambda, rng } = randomCompanionPair(n, 100 + 10 * a + b);
    const u = twoBlockU(rng, ctrl);
    for (const updateLambda of [true, false]) {
      const ref = {
        phi: { re: phi.re.slice(), im: phi.im.slice() },
        lambda: { re: lambda.re.slice(), im: lambda.im.slice() },
      };
      applyToAmplitudes(ref.phi.re, ref.phi.im, [a, b], u);
      const want = crossLocal(ref.lambda.re, ref.lambda.im, ref.phi.re, ref.phi.im, [a, b]);
      if (updateLambda) applyToAmplitudes(ref.lambda.re, ref.lambda.im, [a, b], u);
      const got = wasmTwoBlockStep(
        w,
        lambda.re,
        lambda.im,
        phi.re,
        phi.im,
        [a, b],
        u,
        0,
        updateLambda,
      );
      if (!got) throw new Error("the step declined a two-block gate");
      expect(phi.re).toEqual(ref.phi.re);
      expect(phi.im).toEqual(ref.phi.im);
      expect(lambda.re).toEqual(ref.lambda.re);
      expect(lambda.im).toEqual(ref.lambda.im);
      // entries between different ctrl values are not summed (0); the others match
      const ctrlBit = ctrl === 0 ? 2 : 1;
      for (let r = 0; r < 4; r++)
        for (let c = 0; c < 4; c++)
          for (const k of [0, 1]) {
            const at = 2 * (4 * r + c) + k;
            if ((r & ctrlBit) !== (c & ctrlBit)) expect(got[at]).toBe(0);
            else expect(Math.abs(got[at] - want[at])).toBeLessThan(1e-12);
          }
    }
  });

  it("declines bit 0, a dense U and entries between ctrl values, touching nothing", () => {
    const { w, phi, lambda, rng } = randomCompanionPair(n, 7);
    const before = phi.re.slice();
    const lambdaBefore = lambda.re.slice();
    const u = twoBlockU(rng, 0);
    expect(
      wasmTwoBlockStep(w, lambda.re, lambda.im, phi.re, phi.im, [0, 3], u, 0, true),
    ).toBeNull();
    expect(
      wasmTwoBlockStep(w, lambda.re, lambda.im, phi.re, phi.im, [3, 0], u, 0, true),
    ).toBeNull();
    // a rotation on the control operand makes U dense
    const dense = multiplyMatrices(u, embedMatrix(randomU2(rng), [0], [0, 1]), 4);
    expect(
      wasmTwoBlockStep(w, lambda.re, lambda.im, phi.re, phi.im, [2, 3], dense, 0, true),
    ).toBeNull();
    // entry (0, 2): local rows 0 and 2 differ in the ctrl (first) operand
    expect(
      wasmTwoBlockStep(w, lambda.re, lambda.im, phi.re, phi.im, [2, 3], u, 1 << 2, true),
    ).toBeNull();
    expect(phi.re).toEqual(before);
    expect(lambda.re).toEqual(lambdaBefore);
  });
});
