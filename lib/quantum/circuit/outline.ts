/**
 * `circuitOutline(program, parameters)` — what a circuit diagram and a form for the
 * circuit's inputs need (circuitOutlineSchema): qubits and labels, the inputs, and the
 * first MAX_OUTLINE_OPS top-level operations bound with `parameters`. Inputs without a
 * finite value there are bound to 0 and listed in `placeholders`; names that are not
 * inputs are ignored (a draft may still carry values of inputs it no longer has).
 */
import { MAX_OUTLINE_OPS, type CircuitOutline } from "../schemas";
import type { ParsedProgram } from "./program";

export function circuitOutline(
  program: ParsedProgram,
  parameters: Record<string, unknown> = {},
  maxOps = MAX_OUTLINE_OPS,
): CircuitOutline {
  const placeholders: string[] = [];
  const values: Record<string, number> = {};
  for (const input of program.inputs) {
    const v = parameters[input.name];
    if (typeof v === "number" && Number.isFinite(v)) values[input.name] = v;
    else {
      values[input.name] = 0;
      placeholders.push(input.name);
    }
  }
  const circuit = program.bind(values);
  const ops = circuit.ops.slice(0, maxOps).map((op): CircuitOutline["ops"][number] => {
    switch (op.kind) {
      case "gate":
        return { kind: "gate", name: op.name, qubits: [...op.qubits], params: [...op.params] };
      case "measure":
        return { kind: "measure", qubit: op.qubit, clbit: op.clbit };
      case "reset":
        return { kind: "reset", qubit: op.qubit };
      default:
        return { kind: "barrier", qubits: [...op.qubits] };
    }
  });
  return {
    qubits: circuit.numQubits,
    qubitLabels: [...circuit.qubitLabels],
    inputs: program.inputs.map((i) => ({ name: i.name, type: i.type })),
    ops,
    omitted: Math.max(0, circuit.ops.length - ops.length),
    placeholders,
  };
}
