import { describe, expect, it } from "vitest";
import { defaultNavSections, isActive, type NavItem } from "@/components/shell/nav-items";

const all: NavItem[] = defaultNavSections.flatMap((s) => s.items);
const byLabel = (label: string) => all.find((i) => i.label === label)!;
const activeLabels = (path: string) =>
  all.filter((i) => isActive(i, path, all)).map((i) => i.label);

// Behaviour the sidebar promises (product rule, no outside source): exactly one entry is
// current on every page of the signed-in area, and the most specific entry wins.
describe("sidebar active entry", () => {
  it("lights Dashboard only on /app itself", () => {
    expect(activeLabels("/app")).toEqual(["Dashboard"]);
    expect(isActive(byLabel("Dashboard"), "/app/runs", all)).toBe(false);
  });
  it("lights New run, not Runs, on /app/runs/new", () => {
    expect(activeLabels("/app/runs/new")).toEqual(["New run"]);
  });
  it("lights Runs on the list and on a run page", () => {
    expect(activeLabels("/app/runs")).toEqual(["Runs"]);
    expect(activeLabels("/app/runs/run_123")).toEqual(["Runs"]);
  });
  it("does not match a sibling that merely shares a prefix", () => {
    expect(isActive({ href: "/app/runs", label: "Runs", icon: "runs" }, "/app/runsx", all)).toBe(
      false,
    );
  });
  it("lights nothing outside the signed-in area", () => {
    expect(activeLabels("/pricing")).toEqual([]);
  });
  it("links every entry under /app and uses each href once", () => {
    const hrefs = all.map((i) => i.href);
    expect(hrefs.every((h) => h === "/app" || h.startsWith("/app/"))).toBe(true);
    expect(new Set(hrefs).size).toBe(hrefs.length);
  });
});
