/**
 * The pure re-indexing of legacy matrices: for random Hermitian matrices M stored in the
 * old reading (index bit k = qubit k) and random states, the old value Σ conj(ψ_i) M_ij ψ_j
 * (computed here directly on the engine's state array) equals the engine's value for the
 * migrated matrix. Reference: the direct dense sum (common practice).
 */
import { describe, expect, it } from "vitest";
import { legacyMatrixToWritten, migrateRunResult } from "@/lib/maintenance/matrix-order";
import { matrixExpectationOnState } from "@/lib/quantum/observable/matrix-expectation";
import { parseMatrixObservable } from "@/lib/quantum/observable/matrix-observable";
import { mulberry32, randomState } from "../quantum/observable/random-states";

describe("legacy matrix → written order", () => {
  it("keeps ⟨ψ|M|ψ⟩ for random Hermitian matrices on 1–4 qubits", () => {
    const rand = mulberry32(41);
    for (let n = 1; n <= 4; n++) {
      const d = 2 ** n;
      const real = Array.from({ length: d }, () => new Array<number>(d).fill(0));
      const imag = Array.from({ length: d }, () => new Array<number>(d).fill(0));
      for (let i = 0; i < d; i++) {
        real[i][i] = rand() - 0.5;
        for (let j = i + 1; j < d; j++) {
          real[i][j] = real[j][i] = rand() - 0.5;
          imag[i][j] = rand() - 0.5;
          imag[j][i] = -imag[i][j];
        }
      }
      const s = randomState(n, rand);
      let legacy = 0;
      for (let i = 0; i < d; i++) {
        for (let j = 0; j < d; j++) {
          // Re(conj(ψ_i)·M_ij·ψ_j)
          const mr = real[i][j],
            mi = imag[i][j];
          const wr = mr * s.re[j] - mi * s.im[j];
          const wi = mr * s.im[j] + mi * s.re[j];
          legacy += s.re[i] * wr + s.im[i] * wi;
        }
      }
      const migrated = legacyMatrixToWritten({ real, imag });
      expect(
        Math.abs(matrixExpectationOnState(s, parseMatrixObservable(migrated)) - legacy),
      ).toBeLessThan(1e-12);
    }
  });

  it("leaves malformed matrices and non-eigenbasis groups alone", () => {
    const bad = { real: [[1, 2, 3]] };
    expect(legacyMatrixToWritten(bad)).toBe(bad);
    const r = {
      groups: [
        { bases: "ZZ", counts: { "10": 3 } },
        { bases: "eigenbasis", counts: { "110": 1 } },
      ],
    };
    expect(migrateRunResult(r)).toEqual({
      groups: [
        { bases: "ZZ", counts: { "10": 3 } },
        { bases: "eigenbasis", counts: { "011": 1 } },
      ],
    });
  });
});
