/**
 * Throttled progress writer of a running run. The engine reports progress as
 * often as it likes; every 250 ms (≤ 4 writes a second) the latest value is
 * written — or, when it has not changed, the run's status is read — and a run
 * that is no longer this attempt's (canceled, or superseded after recovery)
 * calls `onLost` so the engine is stopped. A database hiccup is logged and the
 * next tick tries again.
 */
import "server-only";
import { isCurrentAttempt, writeProgress } from "./execution-mutations";

export const PROGRESS_INTERVAL_MS = 250;

export type ProgressTicker = {
  report: (fraction: number, phase: string) => void;
  stop: () => Promise<void>;
};

export function startProgressTicker(
  run: { orgId: string; runId: string; attempt: number },
  onLost: () => void,
  log: (message: string, error?: unknown) => void,
): ProgressTicker {
  let latest = { fraction: 0, phase: "starting" };
  let written = { ...latest };
  let inFlight: Promise<void> | null = null;
  let stopped = false;

  const tick = async () => {
    try {
      const changed = latest.fraction !== written.fraction || latest.phase !== written.phase;
      const snapshot = { ...latest };
      const current = changed
        ? await writeProgress(run.orgId, run.runId, run.attempt, snapshot.fraction, snapshot.phase)
        : await isCurrentAttempt(run.orgId, run.runId, run.attempt);
      if (changed) written = snapshot;
      if (!current && !stopped) onLost();
    } catch (error) {
      log(`progress write for run ${run.runId} failed; retrying on the next tick`, error);
    }
  };

  const timer = setInterval(() => {
    if (!inFlight) inFlight = tick().finally(() => (inFlight = null));
  }, PROGRESS_INTERVAL_MS);

  return {
    report(fraction, phase) {
      latest = { fraction, phase };
    },
    async stop() {
      stopped = true;
      clearInterval(timer);
      await inFlight;
    },
  };
}
