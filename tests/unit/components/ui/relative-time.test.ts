import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { RelativeTime } from "@/components/ui/relative-time";

// HTML Living Standard, the time element: its datetime attribute carries the machine-readable
// instant; the text is for people.
describe("RelativeTime", () => {
  it("puts the ISO instant in datetime and the UTC date and time in the tooltip", () => {
    const html = renderToStaticMarkup(
      createElement(RelativeTime, { date: "2025-12-31T23:59:30Z", className: "x" }),
    );
    expect(html).toContain('dateTime="2025-12-31T23:59:30.000Z"');
    expect(html).toContain('title="31 Dec 2025, 23:59:30 UTC"');
    // older than a day: the words are the date and time themselves
    expect(html).toContain(">31 Dec 2025, 23:59</time>");
  });
});
