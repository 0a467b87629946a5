import { describe, expect, it } from "vitest";
import { formatAngle } from "@/components/circuit-diagram/angle";
import { gateRole } from "@/components/circuit-diagram/gate-roles";
import { layoutCircuit, type DiagramOp } from "@/components/circuit-diagram/layout";

const g = (name: string, qubits: number[], params: number[] = []): DiagramOp => ({
  kind: "gate",
  name,
  qubits,
  params,
});

describe("layoutCircuit — as-soon-as-possible columns (common practice)", () => {
  it("puts a Bell preparation in two columns", () => {
    const l = layoutCircuit(2, [g("h", [0]), g("cx", [0, 1])]);
    expect(l.items.map((i) => i.column)).toEqual([0, 1]);
    expect(l.columns).toHaveLength(2);
  });
  it("packs independent single-qubit gates into one column", () => {
    const l = layoutCircuit(3, [g("h", [0]), g("x", [1]), g("ry", [2], [0.3])]);
    expect(l.items.map((i) => i.column)).toEqual([0, 0, 0]);
  });
  it("lets a two-qubit gate block the rows it crosses", () => {
    // cx 0,2 crosses row 1, so the x on qubit 1 must wait for the next column.
    const l = layoutCircuit(3, [g("cx", [0, 2]), g("x", [1])]);
    expect(l.items.map((i) => [i.column, i.top, i.bottom])).toEqual([
      [0, 0, 2],
      [1, 1, 1],
    ]);
  });
  it("never lets two operations share a row in the same column", () => {
    const ops: DiagramOp[] = [
      g("h", [0]),
      g("cx", [0, 3]),
      g("x", [1]),
      g("cz", [1, 2]),
      { kind: "barrier", qubits: [0, 1, 2, 3] },
      g("h", [2]),
      { kind: "measure", qubit: 3 },
    ];
    const l = layoutCircuit(4, ops);
    const used = new Set<string>();
    for (const it of l.items) {
      for (let r = it.top; r <= it.bottom; r++) {
        const key = `${it.column}:${r}`;
        expect(used.has(key)).toBe(false);
        used.add(key);
      }
    }
    // The barrier fences: the h on qubit 2 comes after it.
    const barrier = l.items.find((i) => i.role.kind === "barrier")!;
    expect(l.items.find((i) => i.index === 5)!.column).toBeGreaterThan(barrier.column);
  });
  it("widens columns for long labels and places them left to right", () => {
    const l = layoutCircuit(1, [g("h", [0]), g("my_long_gate", [0], [0.123456])]);
    expect(l.columns[1].width).toBeGreaterThan(l.columns[0].width);
    expect(l.columns[1].x).toBeGreaterThan(l.columns[0].x + l.columns[0].width);
    expect(l.width).toBeGreaterThan(l.columns[1].x + l.columns[1].width);
  });
  it("truncates beyond maxOps and reports how many were left out", () => {
    const l = layoutCircuit(
      1,
      Array.from({ length: 10 }, () => g("x", [0])),
      { maxOps: 4 },
    );
    expect(l.items).toHaveLength(4);
    expect(l.truncated).toBe(6);
  });
  it("ignores operands outside the register instead of crashing", () => {
    const l = layoutCircuit(1, [g("x", [5])]);
    expect(l.items).toHaveLength(0);
  });
});

describe("gate roles — controls first, as in the OpenQASM 2.0 qelib1.inc definitions (arXiv:1707.03429)", () => {
  it("knows controlled gates by name and arity", () => {
    expect(gateRole("cx", 2)).toMatchObject({ kind: "controlled", controls: 1, target: "x" });
    expect(gateRole("CX", 2)).toMatchObject({ kind: "controlled", controls: 1 });
    expect(gateRole("ccx", 3)).toMatchObject({ kind: "controlled", controls: 2, target: "x" });
    expect(gateRole("crz", 2)).toMatchObject({ kind: "controlled", target: "box", label: "rz" });
    expect(gateRole("cswap", 3)).toMatchObject({ kind: "controlled", controls: 1, target: "swap" });
    expect(gateRole("swap", 2)).toEqual({ kind: "swap" });
  });
  it("draws a user gate that merely starts with c as a box", () => {
    expect(gateRole("cx", 3)).toEqual({ kind: "box" });
    expect(gateRole("corr", 2)).toEqual({ kind: "box" });
  });
});

describe("formatAngle", () => {
  it("prints exact multiples of π as fractions", () => {
    expect(formatAngle(Math.PI / 4)).toBe("π/4");
    expect(formatAngle(-Math.PI / 2)).toBe("\u2212π/2");
    expect(formatAngle((3 * Math.PI) / 4)).toBe("3π/4");
    expect(formatAngle(2 * Math.PI)).toBe("2π");
    expect(formatAngle(Math.PI / 6)).toBe("π/6");
    expect(formatAngle(0)).toBe("0");
  });
  it("prints other values with up to three decimals", () => {
    expect(formatAngle(0.3)).toBe("0.3");
    expect(formatAngle(1.23456)).toBe("1.235");
    expect(formatAngle(-0.1)).toBe("\u22120.1");
    expect(formatAngle(2.5)).toBe("2.5");
    expect(formatAngle(10)).toBe("10");
    // rounds to zero: no minus sign on a zero
    expect(formatAngle(-0.0001)).toBe("0");
  });
});
