import { describe, expect, it } from "vitest";
import { csvField, toCsv } from "@/lib/export/csv";
import { countsCsv, fileStem, runJson, termsCsv, type ExportResult } from "@/lib/export/run-export";
import { pythonReadCsv } from "../../support/python-csv";

describe("csvField — RFC 4180 §2 quoting rules", () => {
  it("leaves plain fields alone and quotes fields with comma, quote, CR or LF", () => {
    expect(csvField("XZ")).toBe("XZ");
    expect(csvField("a,b")).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""'); // §2 rule 7: inner quotes doubled
    expect(csvField("two\nlines")).toBe('"two\nlines"');
    expect(csvField("cr\r")).toBe('"cr\r"');
  });
  it("writes numbers in shortest round-trip form and blanks for missing or non-finite", () => {
    expect(csvField(-1.1372)).toBe("-1.1372");
    expect(csvField(1e-12)).toBe("1e-12");
    expect(Number(csvField(0.1 + 0.2))).toBe(0.1 + 0.2);
    expect(csvField(null)).toBe("");
    expect(csvField(undefined)).toBe("");
    expect(csvField(Number.NaN)).toBe("");
    expect(csvField(Number.POSITIVE_INFINITY)).toBe("");
  });
  it("ends every record with CRLF (§2 rule 1)", () => {
    expect(
      toCsv([
        ["a", 1],
        ["b", 2],
      ]),
    ).toBe("a,1\r\nb,2\r\n");
    expect(toCsv([])).toBe("");
  });
  it("round-trips awkward text through Python's csv reader", () => {
    const rows = [
      ["name", "note"],
      ["Bell, ZZ", 'a "quoted" word'],
      ["multi\nline", "π/4 — ⟨ψ|A|ψ⟩"],
    ];
    expect(pythonReadCsv(toCsv(rows))).toEqual(rows);
  });
});

const result: ExportResult = {
  terms: [
    { pauli: "ZZ", coefficient: 1, exact: 1, sampledMean: 1, stdErr: 0, group: 0 },
    {
      pauli: "XX",
      coefficient: 0.5,
      exact: 1,
      sampledMean: 0.98,
      stdErr: 0.0063,
      ci95: [0.967, 0.992],
      group: 1,
    },
    { pauli: "II", coefficient: -0.25, exact: 1, group: null },
  ],
  groups: [
    { bases: "ZZ", terms: [0], shots: 1000, counts: { "11": 480, "00": 520 } },
    { bases: "XX", terms: [1], shots: 1000, counts: { "00": 495, "11": 495, "01": 10 } },
  ],
};

describe("run CSV exports", () => {
  it("writes one row per term with its setting's bases", () => {
    const rows = pythonReadCsv(termsCsv(result));
    expect(rows[0]).toEqual([
      "pauli",
      "coefficient",
      "exact",
      "sampled_mean",
      "std_err",
      "setting",
      "setting_bases",
      "ci95_low",
      "ci95_high",
    ]);
    expect(rows[2]).toEqual(["XX", "0.5", "1", "0.98", "0.0063", "1", "XX", "0.967", "0.992"]);
    expect(rows[3]).toEqual(["II", "-0.25", "1", "", "", "", "", "", ""]);
    expect(rows).toHaveLength(4);
  });
  it("writes counts per setting, bitstrings in reading order, and the totals match the shots", () => {
    const rows = pythonReadCsv(countsCsv(result)).slice(1);
    expect(rows.map((r) => `${r[1]}:${r[2]}`)).toEqual([
      "ZZ:00",
      "ZZ:11",
      "XX:00",
      "XX:01",
      "XX:11",
    ]);
    for (const [i, g] of result.groups.entries()) {
      const sum = rows.filter((r) => r[0] === String(i)).reduce((s, r) => s + Number(r[3]), 0);
      expect(sum).toBe(g.shots);
    }
  });
  it("JSON export parses back to the same object", () => {
    expect(JSON.parse(runJson(result))).toEqual(result);
  });
  it("file stems are ASCII slugs carrying the run id", () => {
    expect(fileStem("Ising chain — θ sweep", "0b6a9f3e-1c2d")).toBe("ising-chain-sweep-0b6a9f3e");
    expect(fileStem("", "abc")).toBe("run-abc");
    expect(fileStem("Crème brûlée", "x1")).toBe("creme-brulee-x1");
  });
});
