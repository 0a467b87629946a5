/**
 * Delivers events to the configured endpoint as signed JSON POSTs, one at a
 * time in creation order. A delivery succeeds on any 2xx answer; otherwise
 * (error status, refused connection, timeout) it is retried with exponential
 * backoff — base × 2^(attempt−1), capped — up to `maxAttempts` tries, then
 * marked failed. Every try is re-signed with a fresh timestamp; the event id
 * and body stay the same, so receivers can de-duplicate by id.
 */
import type { Fake } from "../core/fake";
import type { DeliveryRec, EventRec } from "../core/state";
import { signPayload } from "./signing";

export class WebhookDispatcher {
  private timer: NodeJS.Timeout | null = null;
  private running = false;
  private stopped = false;
  private idleWaiters: (() => void)[] = [];

  constructor(private readonly fake: Fake) {
    fake.onEvent((event) => this.enqueue(event));
  }

  private get settings() {
    return this.fake.config.webhook;
  }

  enqueue(event: EventRec): void {
    if (!this.settings.url) return;
    this.fake.state.deliveries.push({
      event: event.id,
      url: this.settings.url,
      status: "pending",
      attempts: [],
      next_attempt_ms: this.fake.realNowMs(),
    });
    this.kick(0);
  }

  /** Sends an event again (a new delivery), e.g. for a receiver that was down. */
  redeliver(eventId: string): boolean {
    const event = this.fake.state.events[eventId];
    if (!event) return false;
    event.pending_webhooks += 1;
    this.enqueue(event);
    return true;
  }

  pendingCount(): number {
    return this.fake.state.deliveries.filter((d) => d.status === "pending").length;
  }

  /** Resolves once no delivery is pending (or after `timeoutMs`). */
  async idle(timeoutMs: number): Promise<boolean> {
    if (this.pendingCount() === 0 && !this.running) return true;
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.idleWaiters = this.idleWaiters.filter((w) => w !== done);
        resolve(false);
      }, timeoutMs);
      const done = () => {
        clearTimeout(timer);
        resolve(true);
      };
      this.idleWaiters.push(done);
    });
  }

  /** Resumes deliveries left pending by a previous run (persisted state). */
  resume(): void {
    this.kick(0);
  }

  stop(): void {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  private kick(delayMs: number): void {
    if (this.stopped || this.running) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.pump(), Math.max(0, delayMs));
    this.timer.unref();
  }

  private async pump(): Promise<void> {
    this.timer = null;
    if (this.running || this.stopped) return;
    this.running = true;
    try {
      for (;;) {
        const now = this.fake.realNowMs();
        const due = this.fake.state.deliveries.find(
          (d) => d.status === "pending" && d.next_attempt_ms <= now,
        );
        if (!due) break;
        await this.attempt(due);
        if (this.stopped) return;
      }
    } finally {
      this.running = false;
    }
    const pending = this.fake.state.deliveries.filter((d) => d.status === "pending");
    if (pending.length === 0) {
      const waiters = this.idleWaiters;
      this.idleWaiters = [];
      for (const w of waiters) w();
      return;
    }
    const next = Math.min(...pending.map((d) => d.next_attempt_ms));
    this.kick(next - this.fake.realNowMs());
  }

  private async attempt(delivery: DeliveryRec): Promise<void> {
    const event = this.fake.state.events[delivery.event];
    if (!event) {
      delivery.status = "failed";
      return;
    }
    // Deliver to the endpoint configured now (it may have changed since a restart).
    if (this.settings.url) delivery.url = this.settings.url;
    const payload = JSON.stringify(event, null, 2);
    const signature = signPayload(
      payload,
      this.settings.secret,
      Math.floor(this.fake.realNowMs() / 1000),
    );
    let status: number | null = null;
    let error: string | null = null;
    try {
      const res = await fetch(delivery.url, {
        method: "POST",
        headers: {
          "Content-Type": "application/json; charset=utf-8",
          "User-Agent": "KetwiseLocalPaymentFake/1.0 (+webhooks)",
          "Stripe-Signature": signature,
        },
        body: payload,
        signal: AbortSignal.timeout(this.settings.timeoutMs),
      });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
      if (status < 200 || status >= 300) error = `HTTP ${status}`;
    } catch (e) {
      error = e instanceof Error ? `${e.name}: ${e.message}` : String(e);
    }
    delivery.attempts.push({ at: Math.floor(this.fake.realNowMs() / 1000), status, error });
    if (!error) {
      delivery.status = "succeeded";
      event.pending_webhooks = Math.max(0, event.pending_webhooks - 1);
    } else if (delivery.attempts.length >= this.settings.maxAttempts) {
      delivery.status = "failed";
    } else {
      const backoff = Math.min(
        this.settings.maxDelayMs,
        this.settings.baseDelayMs * 2 ** (delivery.attempts.length - 1),
      );
      delivery.next_attempt_ms = this.fake.realNowMs() + backoff;
    }
    this.fake.scheduleSave();
  }
}
