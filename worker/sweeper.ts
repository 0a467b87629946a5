/** Runs lib/runs/sweep.ts every 30 s (first pass after 10 s). */
import { sweepOrphanRuns } from "@/lib/runs/sweep";
import { log } from "./log";

const SWEEP_EVERY_MS = 30_000;

export function startSweeper(): { stop: () => void } {
  let busy = false;
  const pass = async () => {
    if (busy) return;
    busy = true;
    try {
      const { requeued, failed } = await sweepOrphanRuns();
      if (requeued || failed) log(`sweeper: ${requeued} run(s) re-queued, ${failed} lost run(s) failed`);
    } catch (error) {
      log("sweeper pass failed", error);
    } finally {
      busy = false;
    }
  };
  const first = setTimeout(pass, 10_000);
  const timer = setInterval(pass, SWEEP_EVERY_MS);
  return {
    stop() {
      clearTimeout(first);
      clearInterval(timer);
    },
  };
}
