/**
 * Child process of the peak-memory row: simulates one layer of the ansatz on N qubits and
 * prints the process's peak resident set (VmHWM from /proc/self/status) as JSON.
 * Run alone so nothing else in the benchmark inflates the high-water mark.
 */
import { readFileSync } from "node:fs";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { layeredAnsatz } from "./ansatz";

function kib(field: string): number {
  const line = readFileSync("/proc/self/status", "utf8")
    .split("\n")
    .find((l) => l.startsWith(field));
  return line ? Number(line.replace(/\D+/g, " ").trim().split(" ")[0]) : NaN;
}

const n = Number(process.argv[2] ?? 24);
const before = kib("VmHWM:");
const state = simulateStatevector(layeredAnsatz(n, 2));
const after = kib("VmHWM:");
console.log(JSON.stringify({ n, startPeakKiB: before, peakKiB: after, check: state.re[0] }));
