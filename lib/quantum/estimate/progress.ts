/**
 * Progress and cancellation for `estimate`. A `Progress` covers a fraction range of the
 * whole run; `span(a, b)` makes a child for a sub-range. `tick(f)` (f in [0, 1] of the
 * span) throws EngineError("canceled") once the AbortSignal fired, reports at most every
 * 100 ms (so reports arrive well within every ~200 ms of work) and yields to the event
 * loop at most every 50 ms, so an abort from a timer or a queue event is noticed.
 */
import { EngineError } from "../errors";
import type { ProgressFn } from "../types";

const REPORT_MS = 100;
const YIELD_MS = 50;

interface Shared {
  onProgress?: ProgressFn;
  signal?: AbortSignal;
  lastReport: number;
  lastYield: number;
  lastFraction: number;
}

export class Progress {
  private constructor(
    private readonly shared: Shared,
    private readonly start: number,
    private readonly end: number,
    readonly phase: string,
  ) {}

  static root(onProgress?: ProgressFn, signal?: AbortSignal): Progress {
    const now = performance.now();
    return new Progress(
      { onProgress, signal, lastReport: now, lastYield: now, lastFraction: 0 },
      0,
      1,
      "start",
    );
  }

  span(from: number, to: number, phase: string = this.phase): Progress {
    const w = this.end - this.start;
    return new Progress(this.shared, this.start + from * w, this.start + to * w, phase);
  }

  /** Whole-run fraction of a local fraction. */
  private global(f: number): number {
    return this.start + Math.min(1, Math.max(0, f)) * (this.end - this.start);
  }

  throwIfCanceled(): void {
    if (this.shared.signal?.aborted) throw new EngineError("canceled", "the run was canceled");
  }

  /**
   * Reports, without yielding: always when `force` (start and end of the run), otherwise
   * at most every 100 ms — a 10,000-point sweep must not flood the callback.
   */
  report(f: number, force = false): void {
    this.throwIfCanceled();
    if (!force && performance.now() - this.shared.lastReport < REPORT_MS) return;
    const g = Math.max(this.shared.lastFraction, this.global(f));
    this.shared.lastFraction = g;
    this.shared.lastReport = performance.now();
    this.shared.onProgress?.(g, this.phase);
  }

  async tick(f: number): Promise<void> {
    this.throwIfCanceled();
    const now = performance.now();
    this.report(f);
    if (now - this.shared.lastYield >= YIELD_MS) {
      await new Promise<void>((resolve) => setTimeout(resolve, 0));
      this.shared.lastYield = performance.now();
      this.throwIfCanceled();
    }
  }

  /** Adapter for the simulators' synchronous onProgress(fraction, phase). */
  syncReporter(): ProgressFn {
    return (f) => this.report(f);
  }

  get signal(): AbortSignal | undefined {
    return this.shared.signal;
  }
}
