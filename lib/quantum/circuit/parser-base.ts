/**
 * Base of the OpenQASM grammar (see parser.ts): the rules shared by statements —
 * identifier lists, operands (`q`, `q[3]`) and parameter expressions:
 *   operand    := id ('[' expr ']')?      (OpenQASM 2.0 accepts an integer only; checked later)
 *   expr       := term (('+'|'-') term)* ; term := unary (('*'|'/') unary)*
 *   unary      := '-' unary | '+' unary | power ; power := primary (('^'|'**') unary)?
 *   primary    := number | id | id '(' exprs ')' | 'pow' '(' exprs ')' | '(' expr ')'
 * Power is right-associative and binds tighter than unary minus (-2^2 = -4, 2^-1 = 0.5).
 */
import { EmbeddedActionsParser, type IToken } from "chevrotain";
import type { Expr, Ident, Operand, Pos } from "./ast";
import { unsupported3 } from "./circuit-errors";
import { qasmErrorMessages } from "./parse-errors";
import * as T from "./tokens";

export function posOf(tok: IToken): Pos {
  return {
    line: tok.startLine ?? 1,
    column: tok.startColumn ?? 1,
    start: tok.startOffset,
    end: (tok.endOffset ?? tok.startOffset) + 1,
  };
}

export function span(a: Pos, b: Pos): Pos {
  return { line: a.line, column: a.column, start: a.start, end: b.end };
}

/** Rules shared by the statement grammar; subclasses call performSelfAnalysis. */
export abstract class ExpressionParser extends EmbeddedActionsParser {
  constructor() {
    super(T.allTokens, {
      recoveryEnabled: false,
      maxLookahead: 5,
      errorMessageProvider: qasmErrorMessages,
    });
  }

  /** Throws a specific error (never during chevrotain's grammar recording). */
  protected fail(make: () => Error): void {
    this.ACTION(() => {
      throw make();
    });
  }

  protected identList = this.RULE("identList", (): Ident[] => {
    const ids: Ident[] = [];
    this.AT_LEAST_ONE_SEP({
      SEP: T.Comma,
      DEF: () => {
        const t = this.CONSUME(T.Identifier);
        this.ACTION(() => ids.push({ name: t.image, pos: posOf(t) }));
      },
    });
    return ids;
  });

  protected operandList = this.RULE("operandList", (): Operand[] => {
    const out: Operand[] = [];
    this.AT_LEAST_ONE_SEP({
      SEP: T.Comma,
      DEF: () => {
        const o = this.SUBRULE(this.operand);
        this.ACTION(() => out.push(o));
      },
    });
    return out;
  });

  protected operand = this.RULE("operand", (): Operand =>
    this.OR([
      {
        ALT: () => {
          const name = this.CONSUME(T.Identifier);
          let index: Expr | null = null;
          let end = posOf(name);
          this.OPTION(() => {
            this.CONSUME(T.LBracket);
            index = this.SUBRULE(this.index);
            end = posOf(this.CONSUME(T.RBracket));
          });
          return { name: name.image, index, pos: span(posOf(name), end) };
        },
      },
      {
        ALT: () => {
          const t = this.CONSUME(T.HardwareQubit);
          this.fail(() =>
            unsupported3(
              `physical qubits ('${t.image}'); declare 'qubit[n] q;' and use q[i]`,
              posOf(t),
            ),
          );
          return { name: t.image, index: null, pos: posOf(t) };
        },
      },
    ]),
  );

  protected index = this.RULE("index", (): Expr =>
    this.OR([
      {
        ALT: () => {
          const e = this.SUBRULE(this.expr);
          this.OPTION(() => {
            const c = this.CONSUME(T.Colon);
            this.fail(() => unsupported3("register slices (q[a:b])", posOf(c)));
          });
          return e;
        },
      },
      {
        ALT: (): Expr => {
          const c = this.CONSUME2(T.Colon);
          this.fail(() => unsupported3("register slices (q[a:b])", posOf(c)));
          return { kind: "number", value: 0, pos: posOf(c) };
        },
      },
      {
        ALT: (): Expr => {
          const b = this.CONSUME(T.LBrace);
          this.fail(() => unsupported3("index sets (q[{a, b}])", posOf(b)));
          return { kind: "number", value: 0, pos: posOf(b) };
        },
      },
    ]),
  );

  protected exprList = this.RULE("exprList", (): Expr[] => {
    const out: Expr[] = [];
    this.AT_LEAST_ONE_SEP({
      SEP: T.Comma,
      DEF: () => {
        const e = this.SUBRULE(this.expr);
        this.ACTION(() => out.push(e));
      },
    });
    return out;
  });

  protected expr = this.RULE("expr", (): Expr => {
    let left = this.SUBRULE(this.term);
    this.MANY(() => {
      const op = this.OR([
        { ALT: () => this.CONSUME(T.Plus) },
        { ALT: () => this.CONSUME(T.Minus) },
      ]);
      const right = this.SUBRULE2(this.term);
      left = this.ACTION(() => ({
        kind: "binary",
        op: op.image as "+" | "-",
        left,
        right,
        pos: span(left.pos, right.pos),
      }));
    });
    return left;
  });

  protected term = this.RULE("term", (): Expr => {
    let left = this.SUBRULE(this.unary);
    this.MANY(() => {
      const op = this.OR([
        { ALT: () => this.CONSUME(T.Star) },
        { ALT: () => this.CONSUME(T.Slash) },
      ]);
      const right = this.SUBRULE2(this.unary);
      left = this.ACTION(() => ({
        kind: "binary",
        op: op.image as "*" | "/",
        left,
        right,
        pos: span(left.pos, right.pos),
      }));
    });
    return left;
  });

  protected unary = this.RULE("unary", (): Expr =>
    this.OR([
      {
        ALT: () => {
          const m = this.CONSUME(T.Minus);
          const arg = this.SUBRULE(this.unary);
          return this.ACTION((): Expr => ({ kind: "negate", arg, pos: span(posOf(m), arg.pos) }));
        },
      },
      {
        ALT: () => {
          const p = this.CONSUME(T.Plus);
          const arg = this.SUBRULE2(this.unary);
          return this.ACTION((): Expr => ({ ...arg, pos: span(posOf(p), arg.pos) }));
        },
      },
      { ALT: () => this.SUBRULE(this.power) },
    ]),
  );

  /** Power is right-associative and binds tighter than unary minus: -2^2 = -4, 2^-1 = 0.5. */
  protected power = this.RULE("power", (): Expr => {
    const base = this.SUBRULE(this.primary);
    let result = base;
    this.OPTION(() => {
      const op = this.OR([
        { ALT: () => this.CONSUME(T.Caret) },
        { ALT: () => this.CONSUME(T.DoubleStar) },
      ]);
      const exponent = this.SUBRULE(this.unary);
      result = this.ACTION((): Expr => ({
        kind: "binary",
        op: op.image as "^" | "**",
        left: base,
        right: exponent,
        pos: span(base.pos, exponent.pos),
      }));
    });
    return result;
  });

  protected primary = this.RULE("primary", (): Expr =>
    this.OR([
      { ALT: () => this.numberLiteral(this.CONSUME(T.Real)) },
      { ALT: () => this.numberLiteral(this.CONSUME(T.Integer)) },
      {
        ALT: () => {
          const name = this.CONSUME(T.Identifier);
          let call: { args: Expr[]; close: IToken } | null = null;
          this.OPTION(() => {
            this.CONSUME(T.LParen);
            let args: Expr[] = [];
            this.OPTION2(() => {
              args = this.SUBRULE(this.exprList);
            });
            call = { args, close: this.CONSUME(T.RParen) };
          });
          return this.ACTION((): Expr => {
            const c = call as { args: Expr[]; close: IToken } | null;
            if (c === null) return { kind: "name", name: name.image, pos: posOf(name) };
            return {
              kind: "call",
              fn: name.image,
              args: c.args,
              pos: span(posOf(name), posOf(c.close)),
            };
          });
        },
      },
      {
        // `pow` is a keyword of the OpenQASM 3 lexer (the modifier) and a function here.
        ALT: () => {
          const name = this.CONSUME(T.Pow);
          this.CONSUME3(T.LParen);
          const args = this.SUBRULE2(this.exprList);
          const close = this.CONSUME3(T.RParen);
          return this.ACTION((): Expr => ({
            kind: "call",
            fn: "pow",
            args,
            pos: span(posOf(name), posOf(close)),
          }));
        },
      },
      {
        ALT: () => {
          const open = this.CONSUME2(T.LParen);
          const inner = this.SUBRULE(this.expr);
          const close = this.CONSUME2(T.RParen);
          return this.ACTION((): Expr => ({ ...inner, pos: span(posOf(open), posOf(close)) }));
        },
      },
    ]),
  );

  protected numberLiteral(tok: IToken): Expr {
    return { kind: "number", value: Number(tok.image), pos: posOf(tok) };
  }
}
