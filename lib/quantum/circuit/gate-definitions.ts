/**
 * The gate namespace of a program (built-ins, the included library, user `gate`s and
 * `opaque` declarations), the checks of a user definition, and the expansion of a
 * gate call into primitive applications (user gates are inlined recursively; their
 * parameter expressions become closures over the program inputs), with the OpenQASM 3
 * gate modifiers applied to the expansion (applyModifiers).
 */
import type { Expr, Ident, GateBodyStmt, Modifier, Operand, Pos } from "./ast";
import { circuitError, plural, semanticError } from "./circuit-errors";
import { modifyGate } from "./modified-gates";
import {
  compileExpr,
  isReservedName,
  NO_GRADIENT,
  type Compiled,
  type ExprContext,
} from "./expressions";
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
  modifiers: ResolvedModifier[];
  /** Positions of the call's qubits among the enclosing gate's qubit arguments. */
  formals: number[];
  pos: Pos;
}

/** A gate modifier with its integers evaluated (they must be known when compiling). */
export type ResolvedModifier =
  { kind: "inv" } | { kind: "pow"; k: number } | { kind: "ctrl"; controls: boolean[] };

/** Largest number of qubits of one (modified) gate application: its matrix is 4^k complex numbers. */
export const MAX_GATE_QUBITS = 8;

/** Evaluates a modifier's integer (count of controls or exponent) at compile time. */
function modifierInteger(e: Expr, ctx: ExprContext, what: string): number {
  const c = compileExpr(e, ctx);
  if (c.constant === null) {
    throw semanticError(
      `${what} must be an integer known before the run (it cannot depend on an input or a gate parameter)`,
      e.pos,
    );
  }
  if (!Number.isInteger(c.constant)) {
    throw semanticError(
      `${what} must be an integer, got ${c.constant}${what.startsWith("the exponent") ? ": only integer powers of gates are supported" : ""}`,
      e.pos,
    );
  }
  return c.constant;
}

/** Modifiers of a call, outermost first, checked (ctrl(n) with n ≥ 1, pow(k) with integer k). */
export function resolveModifiers(mods: readonly Modifier[], ctx: ExprContext): ResolvedModifier[] {
  return mods.map((m): ResolvedModifier => {
    if (m.kind === "inv") return { kind: "inv" };
    if (m.kind === "pow")
      return { kind: "pow", k: modifierInteger(m.exponent, ctx, "the exponent of 'pow(k) @'") };
    const n =
      m.count === null
        ? 1
        : modifierInteger(m.count, ctx, `the number of controls of '${m.kind}(n) @'`);
    if (n < 1)
      throw semanticError(
        `'${m.kind}(${n}) @' needs at least one control qubit`,
        m.count?.pos ?? m.pos,
      );
    if (n > MAX_GATE_QUBITS)
      throw circuitError(
        "too_large",
        `'${m.kind}(${n}) @': a gate may act on at most ${MAX_GATE_QUBITS} qubits`,
        m.pos,
      );
    return { kind: "ctrl", controls: new Array<boolean>(n).fill(m.kind === "ctrl") };
  });
}

/** Number of control qubits the modifiers add in front of the gate's own operands. */
export function controlCount(mods: readonly ResolvedModifier[]): number {
  return mods.reduce((n, m) => n + (m.kind === "ctrl" ? m.controls.length : 0), 0);
}

/**
 * Applies modifiers (outermost first) to the expansion of a gate with `ownQubits` qubits:
 * inv reverses the parts and inverts each; pow(k) repeats them (inverted for k < 0);
 * ctrl/negctrl put control qubits in front and control every part (controlling a product
 * controls each factor). `charge` counts the extra parts that pow creates.
 */
export function applyModifiers(
  parts: Expanded[],
  mods: readonly ResolvedModifier[],
  charge: (n: number) => void,
): Expanded[] {
  let out = parts;
  for (let i = mods.length - 1; i >= 0; i--) {
    const m = mods[i];
    if (m.kind === "inv" || (m.kind === "pow" && m.k < 0)) {
      out = out
        .slice()
        .reverse()
        .map((x) => ({ ...x, gate: modifyGate(x.gate, [], true) }));
    }
    if (m.kind === "pow") {
      const times = Math.abs(m.k);
      charge(out.length * (times - 1));
      const once = out;
      out = [];
      for (let t = 0; t < times; t++) out.push(...once);
    } else if (m.kind === "ctrl") {
      const c = m.controls.length;
      out = out.map((x) => ({
        gate: modifyGate(x.gate, m.controls, false),
        formals: [...m.controls.map((_, j) => j), ...x.formals.map((f) => f + c)],
        params: x.params,
      }));
    }
  }
  return out;
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

/**
 * "gate 'rx' takes 1 parameter, got 2" / "gate 'cx' acts on 2 qubits, got 1"; with
 * modifiers, "'ctrl @ x' acts on 2 qubits (1 control + 1), got 1".
 */
export function checkArity(
  e: GateEntry,
  nParams: number,
  nQubits: number,
  pos: Pos,
  controls = 0,
): void {
  const a = entryArity(e);
  if (nParams !== a.params) {
    throw semanticError(
      `gate '${e.name}' takes ${plural(a.params, "parameter")}, got ${nParams}`,
      pos,
    );
  }
  if (nQubits !== a.qubits + controls) {
    const what =
      controls === 0
        ? `gate '${e.name}' acts on ${plural(a.qubits, "qubit")}`
        : `the modified gate '${e.name}' acts on ${plural(a.qubits + controls, "qubit")} (${plural(controls, "control")} + ${a.qubits})`;
    throw semanticError(`${what}, got ${nQubits}`, pos);
  }
  if (a.qubits + controls > MAX_GATE_QUBITS) {
    throw circuitError(
      "too_large",
      `the modified gate '${e.name}' acts on ${a.qubits + controls} qubits; a gate may act on at most ${MAX_GATE_QUBITS}`,
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
    /** `const` values of the program, visible in gate bodies (added as they are declared). */
    private readonly globals: ReadonlyMap<string, Compiled> = new Map(),
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
    const scope = new Map([
      ...this.globals,
      ...gate.params.map((p): [string, Compiled] => [p, PLACEHOLDER]),
    ]);
    const ctx: ExprContext = {
      format: this.format,
      source: this.source,
      scope,
      unknownName: (n) => this.unknownInBody(gate, n),
    };
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
      const modifiers = resolveModifiers(stmt.modifiers, ctx);
      checkArity(
        target,
        stmt.params.length,
        stmt.args.length,
        stmt.namePos,
        controlCount(modifiers),
      );
      const second = formals.findIndex((f, i) => formals.indexOf(f) !== i);
      if (second >= 0) {
        throw semanticError(
          `qubit argument '${gate.qubits[formals[second]]}' used twice in one gate`,
          stmt.args[second].pos,
        );
      }
      for (const e of stmt.params) compileExpr(e, ctx);
      calls.push({
        name: stmt.name,
        target,
        params: stmt.params,
        modifiers,
        formals,
        pos: stmt.namePos,
      });
    }
    return calls;
  }

  private formalOf(gate: Extract<GateEntry, { kind: "user" }>, a: Operand): number {
    if (a.index !== null) {
      throw semanticError(
        `inside a gate body, qubits are referred to by argument name only ('${a.name}', not '${this.source.slice(a.pos.start, a.pos.end)}')`,
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
      return [{ gate: entry.gate, formals: range(entry.gate.numQubits), params: args }];
    }
    if (entry.body === null) throw this.opaqueError(entry, callPos);
    const scope = new Map([
      ...this.globals,
      ...entry.params.map((p, i): [string, Compiled] => [p, args[i]]),
    ]);
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
      const subs = applyModifiers(this.expand(call.target, params, callPos), call.modifiers, (n) =>
        this.charge(n, callPos),
      );
      for (const sub of subs) {
        out.push({
          gate: sub.gate,
          params: sub.params,
          formals: sub.formals.map((f) => call.formals[f]),
        });
      }
    }
    return out;
  }

  charge(n: number, pos: Pos): void {
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
