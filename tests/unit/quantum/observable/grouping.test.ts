/** Qubit-wise commuting grouping: properties of the greedy colouring. */
import { describe, expect, it } from "vitest";
import { groupQubitWise } from "@/lib/quantum/observable/grouping";
import { parsePauliSum } from "@/lib/quantum/observable/pauli-parse";
import { mulberry32, randomPauliText } from "./random-states";

describe("groupQubitWise", () => {
  it("ZZ and Z0 share a setting; XX needs another; the identity is in none", () => {
    const s = parsePauliSum("0.5 ZZ + 0.2 ZI + 0.3 XX + 1.5");
    const g = groupQubitWise(s);
    expect(g.map((x) => x.bases)).toEqual(["ZZ", "XX"]);
    expect(g[0].terms.map((i) => s.terms[i].word)).toEqual(["ZZ", "ZI"]);
    expect(g.flatMap((x) => x.terms)).not.toContain(s.terms.findIndex((t) => t.word === "II"));
  });

  it("bases use I for unmeasured qubits, qubit 0 first", () => {
    const g = groupQubitWise(parsePauliSum("X0 + Y2"));
    expect(g.map((x) => x.bases)).toEqual(["XIY"]);
  });

  it("greedy order: larger |c| first decides the setting (documented)", () => {
    const s = parsePauliSum("0.1 X0 + 5 Z0 Z1 + 0.2 X1 + 1 Z1");
    const g = groupQubitWise(s);
    expect(g[0].bases).toBe("ZZ");
    expect(g[1].bases).toBe("XX");
  });

  it("random sums: every non-identity term exactly once; all pairs in a setting commute qubit-wise", () => {
    const rand = mulberry32(1);
    for (let trial = 0; trial < 50; trial++) {
      const n = 1 + (trial % 7);
      const s = parsePauliSum(randomPauliText(n, 1 + Math.floor(rand() * 30), rand));
      const groups = groupQubitWise(s);
      const seen = groups.flatMap((x) => x.terms).sort((a, b) => a - b);
      const expected = s.terms.map((_, i) => i).filter((i) => s.terms[i].xMask | s.terms[i].zMask);
      expect(seen).toEqual(expected);
      for (const grp of groups) {
        for (const i of grp.terms) {
          const w = s.terms[i].word;
          for (let q = 0; q < w.length; q++) if (w[q] !== "I") expect(grp.bases[q]).toBe(w[q]);
        }
      }
    }
  });
});
