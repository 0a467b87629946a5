/**
 * Which runs this worker process has already reported as "waiting for a slot", so the log
 * says it once per wait and not on every retry. A run that waits retries every few hundred
 * milliseconds; a run canceled or deleted while delayed never comes back, so entries not seen
 * for `forgetAfterMs` are dropped — the set stays as small as the number of runs really waiting.
 */
export class WaitingRuns {
  private readonly lastSeen = new Map<string, number>();

  constructor(
    private readonly forgetAfterMs = 60_000,
    private readonly now: () => number = Date.now,
  ) {}

  /** Marks the run as waiting; true when this is the start of a new wait (log it). */
  mark(runId: string): boolean {
    const t = this.now();
    this.prune(t);
    const fresh = !this.lastSeen.has(runId);
    this.lastSeen.set(runId, t);
    return fresh;
  }

  /** The run got its slot (or ended): its next wait is a new one. */
  clear(runId: string): void {
    this.lastSeen.delete(runId);
  }

  get size(): number {
    return this.lastSeen.size;
  }

  private prune(t: number): void {
    for (const [id, seen] of this.lastSeen) {
      if (t - seen > this.forgetAfterMs) this.lastSeen.delete(id);
    }
  }
}
