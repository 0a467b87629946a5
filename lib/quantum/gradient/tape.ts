/**
 * The differentiable view of a compiled program at one parameter point: every primitive
 * application with its bound matrix and, for each of its angles that depends on an
 * input, the compiled angle expression (whose `grad` gives ∂angle/∂input by the chain
 * rule over every occurrence). No fusion: each angle keeps its own gate.
 */
import {
  compiledOf,
  evaluateChecked,
  readInputs,
  slotMatrices,
  type ParsedProgram,
} from "../circuit/program";
import type { Compiled } from "../circuit/expressions";
import type { PrimitiveGate } from "../circuit/gate-library";

export interface TapeAngle {
  /** Index of the angle among the gate's parameters. */
  k: number;
  expr: Compiled;
}

export interface TapePart {
  gate: PrimitiveGate;
  qubits: number[];
  matrix: Float64Array;
  /** Bound values of all the gate's parameters. */
  values: number[];
  /** The angles that depend on inputs (empty for a constant gate). */
  angles: TapeAngle[];
  /** Position in the bound Circuit: ops[opIndex].parts[partIndex]. */
  opIndex: number;
  partIndex: number;
}

export type TapeOp =
  /** `name` as written (noise overrides are keyed by it). */
  | { kind: "gate"; name: string; qubits: number[]; parts: TapePart[] }
  /** `final`: nothing acts on the qubit afterwards (ignored, as by the simulators). */
  | { kind: "measure"; qubit: number; final: boolean }
  | { kind: "reset"; qubit: number };

export interface Tape {
  numQubits: number;
  numInputs: number;
  inputNames: string[];
  /** Input values in declaration order. */
  x: Float64Array;
  ops: TapeOp[];
}

export function buildTape(program: ParsedProgram, params: Record<string, number>): Tape {
  const p = compiledOf(program);
  const x = readInputs(p.inputs, params);
  const matrices = slotMatrices(p, x);
  const ops: TapeOp[] = [];
  const final = new Array<boolean>(p.ops.length).fill(false);
  const touchedLater = new Set<number>();
  for (let i = p.ops.length - 1; i >= 0; i--) {
    const op = p.ops[i];
    if (op.kind === "measure") {
      final[i] = !touchedLater.has(op.qubit);
      touchedLater.add(op.qubit);
    } else if (op.kind === "reset") touchedLater.add(op.qubit);
    else if (op.kind === "gate") for (const q of op.qubits) touchedLater.add(q);
  }
  p.ops.forEach((op, index) => {
    if (op.kind === "measure") ops.push({ kind: "measure", qubit: op.qubit, final: final[index] });
    else if (op.kind === "reset") ops.push({ kind: "reset", qubit: op.qubit });
    else if (op.kind === "gate") {
      const parts = op.parts.map((t, i): TapePart => {
        const angles: TapeAngle[] = [];
        t.params.forEach((c, k) => {
          if (c.constant === null) angles.push({ k, expr: c });
        });
        return {
          gate: t.gate,
          qubits: op.partQubits[i],
          matrix: t.constMatrix ?? matrices[t.slot],
          values: t.params.map((c) => evaluateChecked(c, x)),
          angles,
          opIndex: index,
          partIndex: i,
        };
      });
      ops.push({ kind: "gate", name: op.name, qubits: op.qubits, parts });
    }
  });
  return {
    numQubits: p.numQubits,
    numInputs: p.inputs.length,
    inputNames: p.inputs.map((i) => i.name),
    x,
    ops,
  };
}

/** ∂angle/∂input_j for every input j (a fresh vector). */
export function angleGradient(tape: Tape, angle: TapeAngle): Float64Array {
  const out = new Float64Array(tape.numInputs);
  angle.expr.grad(tape.x, out, 1);
  return out;
}

/** Conjugate transpose of an interleaved d×d matrix. */
export function dagger(m: Float64Array): Float64Array {
  const d = Math.round(Math.sqrt(m.length / 2));
  const out = new Float64Array(m.length);
  for (let r = 0; r < d; r++) {
    for (let c = 0; c < d; c++) {
      out[2 * (c * d + r)] = m[2 * (r * d + c)];
      out[2 * (c * d + r) + 1] = -m[2 * (r * d + c) + 1];
    }
  }
  return out;
}
