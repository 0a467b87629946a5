/**
 * `parseProgram` and the ParsedProgram it returns. Parsing and checking happen once;
 * `bind(params)` only evaluates pre-compiled closures and builds the matrices whose
 * parameters depend on inputs, so a sweep may call it thousands of times.
 *
 * The returned Circuit is read-only data: matrices of gates with constant parameters
 * and the qubit arrays are shared between binds and must not be mutated.
 */
import { EngineError, isEngineError } from "../errors";
import type { Circuit, CircuitOp, GateApplication } from "../types";
import { parameterError, semanticError, syntaxError } from "./circuit-errors";
import { compileProgram } from "./compile-program";
import type { Compiled } from "./expressions";
import { parseSource, type QasmFormat } from "./parse-source";
import type { CompiledProgram, ProgramInput } from "./program-ir";

export type { QasmFormat } from "./parse-source";
export type { ProgramInput } from "./program-ir";

export interface ParsedProgram {
  readonly format: QasmFormat;
  readonly numQubits: number;
  readonly numClbits: number;
  /** Display labels of the flattened qubits, qubit 0 first (e.g. "q[0]", "anc[0]"). */
  readonly qubitLabels: readonly string[];
  /** Named parameters (OpenQASM 3 `input float/angle` declarations), in declaration order. */
  readonly inputs: readonly ProgramInput[];
  /** The circuit with every input bound; missing, unknown or non-finite values are rejected. */
  bind(params?: Record<string, number>): Circuit;
}

const compiledPrograms = new WeakMap<ParsedProgram, CompiledProgram>();

/** The compiled form behind a ParsedProgram made by parseProgram (for the exporters). */
export function compiledOf(program: ParsedProgram): CompiledProgram {
  const c = compiledPrograms.get(program);
  if (c === undefined)
    throw new EngineError("invalid_request", "not a program returned by parseProgram");
  return c;
}

/** Parses and checks an OpenQASM 2.0 or OpenQASM 3 (Ketwise subset) program. */
export function parseProgram(format: QasmFormat, source: string): ParsedProgram {
  if (format !== "qasm2" && format !== "qasm3") {
    throw new EngineError(
      "invalid_request",
      `unknown circuit format '${String(format)}' (expected "qasm2" or "qasm3")`,
      [{ path: ["circuit", "format"], message: 'expected "qasm2" or "qasm3"' }],
    );
  }
  if (typeof source !== "string") {
    throw new EngineError("invalid_request", "the circuit source must be a string", [
      { path: ["circuit", "source"], message: "expected a string" },
    ]);
  }
  let compiled: CompiledProgram;
  try {
    compiled = compileProgram(format, parseSource(format, source));
  } catch (e) {
    // Pathological nesting (thousands of parentheses) exhausts the call stack.
    if (!isEngineError(e) && e instanceof RangeError) {
      throw syntaxError("the program is nested too deeply to read", { line: 1, column: 1 });
    }
    throw e;
  }
  const program: ParsedProgram = {
    format,
    numQubits: compiled.numQubits,
    numClbits: compiled.numClbits,
    qubitLabels: Object.freeze([...compiled.qubitLabels]),
    inputs: Object.freeze(compiled.inputs.map((i) => Object.freeze({ ...i }))),
    bind: (params = {}) => bindProgram(compiled, params),
  };
  compiledPrograms.set(program, compiled);
  return program;
}

/** Checks the parameter object against the declared inputs; values in input order. */
export function readInputs(inputs: readonly ProgramInput[], params: unknown): Float64Array {
  if (typeof params !== "object" || params === null || Array.isArray(params)) {
    throw new EngineError(
      "invalid_request",
      "parameters must be an object mapping input names to numbers",
      [{ path: ["parameters"], message: "expected an object of name → number" }],
    );
  }
  const record = params as Record<string, unknown>;
  const names = inputs.map((i) => i.name);
  for (const key of Object.keys(record)) {
    if (!names.includes(key)) {
      const declared =
        names.length > 0
          ? `the circuit declares: ${names.join(", ")}`
          : "the circuit declares no inputs";
      throw parameterError(key, `unknown parameter '${key}' (${declared})`);
    }
  }
  const values = new Float64Array(inputs.length);
  inputs.forEach((input, i) => {
    if (!Object.hasOwn(record, input.name)) {
      throw parameterError(input.name, `missing value for parameter '${input.name}'`);
    }
    const v = record[input.name];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw parameterError(
        input.name,
        `parameter '${input.name}' must be a finite number, got ${String(v)}`,
      );
    }
    values[i] = v;
  });
  return values;
}

/** Evaluates a compiled expression for bound inputs, rejecting a non-finite result. */
export function evaluateChecked(c: Compiled, inputs: Float64Array): number {
  if (c.constant !== null) return c.constant;
  const v = c.evaluate(inputs);
  if (!Number.isFinite(v)) {
    throw semanticError(
      `expression '${c.text}' does not evaluate to a finite number (${v}) for the given parameter values`,
      c,
    );
  }
  return v;
}

/** Matrices of the input-dependent part templates, indexed by slot. */
export function slotMatrices(p: CompiledProgram, inputs: Float64Array): Float64Array[] {
  return p.slots.map((t) => t.gate.matrix(t.params.map((c) => evaluateChecked(c, inputs))));
}

function bindProgram(p: CompiledProgram, params: unknown): Circuit {
  const inputs = readInputs(p.inputs, params);
  const matrices = slotMatrices(p, inputs);
  const ops: CircuitOp[] = new Array(p.ops.length);
  for (let i = 0; i < p.ops.length; i++) {
    const op = p.ops[i];
    if (op.kind !== "gate") {
      ops[i] = op;
      continue;
    }
    const parts: GateApplication[] = new Array(op.parts.length);
    for (let k = 0; k < op.parts.length; k++) {
      const t = op.parts[k];
      parts[k] = {
        name: t.gate.name,
        qubits: op.partQubits[k],
        matrix: t.constMatrix ?? matrices[t.slot],
      };
    }
    const values = op.params.map((c) => evaluateChecked(c, inputs));
    ops[i] = {
      kind: "gate",
      name: op.name,
      qubits: op.qubits,
      params: values,
      parts,
      line: op.line,
    };
  }
  return {
    numQubits: p.numQubits,
    numClbits: p.numClbits,
    ops,
    qubitLabels: p.qubitLabels.slice(),
    hasMidCircuitMeasurement: p.hasMidCircuitMeasurement,
    hasReset: p.hasReset,
  };
}
