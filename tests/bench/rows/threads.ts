/**
 * Engine-thread rows: the 22-qubit ansatz (6 layers) on 1, 2 and all engine threads, wall
 * time (CPU time adds the threads up), as one thread ÷ T threads — the speed-up. On a
 * machine shared with other jobs the figure is capped by the cores actually free, so the
 * load average printed with the table matters here more than anywhere.
 */
import { availableParallelism } from "node:os";
import { closeKernelPool } from "@/lib/quantum/parallel";
import { simulateStatevector } from "@/lib/quantum/statevector/simulate";
import { layeredAnsatz } from "../ansatz";
import { type BenchRow, type RowResult, fmtClocks, paired, ratioResult } from "../bench-kit";

const N = 22;
const LAYERS = 6;

export const threadRows: BenchRow = async () => {
  const circuit = layeredAnsatz(N, LAYERS);
  const one = (): void => void simulateStatevector(circuit, { threads: 1 });
  const all = 2 ** Math.floor(Math.log2(availableParallelism()));
  const out: RowResult[] = [];
  for (const threads of [...new Set([2, all])]) {
    const many = (): void => void simulateStatevector(circuit, { threads });
    const p = paired(many, one, { clock: "wall" });
    const label = threads === all ? `all = ${threads}` : `${threads}`;
    const target = threads === 2 ? "≥ 1.7" : "";
    out.push(
      ratioResult(
        p,
        `one engine thread ÷ ${label} threads, n=${N} ansatz (${LAYERS} layers), wall time`,
        `${threads} threads ${fmtClocks(p.row)}; 1 thread ${fmtClocks(p.base)}`,
        target,
        threads === 2 ? (r) => r >= 1.7 : undefined,
        true,
      ),
    );
  }
  await closeKernelPool();
  return out;
};
