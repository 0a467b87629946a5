/** Samples the run queue into the app's metrics: jobs per state and the oldest waiting job's age. */
import "server-only";
import { getRunsQueue } from "@/lib/queue/enqueue";
import { metrics } from "@/lib/observability/metrics";

const STATES = ["waiting", "active", "delayed", "prioritized", "failed"] as const;

export async function sampleQueue(): Promise<void> {
  const m = metrics();
  try {
    const queue = getRunsQueue();
    const counts = await queue.getJobCounts(...STATES);
    for (const state of STATES) m.queueDepth.set({ state }, counts[state] ?? 0);
    const [oldest] = await queue.getJobs(["waiting"], 0, 0, true);
    m.queueOldestAge.set(oldest ? Math.max(0, (Date.now() - oldest.timestamp) / 1000) : 0);
  } catch {
    // Redis unreachable: keep the last values; /api/ready reports the outage.
  }
}
