/**
 * Engine benchmark (`npm run bench`; not a test). Every row is measured in ONE run against
 * baselines taken in the same run, back to back with the row (bench-kit.ts). Add a row by
 * adding a BenchRow to ROWS (rows may share values through ctx.shared; numpyRow reads
 * ansatzRow's timing). The machine's load average is printed before and after the table.
 */
import { type BenchRow, type RowResult, createContext, machineLine, printTable } from "./bench-kit";
import { ansatzRow } from "./rows/ansatz";
import { densityRow } from "./rows/density";
import { gradientRows } from "./rows/gradient";
import { kernelRows } from "./rows/kernels";
import { memoryRow } from "./rows/memory";
import { numpyRow } from "./rows/numpy";
import { observableRows } from "./rows/observables";
import { threadRows } from "./rows/threads";

/** In table order; `npm run bench -- kernels observables` runs only the named groups. */
const ROWS: Record<string, BenchRow> = {
  kernels: kernelRows,
  ansatz: ansatzRow,
  threads: threadRows,
  density: densityRow,
  memory: memoryRow,
  numpy: numpyRow,
  observables: observableRows,
  gradient: gradientRows,
};

async function main(): Promise<void> {
  console.log(machineLine("start"));
  const ctx = createContext();
  const results: RowResult[] = [];
  const only = process.argv.slice(2);
  for (const [name, row] of Object.entries(ROWS)) {
    if (only.length > 0 && !only.includes(name)) continue;
    results.push(...(await row(ctx)));
  }
  printTable(results);
  console.log(machineLine("end"));
}

main().catch((e: unknown) => {
  console.error(e);
  process.exitCode = 1;
});
