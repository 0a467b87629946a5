import { describe, expect, it } from "vitest";
import { plural, pluralWord } from "@/lib/format/plural";

// English number agreement: only exactly one takes the singular; zero, fractions and
// every other count take the plural (common practice in English style guides).
describe("plural", () => {
  it("agrees with 0, 1, 2 and 1,000", () => {
    expect(plural(0, "run")).toBe("0 runs");
    expect(plural(1, "run")).toBe("1 run");
    expect(plural(2, "run")).toBe("2 runs");
    expect(plural(1000, "run")).toBe("1,000 runs");
  });
  it("uses the plural for fractions and negative counts", () => {
    expect(plural(1.5, "shot")).toBe("1.5 shots");
    expect(plural(-1, "qubit")).toBe("\u22121 qubits");
  });
  it("takes irregular forms", () => {
    expect(plural(1, "person", "people")).toBe("1 person");
    expect(plural(3, "person", "people")).toBe("3 people");
    expect(plural(1, "run was", "runs were")).toBe("1 run was");
    expect(plural(4, "run was", "runs were")).toBe("4 runs were");
  });
  it("gives the word alone", () => {
    expect(pluralWord(1, "qubit")).toBe("qubit");
    expect(pluralWord(0, "qubit")).toBe("qubits");
    expect(pluralWord(2, "is", "are")).toBe("are");
  });
});
