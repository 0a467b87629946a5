/**
 * Gradients of density-matrix runs (the noisy exact value, forward tangent through the
 * channels) against central differences of the engine; sampled gradients (parameter-shift
 * rules, Mitarai et al. 2018; Schuld et al. 2019; four-term rule for controlled rotations,
 * Anselmetti et al. 2021) whose ±1.96·stdErr intervals cover the exact gradient at about
 * the 95 % rate over many seeds; shift rules checked on closed forms.
 */
import { describe, expect, it } from "vitest";
import { estimate } from "@/lib/quantum";
import { cis } from "@/lib/quantum/circuit/gate-matrices";
import { STDGATES } from "@/lib/quantum/circuit/gate-library";
import {
  equidistantRule,
  expectationRule,
  matrixDerivative,
} from "@/lib/quantum/gradient/shift-rules";

const SOURCE = `OPENQASM 3.0;
include "stdgates.inc";
qubit[3] q;
input float a;
input float b;
h q[0];
rx(0.4*a + 0.1) q[0];
ry(sin(b)) q[1];
cx q[0], q[1];
crx(a*b) q[1], q[2];
u3(a, b, a - b) q[2];
cp(b) q[0], q[2];
cu(a, b, 0.3, b) q[2], q[0];
`;
const observable = { format: "pauli" as const, terms: "Z0 Z1 + 0.5 X2 - 0.3 Y0 X1 Z2" };
const x = { a: 0.7, b: -1.1 };

async function fd(req: object, name: "a" | "b", h = 1e-3): Promise<number> {
  const at = async (d: number) =>
    (await estimate({ ...req, parameters: { ...x, [name]: x[name] + d } } as never)).exact.value;
  return (
    (8 * ((await at(h)) - (await at(-h))) - ((await at(2 * h)) - (await at(-2 * h)))) / (12 * h)
  );
}

describe("density-matrix gradients", () => {
  const noise = {
    depolarizing1q: 0.05,
    depolarizing2q: 0.1,
    amplitudeDamping: 0.03,
    phaseDamping: 0.02,
  };
  it(
    "noisy exact value: tangent through depolarizing and damping channels agrees with central differences to 1e-7",
    { timeout: 60_000 },
    async () => {
      const req = {
        circuit: { format: "qasm3", source: SOURCE },
        observable,
        method: "density_matrix",
        noise,
      };
      const r = await estimate({ ...req, parameters: x, gradient: true } as never);
      for (const name of ["a", "b"] as const)
        expect(Math.abs(r.gradient![name].exact - (await fd(req, name)))).toBeLessThan(1e-7);
    },
  );

  it(
    "mid-circuit measurement and reset (non-invertible steps) agree with central differences to 1e-7",
    { timeout: 60_000 },
    async () => {
      const source = SOURCE.replace("qubit[3] q;", "qubit[3] q;\nbit[3] c;").replace(
        "cx q[0], q[1];",
        "cx q[0], q[1];\nc[1] = measure q[1];\nreset q[2];\nry(a) q[2];",
      );
      const req = {
        circuit: { format: "qasm3", source },
        observable,
        method: "density_matrix",
        noise: { amplitudeDamping: 0.2 },
      };
      const r = await estimate({ ...req, parameters: x, gradient: true } as never);
      for (const name of ["a", "b"] as const)
        expect(Math.abs(r.gradient![name].exact - (await fd(req, name)))).toBeLessThan(1e-7);
    },
  );

  it("without noise the density-matrix gradient equals the statevector one", async () => {
    const sv = await estimate({
      circuit: { format: "qasm3", source: SOURCE },
      observable,
      parameters: x,
      gradient: true,
    });
    const dm = await estimate({
      circuit: { format: "qasm3", source: SOURCE },
      observable,
      parameters: x,
      gradient: true,
      method: "density_matrix",
    });
    for (const name of ["a", "b"])
      expect(dm.gradient![name].exact).toBeCloseTo(sv.gradient![name].exact, 12);
  });

  it("matrix observables: gradient agrees with central differences", async () => {
    const h = [
      [1, 0.5, 0, 0.2],
      [0.5, -1, 0.3, 0],
      [0, 0.3, 0.4, 0],
      [0.2, 0, 0, 2],
    ];
    const source = `OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[2] q;\ninput float a;\ninput float b;\nry(a) q[0];\ncry(b*a) q[0], q[1];\nrz(b) q[1];\nh q[1];\n`;
    const req = { circuit: { format: "qasm3", source }, observable: { format: "matrix", real: h } };
    const r = await estimate({ ...req, parameters: x, gradient: true } as never);
    for (const name of ["a", "b"] as const)
      expect(Math.abs(r.gradient![name].exact - (await fd(req, name)))).toBeLessThan(1e-7);
  });
});

describe("sampled gradients by parameter-shift rules", () => {
  it(
    "the ±1.96·stdErr interval covers the exact gradient in about 95 % of 200 seeds (binomial 99.9 % band)",
    { timeout: 120_000 },
    async () => {
      const source = `OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[2] q;\ninput float a;\ninput float b;\nrx(0.4*a + 0.1) q[0];\ncrx(a*b) q[0], q[1];\nry(sin(b)) q[1];\ncp(a) q[0], q[1];\n`;
      let covered = 0;
      let total = 0;
      let shots = 0;
      for (let seed = 1; seed <= 100; seed++) {
        const r = await estimate({
          circuit: { format: "qasm3", source },
          observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X1 + 0.3 Y0" },
          parameters: x,
          gradient: true,
          shots: 400,
          seed,
        });
        for (const name of ["a", "b"]) {
          const g = r.gradient![name];
          if (Math.abs(g.sampled!.mean - g.exact) <= 1.959964 * g.sampled!.stdErr) covered++;
          total++;
        }
        shots = r.gradientShots!;
      }
      // rx, crx (four-term), cp: 2 + 4 + 2 shifted circuits… and ry(sin b): 2 → 10 circuits × 400 shots.
      expect(shots).toBe(10 * 400);
      // 200 intervals at 95 %: mean 190, sd ≈ 3.1; 99.9 % band ≈ [180, 200] (normal approximation to the binomial).
      expect(covered).toBeGreaterThanOrEqual(180);
      // Over-wide intervals would cover every time: all 200 has probability 0.95^200 ≈ 4e-5.
      expect(covered).toBeLessThan(total);
      console.info(`sampled-gradient coverage: ${covered}/${total}`);
    },
  );

  it("is reproducible from the seed and billed: gradientShots counts every shifted circuit", async () => {
    const source = `OPENQASM 3.0;\ninclude "stdgates.inc";\nqubit[1] q;\ninput float a;\nry(a) q[0];\nrx(a) q[0];\n`;
    const req = {
      circuit: { format: "qasm3" as const, source },
      observable: { format: "pauli" as const, terms: "Z0" },
      parameters: { a: 0.3 },
      gradient: true,
      shots: 1000,
      seed: 5,
    };
    const r1 = await estimate(req);
    const r2 = await estimate(req);
    expect(r2.gradient).toEqual(r1.gradient);
    expect(r1.gradientShots).toBe(4 * 1000);
  });
});

describe("shift rules", () => {
  it("two-term rule (R = 1): shifts ±π/2, weights ±1/2 (Mitarai et al. 2018)", () => {
    const r = equidistantRule(1, 1);
    expect(r.shifts[0]).toBeCloseTo(Math.PI / 2, 14);
    expect(r.shifts[1]).toBeCloseTo(-Math.PI / 2, 14);
    expect(r.weights[0]).toBeCloseTo(0.5, 14);
    expect(r.weights[1]).toBeCloseTo(-0.5, 14);
  });

  it("four-term rule of controlled rotations: shifts ±π/2, ±3π/2 with weights (√2 ± 1)/(4√2) (Anselmetti et al. 2021)", () => {
    const u = STDGATES.get("crx")!.matrix([0.3]);
    const du = matrixDerivative((p) => STDGATES.get("crx")!.matrix(p), [0.3], 0);
    const r = expectationRule(u, du)!;
    const pairs = r.shifts.map((s, i) => [s, r.weights[i]]).sort((p, q) => p[0] - q[0]);
    const dPlus = (Math.SQRT2 + 1) / (4 * Math.SQRT2);
    const dMinus = (Math.SQRT2 - 1) / (4 * Math.SQRT2);
    const want = [
      [(-3 * Math.PI) / 2, dMinus],
      [-Math.PI / 2, -dPlus],
      [Math.PI / 2, dPlus],
      [(3 * Math.PI) / 2, -dMinus],
    ];
    pairs.forEach((p, i) => {
      expect(p[0]).toBeCloseTo(want[i][0], 12);
      expect(p[1]).toBeCloseTo(want[i][1], 12);
    });
  });

  it("the rule is exact on a closed form with frequencies ½ and 1: f(p) = 0.3 + cos(p/2) − 0.7 sin p + 0.2 cos p", () => {
    const f = (p: number) => 0.3 + Math.cos(p / 2) - 0.7 * Math.sin(p) + 0.2 * Math.cos(p);
    const df = (p: number) => -0.5 * Math.sin(p / 2) - 0.7 * Math.cos(p) - 0.2 * Math.sin(p);
    const r = equidistantRule(0.5, 2);
    for (const p of [-2, 0.3, 1.7]) {
      expect(r.shifts.reduce((s, sh, i) => s + r.weights[i] * f(p + sh), 0)).toBeCloseTo(df(p), 13);
    }
  });

  it("matrix derivative of every parametrised standard gate agrees with central differences (1e-8)", () => {
    for (const [name, gate] of STDGATES) {
      if (gate.numParams === 0) continue;
      const params = [0.3, -1.2, 0.8, 2.1].slice(0, gate.numParams);
      for (let k = 0; k < gate.numParams; k++) {
        const d = matrixDerivative((p) => gate.matrix(p), params, k);
        const h = 1e-4;
        const up = gate.matrix(params.map((v, i) => (i === k ? v + h : v)));
        const dn = gate.matrix(params.map((v, i) => (i === k ? v - h : v)));
        d.forEach((v, i) =>
          expect(Math.abs(v - (up[i] - dn[i]) / (2 * h)), `${name} angle ${k}`).toBeLessThan(1e-8),
        );
      }
    }
    // Closed form: d/dλ P(λ) = diag(0, i·e^{iλ}).
    const dp = matrixDerivative((p) => STDGATES.get("p")!.matrix(p), [0.4], 0);
    const z = cis(0.4);
    expect(dp[6]).toBeCloseTo(-z[1], 14);
    expect(dp[7]).toBeCloseTo(z[0], 14);
  });
});

describe("gradients through OpenQASM 3 modifiers, loops and constants", () => {
  it(
    "ctrl @, negctrl @, inv @, pow(k) @, for loops and const: exact agrees with central differences (1e-7); sampled within 5 stdErr",
    { timeout: 60_000 },
    async () => {
      const source = `OPENQASM 3.0;
include "stdgates.inc";
qubit[3] q;
input float a;
input float b;
const float c = 0.25;
h q[0];
ctrl @ ry(a) q[0], q[1];
negctrl @ rx(b*a + c) q[1], q[2];
inv @ rx(2*b) q[1];
pow(3) @ rz(a - b) q[2];
ctrl(2) @ rx(cos(a)) q[0], q[1], q[2];
for int i in [0:2] {
  ry(a + i*b) q[i];
}
`;
      const req = { circuit: { format: "qasm3", source }, observable };
      const r = await estimate({
        ...req,
        parameters: x,
        gradient: true,
        shots: 20_000,
        seed: 9,
      } as never);
      for (const name of ["a", "b"] as const) {
        const ref = await fd(req, name);
        expect(Math.abs(r.gradient![name].exact - ref)).toBeLessThan(1e-7);
        const s = r.gradient![name].sampled!;
        expect(Math.abs(s.mean - r.gradient![name].exact)).toBeLessThan(5 * s.stdErr);
      }
    },
  );
});
