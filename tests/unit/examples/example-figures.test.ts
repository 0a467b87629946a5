/**
 * The public pages' example is honest: every figure the landing hero, the sign-in panel
 * and the sweep figure print is what the engine returns for the invented three-spin
 * cluster (lib/examples/example-figures.json, written by scripts/marketing-figures.ts),
 * the exact curve matches the closed form derived by hand, and the rendered pages show
 * exactly those numbers.
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import AuthLayout from "@/app/(auth)/layout";
import { Hero } from "@/components/marketing/hero";
import { SweepFigure } from "@/components/marketing/sweep-figure";
import { computeExampleFigures } from "@/lib/examples/example-figures";
import figures from "@/lib/examples/example-figures.json";
import { CLUSTER_TERMS } from "@/lib/examples/three-spin-cluster";
import { formatFixed, formatPlusMinus, formatUncertainty } from "@/lib/format";
import { parsePauliSum } from "@/lib/quantum";
import { threeSpinEnergy } from "../../support/three-spin-closed-form";

describe("the invented example's figures", () => {
  it("are exactly what the engine computes now (rerun scripts/marketing-figures.ts if not)", async () => {
    expect(figures).toEqual(await computeExampleFigures());
  });

  it("follow the hand-derived closed form along the ansatz, to 1e-10", () => {
    expect(figures.curve).toHaveLength(121);
    for (const p of figures.curve) expect(p.exact).toBeCloseTo(threeSpinEnergy(p.theta), 10);
    expect(figures.exact).toBeCloseTo(threeSpinEnergy(figures.theta), 10);
  });

  it("count the terms of the model as written (10 words and the constant)", () => {
    expect(parsePauliSum(CLUSTER_TERMS).terms).toHaveLength(figures.terms);
    expect(figures.terms).toBe(11);
  });
});

describe("the pages print those figures", () => {
  it("landing hero: exact, sampled and noisy values, counts and the z-score", () => {
    const html = renderToStaticMarkup(createElement(Hero));
    expect(html).toContain(formatFixed(figures.exact, 6));
    expect(html).toContain(formatUncertainty(figures.sampled.mean, figures.sampled.stdErr));
    expect(html).toContain(formatUncertainty(figures.noisy.mean, figures.noisy.stdErr));
    const z = (figures.sampled.mean - figures.exact) / figures.sampled.stdErr;
    expect(html).toContain(`z = ${z.toFixed(2).replace("-", "\u2212")}`);
    expect(html).toContain(
      `${figures.qubits} qubits · ${figures.terms} terms · ${figures.settings} settings`,
    );
    expect(html).toContain("Invented example");
    expect(html).not.toMatch(/1\.137|hydrogen/i);
  });

  it("sign-in panel: exact, sampled and mitigated values", () => {
    const html = renderToStaticMarkup(createElement(AuthLayout, null, null));
    expect(html).toContain(formatFixed(figures.exact, 6));
    expect(html).toContain(formatPlusMinus(figures.sampled.mean, figures.sampled.stdErr));
    expect(html).toContain(formatPlusMinus(figures.mitigated.mean, figures.mitigated.stdErr));
    expect(html).toContain("Invented example");
    expect(html).not.toMatch(/1\.137|hydrogen/i);
  });

  it("sweep figure: marks the grid's minimum", () => {
    const best = figures.curve.reduce((a, p) => (p.exact < a.exact ? p : a));
    const html = renderToStaticMarkup(createElement(SweepFigure));
    expect(html).toContain(
      `min ${formatFixed(best.exact, 3)} at θ = ${formatFixed(best.theta, 2)}`,
    );
  });
});
