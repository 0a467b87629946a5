/**
 * The compact diagonal of U ρ U† equals the diagonal of the fully rotated copy made with
 * the kernels' applyUnitaryDM (basis-rotation.ts), for random mixed states and settings.
 */
import { describe, expect, it } from "vitest";
import { densityProbabilities, rotateDensityCopy } from "@/lib/quantum/sampling/basis-rotation";
import { rotatedDensityDiagonal } from "@/lib/quantum/sampling/density-diagonal";
import { mulberry32, randomDensity } from "../observable/random-states";

describe("rotatedDensityDiagonal", () => {
  it("matches the applyUnitaryDM route on 1–5 qubits, every kind of setting", () => {
    const rand = mulberry32(61);
    for (let trial = 0; trial < 40; trial++) {
      const n = 1 + (trial % 5);
      const rho = randomDensity(n, rand);
      const bases = Array.from({ length: n }, () => "IXYZ"[Math.floor(rand() * 4)]).join("");
      const fast = rotatedDensityDiagonal(rho, bases);
      const ref = densityProbabilities(rotateDensityCopy(rho, bases));
      fast.forEach((p, b) => expect(p).toBeCloseTo(ref[b], 13));
      expect(fast.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    }
  });
});
