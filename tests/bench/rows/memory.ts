/**
 * Peak-memory row: a 24-qubit run (2 ansatz layers) in a fresh child process; its peak RSS
 * (VmHWM) against the target 1.5 × state size + 200 MB. The state is 16 · 2^24 B = 256 MiB.
 */
import { execFileSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { statevectorBytes } from "@/lib/quantum/statevector/memory";
import type { BenchRow } from "../bench-kit";

const N = 24;
const MiB = 2 ** 20;

export const memoryRow: BenchRow = () => {
  const child = fileURLToPath(new URL("../peak-memory-child.ts", import.meta.url));
  const out = execFileSync(process.execPath, ["--import", "tsx", child, String(N)], {
    encoding: "utf8",
  });
  const { peakKiB, startPeakKiB } = JSON.parse(out.trim().split("\n").pop() ?? "{}") as {
    peakKiB: number;
    startPeakKiB: number;
  };
  const peak = peakKiB * 1024;
  const limit = 1.5 * statevectorBytes(N) + 200e6;
  return [
    {
      row: `peak RSS n=${N} (state ${statevectorBytes(N) / MiB} MiB; process start ${(startPeakKiB / 1024).toFixed(0)} MiB)`,
      measured: `${(peak / MiB).toFixed(0)} MiB of ${(limit / MiB).toFixed(0)} MiB allowed`,
      value: peak / limit,
      target: "≤ 1.00 of limit",
      pass: peak <= limit,
    },
  ];
};
