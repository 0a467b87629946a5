/** Runs lib/runs/sweep.ts every RUN_SWEEP_SECONDS (default 30; first pass after a third of that). */
import { env } from "@/lib/env";
import { sweepOrphanRuns } from "@/lib/runs/sweep";
import { log } from "./log";

export function startSweeper(): { stop: () => void } {
  let busy = false;
  const pass = async () => {
    if (busy) return;
    busy = true;
    try {
      const { requeued, failed } = await sweepOrphanRuns();
      if (requeued || failed)
        log(`sweeper: ${requeued} run(s) re-queued, ${failed} lost run(s) failed`);
    } catch (error) {
      log("sweeper pass failed", error);
    } finally {
      busy = false;
    }
  };
  const everyMs = env.RUN_SWEEP_SECONDS * 1000;
  const first = setTimeout(pass, Math.ceil(everyMs / 3));
  const timer = setInterval(pass, everyMs);
  return {
    stop() {
      clearTimeout(first);
      clearInterval(timer);
    },
  };
}
