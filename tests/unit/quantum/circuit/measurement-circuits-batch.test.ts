/**
 * Measurement circuits for many settings at once: the same text as one circuit per call
 * (the shared body is emitted once), and a size cap checked before any text is emitted.
 */
import { describe, expect, it } from "vitest";
import {
  measurementCircuitQasm,
  measurementCircuitsQasm,
  parseProgram,
} from "@/lib/quantum/circuit";
import { isEngineError } from "@/lib/quantum/errors";

const SOURCE = `OPENQASM 3.0;
include "stdgates.inc";
input float theta;
qubit[3] q;
h q[0];
cx q[0], q[1];
ry(theta) q[2];
crz(theta / 2) q[1], q[2];
`;

describe("measurementCircuitsQasm", () => {
  it("gives, for each bases word, exactly the single-setting circuit", () => {
    const program = parseProgram("qasm3", SOURCE);
    const bases = ["ZZZ", "XIY", "YYX", "III"];
    const texts = measurementCircuitsQasm(program, { theta: 0.7 }, bases);
    expect(texts).toEqual(bases.map((b) => measurementCircuitQasm(program, { theta: 0.7 }, b)));
  });

  it("refuses, naming the sizes, when all circuits together exceed the cap", () => {
    const program = parseProgram("qasm3", SOURCE);
    try {
      measurementCircuitsQasm(program, { theta: 0.7 }, ["ZZZ", "XXX"], 500);
      expect.unreachable();
    } catch (error) {
      expect(isEngineError(error) && error.code).toBe("too_large");
      expect((error as Error).message).toMatch(
        /2 settings × .* MB each.*0\.0 MB an export may hold/,
      );
    }
  });

  it("refuses a large unrolled loop from its operation count, before emitting its text", () => {
    const looped = `OPENQASM 3.0;
include "stdgates.inc";
qubit[2] q;
for int i in [0:9999] { rx(0.1) q[0]; cx q[0], q[1]; rx(0.2) q[1]; cx q[1], q[0]; rz(0.3) q[0]; }
`;
    const program = parseProgram("qasm3", looped);
    const words = Array.from({ length: 60 }, () => "XZ");
    expect(() => measurementCircuitsQasm(program, {}, words, 20_000_000)).toThrow(
      /at least 2\d\.\d MB of text \(60 settings × 0\.4 MB each\)/,
    );
  });
});
