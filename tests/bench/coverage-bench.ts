/**
 * Coverage bench (`npm run bench:coverage`; not a test): for every family of
 * tests/support/coverage-cases.ts, raw and readout-mitigated, normalised value a from 0 to
 * 0.999 and shots from 10 to 10⁴, the fraction of seeded runs whose `ci95` contains the exact
 * value. Each cell is checked against the band [91.5 % − 3·SE, 100 %], SE = the binomial
 * standard error √(0.915·0.085/seeds) of a coverage fraction: 91.5 % is (rounded down) the lowest exact
 * coverage of the interval for one ±1 outcome over N = 10 … 400 and every ⟨Z⟩ (discreteness makes
 * every interval oscillate around 95 %; L. D. Brown, T. T. Cai & A. DasGupta, Stat. Sci. 16,
 * 101 (2001)); a conservative interval is accepted, a collapsing one is not. Cells outside
 * are marked "!". SEEDS env var: seeds per cell (default 1000).
 */
import { coverage, coverageSe, type Family } from "../support/coverage-cases";

const FAMILIES: Family[] = ["one term", "correlated", "settings", "mermin", "heisenberg"];
const VALUES = [0, 0.5, 0.9, 0.98, 0.99, 0.999];
const SHOTS = [10, 30, 100, 200, 1000, 10_000];

async function main(): Promise<void> {
  const seeds = Number(process.env.SEEDS ?? 1000);
  const floor = 0.915 - 3 * coverageSe(0.915, seeds);
  let outside = 0;
  console.log(
    `coverage of the 95 % interval, ${seeds} seeds per cell; band [${(100 * floor).toFixed(1)} %, 100 %]`,
  );
  for (const family of FAMILIES) {
    for (const mitigated of [false, true]) {
      console.log(
        `\n${family}, ${mitigated ? "readout-mitigated" : "raw"}\n  a \\ shots ${SHOTS.map((n) => String(n).padStart(7)).join("")}`,
      );
      for (const a of VALUES) {
        const cells: string[] = [];
        for (const shots of SHOTS) {
          const r = await coverage({ family, a, shots, mitigated }, seeds);
          const f = r.covered / seeds;
          const bad = f < floor;
          if (bad) outside++;
          cells.push(`${(100 * f).toFixed(1)}${bad ? "!" : " "}`.padStart(7));
        }
        console.log(`  ${String(a).padEnd(10)}${cells.join("")}`);
      }
    }
  }
  console.log(`\n${outside} cell(s) below the band`);
  if (outside > 0) process.exitCode = 1;
}

main().catch((e: unknown) => {
  console.error(e);
  process.exitCode = 1;
});
