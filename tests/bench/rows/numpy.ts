/**
 * NumPy comparison row: the same 20-qubit ansatz in tests/bench/ansatz_numpy.py (einsum
 * kernel and in-place sliced kernel; the faster counts). Prints Ketwise ÷ NumPy and checks
 * that both programs produced the same amplitudes. Installs Debian's python3-numpy with
 * apt-get when no python3 here can import numpy.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import type { StateVector } from "@/lib/quantum/types";
import { type BenchRow, fmtMs } from "../bench-kit";
import { ANSATZ_LAYERS, ANSATZ_N } from "./ansatz";

function canImportNumpy(python: string): boolean {
  return spawnSync(python, ["-c", "import numpy"], { stdio: "ignore" }).status === 0;
}

function findPython(): string {
  if (canImportNumpy("python3")) return "python3";
  if (canImportNumpy("/usr/bin/python3")) return "/usr/bin/python3";
  console.error("numpy not found: installing python3-numpy with apt-get …");
  spawnSync("apt-get", ["update"], { stdio: "ignore" });
  const r = spawnSync("apt-get", ["install", "-y", "--no-install-recommends", "python3-numpy"], {
    stdio: "ignore",
  });
  if (r.status !== 0 || !canImportNumpy("/usr/bin/python3"))
    throw new Error("could not install python3-numpy");
  return "/usr/bin/python3";
}

interface NumpyOut {
  numpy: string;
  einsumMs: number;
  slicedMs: number;
  agree: number;
  probe: number[];
  amplitudes: [number, number][];
}

export const numpyRow: BenchRow = (ctx) => {
  const ketwiseMs = ctx.shared.get("ansatzMs") as number | undefined;
  const state = ctx.shared.get("ansatzState") as StateVector | undefined;
  if (ketwiseMs === undefined || !state) throw new Error("numpyRow needs ansatzRow to run first");
  const python = findPython();
  const script = fileURLToPath(new URL("../ansatz_numpy.py", import.meta.url));
  const out = JSON.parse(
    execFileSync(python, [script, String(ANSATZ_N), String(ANSATZ_LAYERS)], { encoding: "utf8" }),
  ) as NumpyOut;
  let diff = out.agree;
  out.probe.forEach((idx, j) => {
    diff = Math.max(
      diff,
      Math.hypot(state.re[idx] - out.amplitudes[j][0], state.im[idx] - out.amplitudes[j][1]),
    );
  });
  const numpyMs = Math.min(out.einsumMs, out.slicedMs);
  const ratio = ketwiseMs / numpyMs;
  return [
    {
      row: `ansatz n=${ANSATZ_N} Ketwise ÷ NumPy ${out.numpy} (einsum ${fmtMs(out.einsumMs)}, sliced ${fmtMs(out.slicedMs)})`,
      measured: `${fmtMs(ketwiseMs)} vs ${fmtMs(numpyMs)}; amplitudes agree to ${diff.toExponential(1)}`,
      value: ratio,
      target: "≤ 0.3",
      pass: ratio <= 0.3 && diff < 1e-9,
    },
  ];
};
