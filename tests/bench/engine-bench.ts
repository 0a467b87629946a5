/**
 * Engine benchmark (`npm run bench`; not a test). Every row is measured in ONE run against
 * baselines taken in the same run (bench-kit.ts). Add a row by appending a BenchRow to ROWS
 * (rows may share values through ctx.shared; numpyRow reads ansatzRow's timing).
 */
import { type BenchRow, type RowResult, createContext, printTable } from "./bench-kit";
import { ansatzRow } from "./rows/ansatz";
import { densityRow } from "./rows/density";
import { gradientRows } from "./rows/gradient";
import { kernelRows } from "./rows/kernels";
import { memoryRow } from "./rows/memory";
import { numpyRow } from "./rows/numpy";
import { observableRows } from "./rows/observables";

const ROWS: BenchRow[] = [
  kernelRows,
  ansatzRow,
  densityRow,
  memoryRow,
  numpyRow,
  observableRows,
  gradientRows,
];

async function main(): Promise<void> {
  const ctx = createContext();
  const results: RowResult[] = [];
  for (const row of ROWS) results.push(...(await row(ctx)));
  printTable(results);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exitCode = 1;
});
