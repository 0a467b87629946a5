/**
 * Structural checks of a bound Circuit before simulation: every qubit index in range, gate
 * operands distinct, every part's matrix of size 2·4^k. A failure is a typed EngineError
 * ("invalid_request") naming the source line, never a crash inside a kernel.
 */
import { EngineError } from "../errors";
import type { Circuit, CircuitOp } from "../types";
import { checkGateShape } from "./kernels";

function fail(op: CircuitOp, message: string): never {
  throw new EngineError("invalid_request", `line ${op.line}: ${message}`, [
    { path: ["circuit", "source"], message, line: op.line },
  ]);
}

function checkQubits(op: CircuitOp, qubits: readonly number[], n: number): void {
  const seen = new Set<number>();
  for (const q of qubits) {
    if (!Number.isInteger(q) || q < 0 || q >= n)
      fail(op, `qubit index ${q} is outside the ${n}-qubit register`);
    if (seen.has(q)) fail(op, `qubit ${q} is used twice in one operation`);
    seen.add(q);
  }
}

export function checkCircuit(circuit: Circuit): void {
  const n = circuit.numQubits;
  if (!Number.isInteger(n) || n < 0) {
    throw new EngineError(
      "invalid_request",
      `a circuit needs a whole, non-negative number of qubits (got ${n})`,
    );
  }
  for (const op of circuit.ops) {
    if (op.kind === "gate") {
      checkQubits(op, op.qubits, n);
      for (const part of op.parts) {
        try {
          checkGateShape(n, part.qubits, part.matrix);
        } catch (e) {
          fail(op, `gate ${op.name}: ${(e as Error).message}`);
        }
      }
    } else if (op.kind === "barrier") {
      checkQubits(op, op.qubits, n);
    } else {
      checkQubits(op, [op.qubit], n);
    }
  }
}
