/**
 * The gate namespace of a program (built-ins, the included library, user `gate`s and
 * `opaque` declarations), the checks of a user definition, and the expansion of a
 * gate call into primitive applications (user gates are inlined recursively; their
 * parameter expressions become closures over the program inputs).
 */
import type { Expr, Ident, GateBodyStmt, Operand, Pos } from "./ast";
import { circuitError, plural, semanticError } from "./circuit-errors";
import { compileExpr, isReservedName, NO_GRADIENT, type Compiled } from "./expressions";
import {
  QASM2_BUILTINS,
  QASM3_BUILTINS,
  QELIB1,
  QELIB1_ADDITIONS,
  STDGATES,
  type GateTable,
  type PrimitiveGate,
} from "./gate-library";
import type { QasmFormat } from "./parse-source";
import { LIMITS } from "./program-ir";

interface BodyCall {
  name: string;
  target: GateEntry;
  params: Expr[];
  /** Positions of the call's qubits among the enclosing gate's qubit arguments. */
  formals: number[];
  pos: Pos;
}

export type GateEntry =
  | { kind: "primitive"; name: string; gate: PrimitiveGate; origin: string; replaceable: boolean }
  | {
      kind: "user";
      name: string;
      params: string[];
      qubits: string[];
      body: BodyCall[] | null;
      pos: Pos;
    };

export interface Expanded {
  gate: PrimitiveGate;
  formals: number[];
  params: Compiled[];
}

/** Stands for a gate parameter while a definition is checked (never evaluated). */
const PLACEHOLDER: Compiled = {
  evaluate: () => NaN,
  grad: NO_GRADIENT,
  constant: null,
  text: "",
  line: 1,
  column: 1,
};

export function entryArity(e: GateEntry): { params: number; qubits: number } {
  return e.kind === "primitive"
    ? { params: e.gate.numParams, qubits: e.gate.numQubits }
    : { params: e.params.length, qubits: e.qubits.length };
}

/** "gate 'rx' takes 1 parameter, got 2" / "gate 'cx' acts on 2 qubits, got 1". */
export function checkArity(e: GateEntry, nParams: number, nQubits: number, pos: Pos): void {
  const a = entryArity(e);
  if (nParams !== a.params) {
    throw semanticError(
      `gate '${e.name}' takes ${plural(a.params, "parameter")}, got ${nParams}`,
      pos,
    );
  }
  if (nQubits !== a.qubits) {
    throw semanticError(
      `gate '${e.name}' acts on ${plural(a.qubits, "qubit")}, got ${nQubits}`,
      pos,
    );
  }
}

export class GateScope {
  private readonly gates = new Map<string, GateEntry>();
  private partCount = 0;

  constructor(
    private readonly format: QasmFormat,
    private readonly source: string,
  ) {
    this.add(format === "qasm2" ? QASM2_BUILTINS : QASM3_BUILTINS, "built-in", false);
  }

  /** Makes the standard library available (qelib1.inc or stdgates.inc). */
  include(file: "qelib1.inc" | "stdgates.inc"): void {
    if (file === "qelib1.inc") {
      this.add(QELIB1, "qelib1.inc", false);
      this.add(QELIB1_ADDITIONS, "qelib1.inc", true);
    } else {
      this.add(STDGATES, "stdgates.inc", false);
    }
  }

  private add(table: GateTable, origin: string, replaceable: boolean): void {
    for (const [name, gate] of table) {
      const existing = this.gates.get(name);
      if (existing !== undefined && existing.kind === "user") {
        if (replaceable) continue; // the program's own definition of a later addition wins
        throw semanticError(
          `gate '${name}' is defined by the program (line ${existing.pos.line}) and again by ${origin}`,
          existing.pos,
        );
      }
      this.gates.set(name, { kind: "primitive", name, gate, origin, replaceable });
    }
  }

  get(name: string): GateEntry | undefined {
    return this.gates.get(name);
  }

  /** Checks and records a `gate` (body non-null) or `opaque` (body null) declaration. */
  define(
    name: string,
    namePos: Pos,
    params: Ident[],
    qubits: Ident[],
    body: GateBodyStmt[] | null,
  ): void {
    const existing = this.gates.get(name);
    if (existing !== undefined && !(existing.kind === "primitive" && existing.replaceable)) {
      const where = existing.kind === "primitive" ? existing.origin : `line ${existing.pos.line}`;
      throw semanticError(`gate '${name}' is already defined (${where})`, namePos);
    }
    const seen = new Set<string>();
    for (const id of [...params, ...qubits]) {
      if (seen.has(id.name))
        throw semanticError(
          `name '${id.name}' appears twice in the declaration of gate '${name}'`,
          id.pos,
        );
      seen.add(id.name);
    }
    for (const p of params) {
      if (isReservedName(this.format, p.name)) {
        throw semanticError(
          `'${p.name}' is a built-in constant or function and cannot name a parameter`,
          p.pos,
        );
      }
    }
    const entry: GateEntry = {
      kind: "user",
      name,
      params: params.map((p) => p.name),
      qubits: qubits.map((q) => q.name),
      body: null,
      pos: namePos,
    };
    if (body !== null) entry.body = this.checkBody(entry, body);
    this.gates.set(name, entry);
  }

  private checkBody(gate: Extract<GateEntry, { kind: "user" }>, body: GateBodyStmt[]): BodyCall[] {
    const calls: BodyCall[] = [];
    const scope = new Map(gate.params.map((p) => [p, PLACEHOLDER]));
    for (const stmt of body) {
      const formals = stmt.args.map((a) => this.formalOf(gate, a));
      if (stmt.kind === "barrier") continue; // a barrier inside a gate has no effect on the state
      const target = this.gates.get(stmt.name);
      if (target === undefined) {
        const hint = stmt.name === gate.name ? ": a gate cannot call itself" : "";
        throw semanticError(`unknown gate '${stmt.name}'${hint}`, stmt.namePos);
      }
      if (target.kind === "user" && target.body === null)
        throw this.opaqueError(target, stmt.namePos);
      checkArity(target, stmt.params.length, stmt.args.length, stmt.namePos);
      const second = formals.findIndex((f, i) => formals.indexOf(f) !== i);
      if (second >= 0) {
        throw semanticError(
          `qubit argument '${gate.qubits[formals[second]]}' used twice in one gate`,
          stmt.args[second].pos,
        );
      }
      for (const e of stmt.params) {
        compileExpr(e, {
          format: this.format,
          source: this.source,
          scope,
          unknownName: (n) => this.unknownInBody(gate, n),
        });
      }
      calls.push({ name: stmt.name, target, params: stmt.params, formals, pos: stmt.namePos });
    }
    return calls;
  }

  private formalOf(gate: Extract<GateEntry, { kind: "user" }>, a: Operand): number {
    if (a.index !== null) {
      throw semanticError(
        `inside a gate body, qubits are referred to by argument name only ('${a.name}', not '${a.name}[${a.index}]')`,
        a.pos,
      );
    }
    const k = gate.qubits.indexOf(a.name);
    if (k < 0) {
      throw semanticError(
        `'${a.name}' is not a qubit argument of gate '${gate.name}' (arguments: ${gate.qubits.join(", ")})`,
        a.pos,
      );
    }
    return k;
  }

  private unknownInBody(gate: Extract<GateEntry, { kind: "user" }>, name: string): string {
    const list =
      gate.params.length > 0 ? `parameters: ${gate.params.join(", ")}` : "it has no parameters";
    return `undefined parameter '${name}' in gate '${gate.name}' (${list})`;
  }

  opaqueError(gate: GateEntry, pos: Pos) {
    return semanticError(
      `gate '${gate.name}' is opaque: it has no definition, so it cannot be simulated`,
      pos,
    );
  }

  /**
   * Primitive applications realising `entry` with parameter closures `args`; formals are
   * positions among the entry's qubit arguments. `callPos` locates errors and the budget.
   */
  expand(entry: GateEntry, args: Compiled[], callPos: Pos): Expanded[] {
    if (entry.kind === "primitive") {
      this.charge(1, callPos);
      return [
        {
          gate: entry.gate,
          formals: entry.gate.numQubits === 1 ? [0] : range(entry.gate.numQubits),
          params: args,
        },
      ];
    }
    if (entry.body === null) throw this.opaqueError(entry, callPos);
    const scope = new Map(entry.params.map((p, i) => [p, args[i]]));
    const where = ` (in the body of gate '${entry.name}', called on line ${callPos.line})`;
    const out: Expanded[] = [];
    for (const call of entry.body) {
      const params = call.params.map((e) =>
        compileExpr(e, {
          format: this.format,
          source: this.source,
          scope,
          where,
          unknownName: (n) => this.unknownInBody(entry, n),
        }),
      );
      for (const sub of this.expand(call.target, params, callPos)) {
        out.push({
          gate: sub.gate,
          params: sub.params,
          formals: sub.formals.map((f) => call.formals[f]),
        });
      }
    }
    return out;
  }

  private charge(n: number, pos: Pos): void {
    this.partCount += n;
    if (this.partCount > LIMITS.maxParts) {
      throw circuitError(
        "too_large",
        `the circuit expands to more than ${LIMITS.maxParts} gate applications`,
        pos,
      );
    }
  }

  /** Counts `n` more primitive applications (broadcast instances re-use one expansion). */
  chargeInstances(n: number, pos: Pos): void {
    this.charge(n, pos);
  }
}

function range(n: number): number[] {
  return Array.from({ length: n }, (_, i) => i);
}
