/**
 * Parameter expressions → closures. Compiled once at parse time; `bind` only calls the
 * closures, so sweeps never re-parse. Subexpressions that do not depend on an input are
 * folded to constants (and every folded node must be finite).
 *
 * OpenQASM 2.0 (arXiv:1707.03429 §3): real and integer literals, `pi`, + − * / and ^
 * (power), unary minus, and the functions sin, cos, tan, exp, ln, sqrt.
 * OpenQASM 3 subset: literals, pi/π, tau/τ, euler/ℇ, + − * / and ** (power), unary
 * minus, and sin, cos, tan, arcsin, arccos, arctan, exp, log (natural), sqrt, floor,
 * ceiling, pow(a, b), mod(a, b). In OpenQASM 3 `^` is bitwise XOR, which has no
 * meaning on real angles, so it is rejected.
 *
 * Every closure comes with its gradient (reverse-mode chain rule over the expression
 * tree), so gate-angle derivatives d(angle)/d(input) are exact for every occurrence of
 * an input, in affine and non-linear expressions alike. floor, ceiling and the
 * integer-part jumps of mod are piecewise constant: their derivative is taken as 0
 * (the one-sided value away from the jumps).
 */
import type { Expr } from "./ast";
import { plural, semanticError, unsupported3 } from "./circuit-errors";
import type { QasmFormat } from "./parse-source";

export interface Compiled {
  /** Value for the bound inputs (indexed like ParsedProgram.inputs). */
  evaluate: (inputs: Float64Array) => number;
  /**
   * Adds scale · ∂(value)/∂(input j) to out[j] for every input j (out indexed like the
   * inputs). A constant expression adds nothing.
   */
  grad: (inputs: Float64Array, out: Float64Array, scale: number) => void;
  /** The value when the expression does not depend on any input, else null. */
  constant: number | null;
  /** Source text of the expression and where it starts (for error messages). */
  text: string;
  line: number;
  column: number;
}

export interface ExprContext {
  format: QasmFormat;
  source: string;
  /** Names visible to the expression (inputs at the top level, parameters in a gate body). */
  scope: ReadonlyMap<string, Compiled>;
  /** Message for a name that is neither in scope nor a constant. */
  unknownName: (name: string) => string;
  /** Appended to "does not evaluate to a finite number" messages, e.g. " (in gate 'g' …)". */
  where?: string;
}

const CONSTANTS: Record<QasmFormat, Record<string, number>> = {
  qasm2: { pi: Math.PI },
  qasm3: { pi: Math.PI, π: Math.PI, tau: 2 * Math.PI, τ: 2 * Math.PI, euler: Math.E, ℇ: Math.E },
};

type Fn = (...a: number[]) => number;
const FUNCTIONS: Record<QasmFormat, Record<string, Fn>> = {
  qasm2: {
    sin: Math.sin,
    cos: Math.cos,
    tan: Math.tan,
    exp: Math.exp,
    ln: Math.log,
    sqrt: Math.sqrt,
  },
  qasm3: {
    sin: Math.sin,
    cos: Math.cos,
    tan: Math.tan,
    arcsin: Math.asin,
    arccos: Math.acos,
    arctan: Math.atan,
    exp: Math.exp,
    log: Math.log,
    sqrt: Math.sqrt,
    floor: Math.floor,
    ceiling: Math.ceil,
    pow: Math.pow,
    mod: (a, b) => a - b * Math.floor(a / b),
  },
};

/** True for names that are built-in constants or functions of the dialect. */
export function isReservedName(format: QasmFormat, name: string): boolean {
  return name in CONSTANTS[format] || name in FUNCTIONS[format];
}

/** Gradient of a constant: nothing to add. */
export const NO_GRADIENT: Compiled["grad"] = () => {};

export function constantOf(value: number, text: string, line: number, column: number): Compiled {
  return { evaluate: () => value, grad: NO_GRADIENT, constant: value, text, line, column };
}

/** The compiled reference to input number `index` (its gradient is the unit vector). */
export function inputRef(index: number, text: string, line: number, column: number): Compiled {
  return {
    evaluate: (x) => x[index],
    grad: (_x, out, scale) => {
      out[index] += scale;
    },
    constant: null,
    text,
    line,
    column,
  };
}

type Grad = Compiled["grad"];
type Eval = Compiled["evaluate"];

/** ∂/∂a and ∂/∂b of the binary operators at (a, b). */
function binaryGrad(op: string, fa: Eval, fb: Eval, ga: Grad, gb: Grad): Grad {
  switch (op) {
    case "+":
      return (x, out, s) => {
        ga(x, out, s);
        gb(x, out, s);
      };
    case "-":
      return (x, out, s) => {
        ga(x, out, s);
        gb(x, out, -s);
      };
    case "*":
      return (x, out, s) => {
        ga(x, out, s * fb(x));
        gb(x, out, s * fa(x));
      };
    case "/":
      return (x, out, s) => {
        const b = fb(x);
        ga(x, out, s / b);
        gb(x, out, (-s * fa(x)) / (b * b));
      };
    default:
      return powGrad(fa, fb, ga, gb);
  }
}

/** d(a^b) = b·a^(b−1) da + a^b·ln(a) db (the second term only where b varies). */
function powGrad(fa: Eval, fb: Eval, ga: Grad, gb: Grad): Grad {
  return (x, out, s) => {
    const a = fa(x);
    const b = fb(x);
    ga(x, out, s * (b === 0 ? 0 : b * Math.pow(a, b - 1)));
    if (gb !== NO_GRADIENT) gb(x, out, s * Math.pow(a, b) * Math.log(a));
  };
}

/** Derivatives of the one-argument functions at a. */
const DERIVATIVES: Record<string, (a: number) => number> = {
  sin: Math.cos,
  cos: (a) => -Math.sin(a),
  tan: (a) => 1 / (Math.cos(a) * Math.cos(a)),
  arcsin: (a) => 1 / Math.sqrt(1 - a * a),
  arccos: (a) => -1 / Math.sqrt(1 - a * a),
  arctan: (a) => 1 / (1 + a * a),
  exp: Math.exp,
  ln: (a) => 1 / a,
  log: (a) => 1 / a,
  sqrt: (a) => 0.5 / Math.sqrt(a),
  floor: () => 0,
  ceiling: () => 0,
};

export const BINARY: Record<string, (a: number, b: number) => number> = {
  "+": (a, b) => a + b,
  "-": (a, b) => a - b,
  "*": (a, b) => a * b,
  "/": (a, b) => a / b,
  "^": Math.pow,
  "**": Math.pow,
};

export function compileExpr(e: Expr, ctx: ExprContext): Compiled {
  const text = ctx.source.slice(e.pos.start, e.pos.end);
  const finish = (
    evaluate: (x: Float64Array) => number,
    constant: number | null,
    grad: Grad = NO_GRADIENT,
  ): Compiled => {
    if (constant !== null && !Number.isFinite(constant)) {
      throw semanticError(
        `expression '${text}' does not evaluate to a finite number (${constant})${ctx.where ?? ""}`,
        e.pos,
      );
    }
    return constant !== null
      ? constantOf(constant, text, e.pos.line, e.pos.column)
      : { evaluate, grad, constant: null, text, line: e.pos.line, column: e.pos.column };
  };
  switch (e.kind) {
    case "number":
      return finish(() => e.value, e.value);
    case "name": {
      const bound = ctx.scope.get(e.name);
      if (bound) return { ...bound, text, line: e.pos.line, column: e.pos.column };
      const c = CONSTANTS[ctx.format][e.name];
      if (c !== undefined) return finish(() => c, c);
      if (e.name in FUNCTIONS[ctx.format]) {
        throw semanticError(`function '${e.name}' needs an argument in parentheses`, e.pos);
      }
      throw semanticError(ctx.unknownName(e.name), e.pos);
    }
    case "negate": {
      const a = compileExpr(e.arg, ctx);
      const f = a.evaluate;
      const g = a.grad;
      return finish(
        (x) => -f(x),
        a.constant === null ? null : -a.constant,
        (x, out, sc) => g(x, out, -sc),
      );
    }
    case "binary": {
      if (e.op === "**" && ctx.format === "qasm2") {
        throw semanticError("'**' is not OpenQASM 2.0; use '^' for powers", e.pos);
      }
      if (e.op === "^" && ctx.format === "qasm3") {
        throw unsupported3("'^' (bitwise XOR on integers); use '**' for powers", e.pos);
      }
      const a = compileExpr(e.left, ctx);
      const b = compileExpr(e.right, ctx);
      const op = BINARY[e.op];
      const fa = a.evaluate;
      const fb = b.evaluate;
      const constant =
        a.constant !== null && b.constant !== null ? op(a.constant, b.constant) : null;
      return finish((x) => op(fa(x), fb(x)), constant, binaryGrad(e.op, fa, fb, a.grad, b.grad));
    }
    case "call": {
      const fn = FUNCTIONS[ctx.format][e.fn];
      if (fn === undefined) {
        const names = Object.keys(FUNCTIONS[ctx.format]).join(", ");
        throw semanticError(`unknown function '${e.fn}' (available: ${names})`, e.pos);
      }
      if (e.args.length !== fn.length) {
        throw semanticError(
          `function '${e.fn}' takes ${plural(fn.length, "argument")}, got ${e.args.length}`,
          e.pos,
        );
      }
      const args = e.args.map((a) => compileExpr(a, ctx));
      const allConst = args.every((a) => a.constant !== null);
      const constant = allConst ? fn(...args.map((a) => a.constant as number)) : null;
      if (args.length === 1) {
        const f0 = args[0].evaluate;
        const g0 = args[0].grad;
        const d = DERIVATIVES[e.fn];
        return finish(
          (x) => fn(f0(x)),
          constant,
          (x, out, sc) => g0(x, out, sc * d(f0(x))),
        );
      }
      const f0 = args[0].evaluate;
      const f1 = args[1].evaluate;
      const g0 = args[0].grad;
      const g1 = args[1].grad;
      // pow(a, b) = a ** b; mod(a, b) = a − b·floor(a/b): ∂/∂a = 1, ∂/∂b = −floor(a/b).
      const grad: Grad =
        e.fn === "pow"
          ? powGrad(f0, f1, g0, g1)
          : (x, out, sc) => {
              g0(x, out, sc);
              g1(x, out, -sc * Math.floor(f0(x) / f1(x)));
            };
      return finish((x) => fn(f0(x), f1(x)), constant, grad);
    }
  }
}
