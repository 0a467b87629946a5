"use server";
/**
 * Server actions of the new-run page. `circuitOutlineAction` parses the circuit with the
 * engine (cheap: no simulation) and returns what the diagram and the parameter fields
 * need, so the parser never ships to the browser. Validation messages for the user come
 * from the preview endpoint; this action only reports its first problem briefly.
 */
import { requireCurrentOrg } from "@/lib/auth/guards";
import { isProblemError } from "@/lib/api/problem";
import { parseProgram } from "@/lib/quantum/circuit";
import { isEngineError } from "@/lib/quantum/errors";
import type { DiagramOp } from "@/components/circuit-diagram/layout";
import type { OutlineAnswer } from "@/components/circuit-diagram/outline";

const MAX_DIAGRAM_OPS = 400;
const MAX_SOURCE = 200_000;

export async function circuitOutlineAction(input: {
  format: "qasm2" | "qasm3";
  source: string;
  parameters?: Record<string, number>;
}): Promise<OutlineAnswer> {
  try {
    await requireCurrentOrg("viewer");
  } catch (error) {
    if (isProblemError(error)) return { ok: false, message: error.problem.detail };
    throw error;
  }
  if (typeof input?.source !== "string" || (input.format !== "qasm2" && input.format !== "qasm3")) {
    return { ok: false, message: "No circuit to draw." };
  }
  if (input.source.length > MAX_SOURCE)
    return { ok: false, message: "The circuit is too long to draw here." };
  try {
    const program = parseProgram(input.format, input.source);
    const placeholders: string[] = [];
    const values: Record<string, number> = {};
    for (const i of program.inputs) {
      const v = input.parameters?.[i.name];
      if (typeof v === "number" && Number.isFinite(v)) values[i.name] = v;
      else {
        values[i.name] = 0;
        placeholders.push(i.name);
      }
    }
    const circuit = program.bind(values);
    const ops: DiagramOp[] = circuit.ops.slice(0, MAX_DIAGRAM_OPS).map((op) => {
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
      ok: true,
      outline: {
        qubits: circuit.numQubits,
        qubitLabels: [...circuit.qubitLabels],
        inputs: program.inputs.map((i) => ({ name: i.name, type: i.type })),
        ops,
        omitted: Math.max(0, circuit.ops.length - MAX_DIAGRAM_OPS),
        placeholders,
      },
    };
  } catch (error) {
    if (isEngineError(error)) {
      const first = error.issues[0];
      return { ok: false, message: error.message, line: first?.line, column: first?.column };
    }
    console.error("[ketwise] circuit outline failed", error);
    return { ok: false, message: "The circuit could not be read." };
  }
}
