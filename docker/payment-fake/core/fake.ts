/**
 * The running fake: state + clock + configuration + event emission. Request
 * handlers are synchronous once the body is read, so one mutation never
 * interleaves with another (no locks needed).
 */
import { existsSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { FakeClock } from "./clock";
import { newId } from "./ids";
import { emptyState, type EventRec, type FakeState } from "./state";

export interface WebhookSettings {
  /** Where events are POSTed; empty string disables delivery. */
  url: string;
  secret: string;
  maxAttempts: number;
  baseDelayMs: number;
  maxDelayMs: number;
  timeoutMs: number;
}

export interface FakeConfig {
  /** Base of hosted pages (checkout, invoice, portal, PDF), as the browser reaches it. */
  publicUrl: string;
  /** When set, the one secret key accepted; otherwise any well-formed test key. */
  apiKey: string | null;
  /** API version stamped on events (what SDK v23 sends by default). */
  apiVersion: string;
  webhook: WebhookSettings;
  /** Optional JSON file the state is saved to and loaded from. */
  dataFile: string | null;
  /** How often due renewals and retries are checked in real time (ms). */
  tickMs: number;
}

export interface RequestInfo {
  id: string | null;
  idempotency_key: string | null;
}

export class Fake {
  state: FakeState;
  readonly clock: FakeClock;
  /** Set while a request runs, so events record which request caused them. */
  request: RequestInfo = { id: null, idempotency_key: null };
  readonly realNowMs: () => number;
  private listeners: ((event: EventRec) => void)[] = [];
  private saveTimer: NodeJS.Timeout | null = null;
  private override: number | null = null;
  private closed = false;

  constructor(
    readonly config: FakeConfig,
    realNowMs: () => number = Date.now,
  ) {
    this.state = loadState(config.dataFile);
    this.realNowMs = realNowMs;
    this.clock = new FakeClock(this.state.clock, realNowMs);
  }

  /** Fake now (Unix seconds) for a customer, or the shared clock. */
  now(customer?: string | null): number {
    return this.override ?? this.clock.now(customer);
  }

  /**
   * Runs `fn` as if it were fake time `at`: work that fell due while time
   * was advanced is stamped with the moment it was due, not with "now".
   */
  runAt<T>(at: number, fn: () => T): T {
    const saved = this.override;
    this.override = at;
    try {
      return fn();
    } finally {
      this.override = saved;
    }
  }

  onEvent(listener: (event: EventRec) => void): void {
    this.listeners.push(listener);
  }

  /**
   * Records an event with a snapshot of the object and, for `*.updated`
   * events, the previous values of the top-level fields that changed.
   */
  emit(
    type: string,
    object: Record<string, unknown>,
    before?: Record<string, unknown>,
    customer?: string | null,
  ): EventRec {
    const event: EventRec = {
      id: newId("evt"),
      object: "event",
      api_version: this.config.apiVersion,
      created: this.now(customer),
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: this.config.webhook.url ? 1 : 0,
      request: { ...this.request },
      type,
    };
    if (before) event.data.previous_attributes = changedFields(before, object);
    this.state.events[event.id] = event;
    for (const listener of this.listeners) listener(event);
    return event;
  }

  /** Replaces the whole state (reset), keeping the same clock object wiring. */
  reset(): void {
    const fresh = emptyState();
    Object.assign(this.state, fresh);
    Object.assign(this.state.clock, fresh.clock);
    this.scheduleSave();
  }

  scheduleSave(): void {
    if (!this.config.dataFile || this.saveTimer || this.closed) return;
    this.saveTimer = setTimeout(() => {
      this.saveTimer = null;
      try {
        this.saveNow();
      } catch (e) {
        console.error(`[payment-fake] could not save state to ${this.config.dataFile}:`, e);
      }
    }, 50);
    this.saveTimer.unref();
  }

  /** Writes the state file at once (atomically: temp file, then rename). */
  saveNow(): void {
    if (this.saveTimer) clearTimeout(this.saveTimer);
    this.saveTimer = null;
    const file = this.config.dataFile;
    if (!file || this.closed) return;
    writeFileSync(`${file}.tmp`, JSON.stringify(this.state));
    renameSync(`${file}.tmp`, file);
  }

  /** Final save; afterwards nothing is written any more. */
  close(): void {
    this.saveNow();
    this.closed = true;
  }
}

function loadState(file: string | null): FakeState {
  if (!file || !existsSync(file)) return emptyState();
  const parsed = JSON.parse(readFileSync(file, "utf8")) as FakeState;
  if (parsed.version !== 1)
    throw new Error(`${file}: unknown state version ${String(parsed.version)}`);
  return { ...emptyState(), ...parsed };
}

/** Top-level fields whose JSON differs, with their old values. */
export function changedFields(
  before: Record<string, unknown>,
  after: Record<string, unknown>,
): Record<string, unknown> {
  const previous: Record<string, unknown> = {};
  for (const key of Object.keys(before)) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) previous[key] = before[key];
  }
  return previous;
}
