/**
 * Syntax tree → checked, compiled program. Statements are processed in order (a name
 * must be declared before it is used, as in both specifications). Everything that does
 * not need parameter values is checked here: unknown gates, argument and parameter
 * counts, indices, duplicated qubits, undefined registers and parameters, broadcast
 * sizes, non-finite constant expressions.
 */
import type { Expr, GateCallStmt, Operand, Pos, ProgramAst, Stmt } from "./ast";
import { circuitError, plural, semanticError, syntaxError, unsupported3 } from "./circuit-errors";
import {
  compileExpr,
  inputRef,
  isReservedName,
  type Compiled,
  type ExprContext,
} from "./expressions";
import { checkArity, GateScope, type Expanded } from "./gate-definitions";
import { QELIB1, QELIB1_ADDITIONS, STDGATES, type PrimitiveGate } from "./gate-library";
import type { QasmFormat } from "./parse-source";
import {
  LIMITS,
  type CompiledOp,
  type CompiledProgram,
  type PartTemplate,
  type ProgramInput,
} from "./program-ir";
import { broadcast, RegisterTable } from "./registers";

const LIBRARY_FILE: Record<QasmFormat, "qelib1.inc" | "stdgates.inc"> = {
  qasm2: "qelib1.inc",
  qasm3: "stdgates.inc",
};
const QASM3_WORDS = new Set(["qubit", "bit", "input", "float", "angle"]);

class ProgramCompiler {
  private readonly regs = new RegisterTable();
  private readonly gates: GateScope;
  private readonly inputs: ProgramInput[] = [];
  private readonly inputScope = new Map<string, Compiled>();
  private readonly ops: CompiledOp[] = [];
  private readonly slots: PartTemplate[] = [];
  private readonly measured = new Set<number>();
  private mid = false;
  private reset = false;
  private included = false;
  private readonly matrixCache = new Map<PrimitiveGate, Map<string, Float64Array>>();
  private readonly topCtx: ExprContext;

  constructor(
    private readonly format: QasmFormat,
    private readonly source: string,
  ) {
    this.gates = new GateScope(format, source);
    this.topCtx = {
      format,
      source,
      scope: this.inputScope,
      unknownName: (n) =>
        format === "qasm3"
          ? `undefined parameter '${n}' (declare it with 'input float ${n};' before use)`
          : `undefined name '${n}': OpenQASM 2.0 gate parameters outside a gate definition must be numbers, 'pi' or functions of them`,
    };
  }

  run(statements: Stmt[], firstToken: { line: number; column: number } | null): CompiledProgram {
    if (this.format === "qasm2" && statements[0]?.kind !== "version") {
      const at = firstToken ?? { line: 1, column: 1 };
      throw syntaxError("an OpenQASM 2.0 program must start with 'OPENQASM 2.0;'", at);
    }
    statements.forEach((s, i) => this.statement(s, i));
    if (this.regs.numQubits === 0) {
      throw semanticError(
        this.format === "qasm2"
          ? "the program declares no qubits (add e.g. 'qreg q[1];')"
          : "the program declares no qubits (add e.g. 'qubit[1] q;')",
        { line: 1, column: 1 },
      );
    }
    return {
      format: this.format,
      numQubits: this.regs.numQubits,
      numClbits: this.regs.numClbits,
      qubitLabels: this.regs.qubitLabels,
      inputs: this.inputs,
      ops: this.ops,
      slots: this.slots,
      hasMidCircuitMeasurement: this.mid,
      hasReset: this.reset,
    };
  }

  private statement(s: Stmt, index: number): void {
    switch (s.kind) {
      case "version":
        return this.version(s.version, s.pos, index);
      case "include":
        return this.include(s.file, s.pos);
      case "register":
        if (this.inputScope.has(s.name))
          throw semanticError(`'${s.name}' is already declared as an input`, s.pos);
        return this.regs.declare(s.name, s.quantum, s.size, s.pos, s.sizePos);
      case "input":
        return this.input(s.name, s.type, s.pos);
      case "gateDef":
        return this.gates.define(s.name, s.pos, s.params, s.qubits, s.body);
      case "call":
        return this.call(s);
      case "barrier":
        return this.barrier(s.args, s.pos);
      case "measure":
        return this.measure(s.source, s.target, s.form, s.pos);
      case "reset":
        for (const q of this.regs.resolveQubits(s.arg).indices) {
          this.touch([q]);
          this.reset = true;
          this.push({ kind: "reset", qubit: q, line: s.pos.line }, s.pos);
        }
        return;
    }
  }

  private version(v: string, pos: Pos, index: number): void {
    if (index !== 0)
      throw syntaxError("'OPENQASM' must be the first statement of the program", pos);
    const major = v.split(".")[0];
    if (this.format === "qasm2") {
      if (major === "3")
        throw semanticError(`this program declares OpenQASM ${v}; choose the qasm3 format`, pos);
      if (v !== "2.0")
        throw semanticError(`unsupported OpenQASM version ${v} (expected 'OPENQASM 2.0;')`, pos);
    } else {
      if (major === "2")
        throw semanticError(`this program declares OpenQASM ${v}; choose the qasm2 format`, pos);
      if (!/^3(\.[0-9]+)?$/.test(v))
        throw semanticError(`unsupported OpenQASM version ${v} (expected 'OPENQASM 3.0;')`, pos);
    }
  }

  private include(file: string, pos: Pos): void {
    const expected = LIBRARY_FILE[this.format];
    if (file !== expected) {
      throw semanticError(
        `cannot include '${file}': only "${expected}" is available in ${this.format === "qasm2" ? "OpenQASM 2.0" : "OpenQASM 3"} (no files are read)`,
        pos,
      );
    }
    if (this.included) throw semanticError(`'${file}' is already included`, pos);
    this.included = true;
    this.gates.include(expected);
  }

  private input(name: string, type: "float" | "angle", pos: Pos): void {
    if (this.inputScope.has(name)) throw semanticError(`input '${name}' is already declared`, pos);
    if (this.regs.has(name))
      throw semanticError(`'${name}' is already declared as a register`, pos);
    if (isReservedName(this.format, name))
      throw semanticError(
        `'${name}' is a built-in constant or function and cannot name an input`,
        pos,
      );
    const i = this.inputs.length;
    this.inputs.push({ name, type });
    this.inputScope.set(name, inputRef(i, name, pos.line, pos.column));
  }

  private unknownGate(name: string, pos: Pos) {
    let hint = "";
    const lib = LIBRARY_FILE[this.format];
    const inLibrary =
      this.format === "qasm2" ? QELIB1.has(name) || QELIB1_ADDITIONS.has(name) : STDGATES.has(name);
    if (inLibrary && !this.included) hint = ` (it is defined in ${lib}: add 'include "${lib}";')`;
    else if (this.format === "qasm2" && QASM3_WORDS.has(name))
      hint = ` ('${name}' is OpenQASM 3: choose the qasm3 format)`;
    return semanticError(`unknown gate '${name}'${hint}`, pos);
  }

  private call(s: GateCallStmt): void {
    const entry = this.gates.get(s.name);
    if (entry === undefined) throw this.unknownGate(s.name, s.namePos);
    if (entry.kind === "user" && entry.body === null)
      throw this.gates.opaqueError(entry, s.namePos);
    checkArity(entry, s.params.length, s.args.length, s.namePos);
    const params = s.params.map((e: Expr) => compileExpr(e, this.topCtx));
    const instances = broadcast(
      s.args.map((a) => this.regs.resolveQubits(a)),
      "gate call",
      "qubit",
    );
    const expanded = this.gates.expand(entry, params, s.namePos);
    this.gates.chargeInstances(expanded.length * (instances.length - 1), s.namePos);
    const parts = expanded.map((x) => this.template(x));
    for (const qubits of instances) {
      const second = qubits.findIndex((q, i) => qubits.indexOf(q) !== i);
      if (second >= 0) {
        throw semanticError(
          `qubit ${this.regs.qubitLabel(qubits[second])} used twice in one gate`,
          s.args[second].pos,
        );
      }
      this.touch(qubits);
      const partQubits = parts.map((t) => t.formals.map((f) => qubits[f]));
      this.push(
        { kind: "gate", name: s.name, qubits, params, parts, partQubits, line: s.pos.line },
        s.pos,
      );
    }
  }

  private template(x: Expanded): PartTemplate {
    const constant = x.params.every((p) => p.constant !== null);
    const t: PartTemplate = {
      gate: x.gate,
      formals: x.formals,
      params: x.params,
      constMatrix: constant
        ? this.constantMatrix(
            x.gate,
            x.params.map((p) => p.constant as number),
          )
        : null,
      slot: constant ? -1 : this.slots.length,
    };
    if (!constant) this.slots.push(t);
    return t;
  }

  /** One shared matrix per (gate, constant parameters) — e.g. every `cx` uses the same array. */
  private constantMatrix(gate: PrimitiveGate, params: number[]): Float64Array {
    let byParams = this.matrixCache.get(gate);
    if (byParams === undefined) {
      byParams = new Map();
      this.matrixCache.set(gate, byParams);
    }
    const key = params.join(",");
    let m = byParams.get(key);
    if (m === undefined) {
      m = gate.matrix(params);
      byParams.set(key, m);
    }
    return m;
  }

  private barrier(args: Operand[], pos: Pos): void {
    if (args.length === 0 && this.format === "qasm2") {
      throw semanticError("'barrier' needs at least one qubit or register", pos);
    }
    const qubits =
      args.length === 0
        ? Array.from({ length: this.regs.numQubits }, (_, i) => i)
        : [...new Set(args.flatMap((a) => this.regs.resolveQubits(a).indices))];
    if (qubits.length > 0) this.push({ kind: "barrier", qubits, line: pos.line }, pos);
  }

  private measure(
    source: Operand,
    target: Operand | null,
    form: "arrow" | "assign",
    pos: Pos,
  ): void {
    if (this.format === "qasm2" && form === "assign") {
      throw semanticError(
        "'c = measure q;' is OpenQASM 3; in OpenQASM 2.0 write 'measure q -> c;'",
        pos,
      );
    }
    if (target === null) {
      if (this.format === "qasm3")
        throw unsupported3("'measure' without a target bit; write 'c = measure q;'", pos);
      throw semanticError("'measure' needs a target: write 'measure q -> c;'", pos);
    }
    const q = this.regs.resolveQubits(source);
    const c = this.regs.resolveBits(target);
    if (q.isRegister !== c.isRegister || q.indices.length !== c.indices.length) {
      throw semanticError(
        `measure needs a qubit and a bit, or two registers of the same size: ${describe(source.name, q.isRegister, q.indices.length, "qubit")}, ${describe(target.name, c.isRegister, c.indices.length, "bit")}`,
        target.pos,
      );
    }
    q.indices.forEach((qubit, i) => {
      if (this.measured.has(qubit)) this.mid = true;
      this.measured.add(qubit);
      this.push({ kind: "measure", qubit, clbit: c.indices[i], line: pos.line }, pos);
    });
  }

  /** A gate or reset on a measured qubit makes the measurement mid-circuit. */
  private touch(qubits: number[]): void {
    for (const q of qubits) if (this.measured.has(q)) this.mid = true;
  }

  private push(op: CompiledOp, pos: Pos): void {
    if (this.ops.length >= LIMITS.maxOps) {
      throw circuitError("too_large", `the circuit has more than ${LIMITS.maxOps} operations`, pos);
    }
    this.ops.push(op);
  }
}

function describe(name: string, isRegister: boolean, size: number, unit: string): string {
  return isRegister ? `${name} has ${plural(size, unit)}` : `${name} is a single ${unit}`;
}

export function compileProgram(format: QasmFormat, ast: ProgramAst): CompiledProgram {
  return new ProgramCompiler(format, ast.source).run(ast.statements, ast.firstToken);
}
