/**
 * Compile-time classical values of OpenQASM 3 programs: `const` declarations, loop
 * variables, register sizes, indices and the ranges of `for` loops. All of them must be
 * known when the program is compiled (they may use literals, pi/τ/ℇ, functions, other
 * constants and loop variables, never an `input`), so loops are unrolled once and every
 * later `bind` only evaluates gate angles.
 *
 * Ranges follow the OpenQASM 3 specification ("Looping and branching"): `[a:b]` and
 * `[a:s:b]` include both ends, `{v1, v2, …}` lists the values in order.
 */
import type { ClassicalType, Expr, LoopSet, Pos } from "./ast";
import { circuitError, semanticError } from "./circuit-errors";
import { compileExpr, type ExprContext } from "./expressions";

/** Most loop iterations (over all loops, nested ones counted in full) of one program. */
export const MAX_LOOP_ITERATIONS = 10_000;

/** A compile-time value; `what` names it in messages (e.g. "the size of register 'q'"). */
export function compileTimeValue(e: Expr, ctx: ExprContext, what: string): number {
  const c = compileExpr(e, ctx);
  if (c.constant === null) {
    throw semanticError(
      `${what} must be known before the run: '${c.text}' depends on an input`,
      e.pos,
    );
  }
  return c.constant;
}

export function compileTimeInteger(e: Expr, ctx: ExprContext, what: string): number {
  const v = compileTimeValue(e, ctx, what);
  if (!Number.isSafeInteger(v)) throw semanticError(`${what} must be an integer, got ${v}`, e.pos);
  return v;
}

/**
 * A register size: any whole number, however large (1e30 is whole), so the register
 * check can say "too many qubits" rather than "not an integer".
 */
export function compileTimeSize(e: Expr, ctx: ExprContext, what: string): number {
  const v = compileTimeValue(e, ctx, what);
  if (!Number.isInteger(v)) throw semanticError(`${what} must be an integer, got ${v}`, e.pos);
  return v;
}

/** The value of `const type name = value;`, checked against its type. */
export function constValue(
  type: ClassicalType,
  value: Expr,
  ctx: ExprContext,
  name: string,
): number {
  if (type === "float" || type === "angle")
    return compileTimeValue(value, ctx, `the value of constant '${name}'`);
  const v = compileTimeInteger(value, ctx, `the value of ${type} constant '${name}'`);
  if (type === "uint" && v < 0)
    throw semanticError(
      `the value of uint constant '${name}' must not be negative, got ${v}`,
      value.pos,
    );
  return v;
}

/** Counts iterations of all loops of a program against MAX_LOOP_ITERATIONS. */
export class LoopBudget {
  private used = 0;

  charge(n: number, pos: Pos): void {
    this.used += n;
    if (this.used > MAX_LOOP_ITERATIONS) {
      throw circuitError(
        "too_large",
        `the loops of this program run more than ${MAX_LOOP_ITERATIONS} iterations in total (at most ${MAX_LOOP_ITERATIONS} are accepted)`,
        pos,
      );
    }
  }
}

/** The values a loop variable takes, in order (checked against the budget before any is made). */
export function loopValues(
  set: LoopSet,
  type: ClassicalType | null,
  ctx: ExprContext,
  budget: LoopBudget,
): number[] {
  const integer = type === null || type === "int" || type === "uint";
  const read = (e: Expr, what: string) =>
    integer ? compileTimeInteger(e, ctx, what) : compileTimeValue(e, ctx, what);
  if (set.kind === "set") {
    budget.charge(set.values.length, set.pos);
    return set.values.map((e) => read(e, "a value of the loop set"));
  }
  const start = read(set.start, "the start of the loop range");
  const step = set.step === null ? 1 : read(set.step, "the step of the loop range");
  const end = read(set.end, "the end of the loop range");
  if (step === 0)
    throw semanticError("the step of the loop range must not be 0", set.step?.pos ?? set.pos);
  const count = Math.max(0, Math.floor((end - start) / step + 1e-9) + 1);
  budget.charge(count, set.pos);
  return Array.from({ length: count }, (_, i) => start + i * step);
}
