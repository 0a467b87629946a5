/** Ground-level summary shown by the spectrum card (degeneracy and gap between distinct levels). */
import { describe, expect, it } from "vitest";
import { degeneracyLabel, groundLevels } from "@/components/runs/spectrum-levels";

describe("groundLevels", () => {
  it("two-qubit Heisenberg X0X1 + Y0Y1 + Z0Z1 (−3, then a 3-fold +1; textbook, value from memory): gap 4, non-degenerate", () => {
    const g = groundLevels({
      min: -3,
      max: 1,
      lowest: [-3, 1, 1, 1],
      groundDegeneracy: 1,
      groundWeight: 0.5,
    })!;
    expect(g).toEqual({ degeneracy: 1, atLeast: false, gap: 4 });
    expect(degeneracyLabel(g)).toBe("non-degenerate ground level");
  });

  it("−Z0Z1: the gap skips the 2-fold ground level (λ₁ − λ₀ = 2, not 0)", () => {
    const g = groundLevels({ min: -1, max: 1, lowest: [-1, -1, 1, 1], groundDegeneracy: 2 })!;
    expect(g.gap).toBe(2);
    expect(degeneracyLabel(g)).toBe("ground level 2-fold");
  });

  it("ground level wider than the listed values: no gap, 'at least'", () => {
    const g = groundLevels({ min: -1, max: 1, lowest: [-1, -1, -1, -1] })!;
    expect(g).toEqual({ degeneracy: 4, atLeast: true, gap: null });
    expect(degeneracyLabel(g)).toBe("ground level at least 4-fold");
  });

  it("runs stored before the field: nothing to show", () => {
    expect(groundLevels({ min: -1, max: 1 })).toBeNull();
  });
});
