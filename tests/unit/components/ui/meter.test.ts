/**
 * The quota meter's wording (product rule, no outside source): exactly at the limit is
 * "full", stated without red and without "over … by 0"; only usage beyond the limit is over.
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Meter } from "@/components/ui/meter";

const html = (used: number, limit: number) =>
  renderToStaticMarkup(
    createElement(Meter, { label: "Seats", used, limit, unit: "seats", format: String }),
  );

describe("quota meter", () => {
  it("seats exactly full: no 'over by 0', no red", () => {
    const h = html(5, 5);
    expect(h).not.toMatch(/Over the included quota/);
    expect(h).not.toMatch(/text-danger/);
    expect(h).toMatch(/All 5 seats included in use/);
  });

  it("one over: red, over by 1", () => {
    const h = html(6, 5);
    expect(h).toMatch(/Over the included quota by 1 seats/);
    expect(h).toMatch(/text-danger/);
  });

  it("under: neither", () => {
    const h = html(2, 5);
    expect(h).not.toMatch(/Over the included quota|included in use/);
  });
});
