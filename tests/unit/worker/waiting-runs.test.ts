import { describe, expect, it } from "vitest";
import { WaitingRuns } from "@/worker/waiting-runs";

describe("WaitingRuns", () => {
  it("reports the start of a wait once, and again after the run got its slot", () => {
    let t = 0;
    const w = new WaitingRuns(60_000, () => t);
    expect(w.mark("a")).toBe(true);
    t += 250;
    expect(w.mark("a")).toBe(false);
    w.clear("a");
    t += 250;
    expect(w.mark("a")).toBe(true);
  });

  it("forgets runs that stopped retrying (canceled while delayed), so the set does not grow", () => {
    let t = 0;
    const w = new WaitingRuns(1_000, () => t);
    for (let i = 0; i < 100; i++) w.mark(`canceled-${i}`);
    expect(w.size).toBe(100);
    t += 1_001;
    expect(w.mark("still-waiting")).toBe(true);
    expect(w.size).toBe(1);
  });

  it("keeps a run that retries within the window", () => {
    let t = 0;
    const w = new WaitingRuns(1_000, () => t);
    w.mark("a");
    for (let i = 0; i < 10; i++) {
      t += 500;
      expect(w.mark("a")).toBe(false);
    }
  });
});
