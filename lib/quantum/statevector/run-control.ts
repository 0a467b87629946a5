/**
 * Progress reporting and cancellation for long simulations. `tick(done)` is called between
 * gates: it throws EngineError("canceled") once the signal is aborted, and calls onProgress
 * when at least REPORT_INTERVAL_MS passed since the last report (so a report arrives well
 * within every ~200 ms of work).
 */
import { EngineError } from "../errors";
import type { ProgressFn } from "../types";

export const REPORT_INTERVAL_MS = 100;

export interface RunOptions {
  onProgress?: ProgressFn;
  signal?: AbortSignal;
}

export function throwIfCanceled(signal: AbortSignal | undefined): void {
  if (signal?.aborted) throw new EngineError("canceled", "the run was canceled");
}

export class RunControl {
  private last = performance.now();

  constructor(
    private readonly opts: RunOptions,
    private readonly total: number,
    private readonly phase: string,
  ) {
    throwIfCanceled(opts.signal);
    opts.onProgress?.(0, phase);
  }

  /** `done` units of `total` finished. */
  tick(done: number): void {
    throwIfCanceled(this.opts.signal);
    if (!this.opts.onProgress) return;
    const now = performance.now();
    if (now - this.last >= REPORT_INTERVAL_MS) {
      this.last = now;
      this.opts.onProgress(this.total > 0 ? Math.min(1, done / this.total) : 1, this.phase);
    }
  }

  finish(): void {
    this.opts.onProgress?.(1, this.phase);
  }
}
