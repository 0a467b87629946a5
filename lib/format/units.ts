/** Money, durations and sizes for people. */
import { fixedAbs, formatCount, formatNumber, MINUS, NUMBER_LOCALE } from "./numbers";
import { plural } from "./plural";

const money = new Map<string, Intl.NumberFormat>();

/**
 * An amount in the currency's minor unit (cents) with its symbol: formatMoney(1200) →
 * "$12.00", formatMoney(1200, "eur") → "€12.00". `whole: true` drops ".00" from whole
 * amounts ("$12", but "$12.50"); `maxDecimals` allows finer prices ("$0.0004").
 */
export function formatMoney(
  cents: number,
  currency = "usd",
  options: { whole?: boolean; maxDecimals?: number } = {},
): string {
  if (!Number.isFinite(cents)) throw new RangeError(`Amount must be finite, got ${cents}.`);
  const code = currency.toUpperCase();
  const maxDecimals = options.maxDecimals ?? (options.whole && cents % 100 === 0 ? 0 : 2);
  const key = `${code}:${maxDecimals}`;
  let f = money.get(key);
  if (!f) {
    f = new Intl.NumberFormat(NUMBER_LOCALE, {
      style: "currency",
      currency: code,
      minimumFractionDigits: Math.min(2, maxDecimals),
      maximumFractionDigits: maxDecimals,
    });
    money.set(key, f);
  }
  const text = f.format(Math.abs(cents) / 100);
  return cents < 0 && /[1-9]/.test(text) ? MINUS + text : text;
}

/** "850 ms", "4.2 s", "12 s", "3 min 05 s"; a missing or non-finite value is "—". */
export function formatDuration(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return "—";
  if (ms < 1000) return `${Math.round(ms)} ms`;
  if (ms < 60_000) return `${(ms / 1000).toFixed(ms < 10_000 ? 1 : 0)} s`;
  const m = Math.floor(ms / 60_000);
  const s = Math.round((ms % 60_000) / 1000);
  return `${formatCount(m)} min ${String(s).padStart(2, "0")} s`;
}

/**
 * A waiting time in words, rounded up: 1 → "1 second", 45 → "45 seconds", from 90 s in
 * whole minutes ("2 minutes").
 */
export function formatWait(seconds: number): string {
  const s = Math.max(0, Math.ceil(seconds));
  if (s >= 90) return `${formatCount(Math.ceil(s / 60))} minutes`;
  return plural(s, "second");
}

/**
 * A file size in decimal (SI) units, as upload limits are stated: 950 → "1 kB",
 * 2_500_000 → "2.5 MB", 5_000_000 → "5 MB". Sizes under 1 MB round up to whole kB.
 * `binary: true` uses IEC units for memory and request-body caps, with one decimal from GiB
 * up and below 10 of a unit: 512 → "512 B", 65_536 → "64 KiB", 256 × 2²⁰ → "256 MiB",
 * 4 × 2²⁰ → "4.0 MiB", 2³² → "4.0 GiB".
 */
export function formatBytes(n: number, options: { binary?: boolean } = {}): string {
  if (!Number.isFinite(n) || n < 0)
    throw new RangeError(`Size must be a non-negative number, got ${n}.`);
  if (options.binary) return binaryBytes(n);
  if (n >= 1e9) return `${formatNumber(n / 1e9, 1)} GB`;
  if (n >= 1e6) return `${formatNumber(n / 1e6, 1)} MB`;
  return `${formatCount(Math.ceil(n / 1000))} kB`;
}

const BINARY_UNITS = ["B", "KiB", "MiB", "GiB", "TiB", "PiB", "EiB"];

function binaryBytes(bytes: number): string {
  let v = bytes;
  let u = 0;
  while (v >= 1024 && u < BINARY_UNITS.length - 1) {
    v /= 1024;
    u++;
  }
  if (u === 0) return `${formatCount(v)} B`;
  return `${u >= 3 || v < 10 ? fixedAbs(v, 1) : formatCount(v)} ${BINARY_UNITS[u]}`;
}
