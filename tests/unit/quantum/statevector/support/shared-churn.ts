/**
 * Child process of memory-pressure.test.ts: allocates `count` states of 64 MiB one after the
 * other (each dropped at once) and prints the peak resident set in MiB. KIND=density: 11-qubit
 * density matrices (a kernel memory each when WebAssembly is on); KIND=shared: 22-qubit
 * statevectors in SharedArrayBuffers (engine threads' arrays).
 */
import { createZeroDensity } from "@/lib/quantum/density-matrix/state";
import { allocateAmplitudes } from "@/lib/quantum/statevector/state";

const count = Number(process.env.COUNT ?? 40);
let peak = 0;
for (let i = 0; i < count; i++) {
  if (process.env.KIND === "shared") {
    const { re, im } = allocateAmplitudes(22, true);
    re.fill(i);
    im.fill(i);
  } else {
    createZeroDensity(11).re[5] = i;
  }
  peak = Math.max(peak, process.memoryUsage().rss);
}
console.log(JSON.stringify({ peakMiB: Math.round(peak / 2 ** 20) }));
