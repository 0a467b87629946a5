/**
 * Syntax tree → checked, compiled program. Statements are processed in order (a name
 * must be declared before it is used, as in both specifications). Everything that does
 * not need parameter values is checked here: unknown gates, argument and parameter
 * counts, indices, duplicated qubits, undefined registers and parameters, broadcast
 * sizes, non-finite constant expressions. OpenQASM 3 `const` values and `for` loops are
 * evaluated here (classical.ts): loops are unrolled, so the compiled program is a flat
 * list of operations whatever the source's structure.
 */
import type { Expr, GateCallStmt, Operand, Pos, ProgramAst, Stmt } from "./ast";
import { circuitError, plural, semanticError, syntaxError, unsupported3 } from "./circuit-errors";
import {
  compileTimeInteger,
  compileTimeSize,
  constValue,
  LoopBudget,
  loopValues,
} from "./classical";
import {
  compileExpr,
  constantOf,
  inputRef,
  isReservedName,
  type Compiled,
  type ExprContext,
} from "./expressions";
import {
  applyModifiers,
  checkArity,
  controlCount,
  GateScope,
  resolveModifiers,
  type Expanded,
  type ResolvedModifier,
} from "./gate-definitions";
import { QELIB1, QELIB1_ADDITIONS, STDGATES, type PrimitiveGate } from "./gate-library";
import type { QasmFormat } from "./parse-source";
import {
  LIMITS,
  type CompiledOp,
  type CompiledProgram,
  type PartTemplate,
  type ProgramInput,
} from "./program-ir";
import { broadcast, RegisterTable, type RegisterRef } from "./registers";

const LIBRARY_FILE: Record<QasmFormat, "qelib1.inc" | "stdgates.inc"> = {
  qasm2: "qelib1.inc",
  qasm3: "stdgates.inc",
};
const QASM3_WORDS = new Set([
  "qubit",
  "bit",
  "input",
  "float",
  "angle",
  "const",
  "int",
  "uint",
  "ctrl",
  "negctrl",
  "inv",
  "gphase",
]);

class ProgramCompiler {
  private readonly regs = new RegisterTable();
  private readonly gates: GateScope;
  private readonly inputs: ProgramInput[] = [];
  /** Inputs, constants and loop variables: the names visible to top-level expressions. */
  private readonly inputScope = new Map<string, Compiled>();
  /** Constants only (visible inside gate bodies too). */
  private readonly consts = new Map<string, Compiled>();
  private readonly loopVars = new Set<string>();
  private readonly loops = new LoopBudget();
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
    this.gates = new GateScope(format, source, this.consts);
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
      case "register": {
        if (this.inputScope.has(s.name))
          throw semanticError(`'${s.name}' is already declared as ${this.kindOf(s.name)}`, s.pos);
        const size =
          s.size === null
            ? null
            : compileTimeSize(s.size, this.topCtx, `the size of register '${s.name}'`);
        if (this.format === "qasm2" && s.size !== null && s.size.kind !== "number") {
          // OpenQASM 2.0 sizes are integer literals; a huge one is still "too many" first
          const limit = s.quantum ? LIMITS.maxQubits : LIMITS.maxClbits;
          if (size === null || size <= limit) {
            throw syntaxError(
              `the size of register '${s.name}' must be an integer literal in OpenQASM 2.0${size !== null && size >= 1 ? ` (write ${size})` : ""}`,
              s.size.pos,
            );
          }
        }
        return this.regs.declare(s.name, s.quantum, size, s.pos, s.size?.pos ?? null);
      }
      case "input":
        return this.input(s.name, s.type, s.pos);
      case "const": {
        this.checkNewName(s.name, s.pos, "constant");
        const value = constValue(s.type, s.value, this.topCtx, s.name);
        const c = constantOf(value, s.name, s.pos.line, s.pos.column);
        this.consts.set(s.name, c);
        this.inputScope.set(s.name, c);
        return;
      }
      case "for":
        return this.forLoop(s);
      case "gateDef":
        return this.gates.define(s.name, s.pos, s.params, s.qubits, s.body);
      case "call":
        return this.call(s);
      case "barrier":
        return this.barrier(s.args, s.pos);
      case "measure":
        return this.measure(s.source, s.target, s.form, s.pos);
      case "reset":
        for (const q of this.regs.resolveQubits(this.ref(s.arg)).indices) {
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

  private kindOf(name: string): string {
    if (this.loopVars.has(name)) return "a loop variable";
    if (this.consts.has(name)) return "a constant";
    return "an input";
  }

  /** A new input, constant or loop variable may not reuse a declared name. */
  private checkNewName(name: string, pos: Pos, what: string): void {
    if (this.inputScope.has(name)) {
      const kind = this.kindOf(name);
      throw semanticError(
        kind === "an input" && what === "input"
          ? `input '${name}' is already declared`
          : `'${name}' is already declared as ${kind}`,
        pos,
      );
    }
    if (this.regs.has(name))
      throw semanticError(`'${name}' is already declared as a register`, pos);
    if (isReservedName(this.format, name))
      throw semanticError(
        `'${name}' is a built-in constant or function and cannot name ${what === "input" ? "an input" : `a ${what}`}`,
        pos,
      );
  }

  /** `for` loop: the body is compiled once per value, with the variable as a constant. */
  private forLoop(s: Extract<Stmt, { kind: "for" }>): void {
    if (s.type === "float" || s.type === "angle") {
      throw unsupported3(
        `loop variables of type '${s.type}' (loop over 'int' or 'uint' values)`,
        s.pos,
      );
    }
    this.checkNewName(s.name, s.pos, "loop variable");
    for (const b of s.body) {
      if (!["call", "barrier", "measure", "reset", "for"].includes(b.kind)) {
        throw semanticError(
          "a loop body may contain gate calls, barriers, measurements, resets and loops only (declare registers, inputs, constants and gates before the loop)",
          b.pos,
        );
      }
    }
    const values = loopValues(s.set, s.type, this.topCtx, this.loops);
    this.loopVars.add(s.name);
    try {
      for (const v of values) {
        this.inputScope.set(s.name, constantOf(v, s.name, s.pos.line, s.pos.column));
        for (const b of s.body) this.statement(b, 1);
      }
    } finally {
      this.inputScope.delete(s.name);
      this.loopVars.delete(s.name);
    }
  }

  /** Evaluates an operand's index (OpenQASM 2.0: an integer literal; 3: a constant expression). */
  private ref(o: Operand): RegisterRef {
    if (o.index === null) return { name: o.name, index: null, pos: o.pos };
    if (this.format === "qasm2" && o.index.kind !== "number") {
      throw syntaxError("an index must be a non-negative integer in OpenQASM 2.0", o.index.pos);
    }
    const index = compileTimeInteger(o.index, this.topCtx, `the index of '${o.name}'`);
    return { name: o.name, index, pos: o.pos };
  }

  private input(name: string, type: "float" | "angle", pos: Pos): void {
    this.checkNewName(name, pos, "input");
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
    const modifiers = resolveModifiers(s.modifiers, this.topCtx);
    checkArity(entry, s.params.length, s.args.length, s.namePos, controlCount(modifiers));
    const params = s.params.map((e: Expr) => compileExpr(e, this.topCtx));
    const instances = broadcast(
      s.args.map((a) => this.regs.resolveQubits(this.ref(a))),
      "gate call",
      "qubit",
    );
    const charge = (n: number) => this.gates.charge(n, s.namePos);
    // Parts on no qubit are global phases (gphase without control): unobservable, dropped.
    const expanded = applyModifiers(
      this.gates.expand(entry, params, s.namePos),
      modifiers,
      charge,
    ).filter((x) => x.formals.length > 0);
    charge(expanded.length * (instances.length - 1));
    if (instances[0].length === 0) return; // a bare `gphase(γ);`
    const parts = expanded.map((x) => this.template(x));
    const name = [...modifiers.map(modifierLabel), s.name].join(" @ ");
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
      this.push({ kind: "gate", name, qubits, params, parts, partQubits, line: s.pos.line }, s.pos);
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
        : [...new Set(args.flatMap((a) => this.regs.resolveQubits(this.ref(a)).indices))];
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
    const q = this.regs.resolveQubits(this.ref(source));
    const c = this.regs.resolveBits(this.ref(target));
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

/** `inv`, `pow(2)`, `ctrl`, `negctrl(2)`: how a modified call is named (e.g. "ctrl(2) @ x"). */
function modifierLabel(m: ResolvedModifier): string {
  if (m.kind === "inv") return "inv";
  if (m.kind === "pow") return `pow(${m.k})`;
  const word = m.controls[0] ? "ctrl" : "negctrl";
  return m.controls.length === 1 ? word : `${word}(${m.controls.length})`;
}

function describe(name: string, isRegister: boolean, size: number, unit: string): string {
  return isRegister ? `${name} has ${plural(size, unit)}` : `${name} is a single ${unit}`;
}

export function compileProgram(format: QasmFormat, ast: ProgramAst): CompiledProgram {
  return new ProgramCompiler(format, ast.source).run(ast.statements, ast.firstToken);
}
