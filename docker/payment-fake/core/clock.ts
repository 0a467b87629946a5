/**
 * Fake time. Every customer lives on the fake clock: real time plus a global
 * offset plus that customer's own offset (like a per-customer test clock).
 * `POST /_fake/advance` moves one customer, or everybody, forward; time never
 * goes back. All provider timestamps are Unix seconds.
 *
 * Webhook signatures are the exception: they use real time, because the
 * receiver checks them against its own (real) clock.
 */
export interface ClockState {
  /** Seconds added to real time for everybody. */
  offset: number;
  /** Extra seconds per customer id. */
  customerOffsets: Record<string, number>;
}

export class FakeClock {
  constructor(
    private readonly state: ClockState,
    private readonly realNowMs: () => number = Date.now,
  ) {}

  /** Current fake time in Unix seconds, for one customer or the shared clock. */
  now(customer?: string | null): number {
    const base = Math.floor(this.realNowMs() / 1000) + this.state.offset;
    return customer ? base + (this.state.customerOffsets[customer] ?? 0) : base;
  }

  /** Moves time forward by `seconds` (≥ 0) for one customer or for all. */
  advance(seconds: number, customer?: string | null): void {
    if (!Number.isFinite(seconds) || seconds < 0) throw new RangeError("time only moves forward");
    if (customer) {
      this.state.customerOffsets[customer] =
        (this.state.customerOffsets[customer] ?? 0) + Math.round(seconds);
    } else {
      this.state.offset += Math.round(seconds);
    }
  }
}

/**
 * Adds calendar months in UTC, clamping to the last day of a shorter month
 * (Jan 31 + 1 month = Feb 28/29), as monthly billing anchors do. Always
 * computed from the original anchor so periods never drift.
 */
export function addMonths(unixSeconds: number, months: number): number {
  const d = new Date(unixSeconds * 1000);
  const day = d.getUTCDate();
  const target = new Date(
    Date.UTC(
      d.getUTCFullYear(),
      d.getUTCMonth() + months,
      1,
      d.getUTCHours(),
      d.getUTCMinutes(),
      d.getUTCSeconds(),
    ),
  );
  const lastDay = new Date(
    Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0),
  ).getUTCDate();
  target.setUTCDate(Math.min(day, lastDay));
  return Math.floor(target.getTime() / 1000);
}
