import { describe, expect, it } from "vitest";
import { formatBytes, formatDuration, formatMoney, formatWait } from "@/lib/format/units";

// Currency layout from the Unicode CLDR en-US pattern (¤#,##0.00).
describe("formatMoney", () => {
  it("prints cents with the currency symbol", () => {
    expect(formatMoney(1200)).toBe("$12.00");
    expect(formatMoney(0)).toBe("$0.00");
    expect(formatMoney(2900, "USD")).toBe("$29.00");
    expect(formatMoney(123456, "usd")).toBe("$1,234.56");
    expect(formatMoney(1200, "eur")).toBe("€12.00");
    expect(formatMoney(-500)).toBe("\u2212$5.00");
  });
  it("drops the cents of whole amounts on request and allows fine prices", () => {
    expect(formatMoney(2900, "usd", { whole: true })).toBe("$29");
    expect(formatMoney(2950, "usd", { whole: true })).toBe("$29.50");
    expect(formatMoney(0.04, "usd", { maxDecimals: 4 })).toBe("$0.0004");
  });
});

describe("formatDuration", () => {
  it("switches units at 1 s and 1 min", () => {
    expect(formatDuration(850)).toBe("850 ms");
    expect(formatDuration(4230)).toBe("4.2 s");
    expect(formatDuration(12_400)).toBe("12 s");
    expect(formatDuration(185_000)).toBe("3 min 05 s");
    expect(formatDuration(null)).toBe("—");
  });
});

describe("formatWait", () => {
  it("says seconds, then whole minutes from 90 s", () => {
    expect(formatWait(1)).toBe("1 second");
    expect(formatWait(45)).toBe("45 seconds");
    expect(formatWait(88.2)).toBe("89 seconds");
    expect(formatWait(90)).toBe("2 minutes");
  });
});

describe("formatBytes (decimal SI prefixes, as upload limits are stated)", () => {
  it("rounds small sizes up to whole kB and shows MB with one decimal", () => {
    expect(formatBytes(950)).toBe("1 kB");
    expect(formatBytes(200_000)).toBe("200 kB");
    expect(formatBytes(2_500_000)).toBe("2.5 MB");
    expect(formatBytes(5_000_000)).toBe("5 MB");
  });
  // IEC 80000-13 binary prefixes: 1 KiB = 1024 B, 1 MiB = 2²⁰ B
  it("uses binary prefixes on request", () => {
    expect(formatBytes(512, { binary: true })).toBe("512 B");
    expect(formatBytes(65_536, { binary: true })).toBe("64 KiB");
    expect(formatBytes(256 * 2 ** 20, { binary: true })).toBe("256 MiB");
    expect(formatBytes(4 * 2 ** 20, { binary: true })).toBe("4.0 MiB");
    expect(formatBytes(1.5 * 2 ** 20, { binary: true })).toBe("1.5 MiB");
    expect(formatBytes(2 ** 32, { binary: true })).toBe("4.0 GiB");
  });
});
