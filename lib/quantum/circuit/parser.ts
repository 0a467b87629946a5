/**
 * The chevrotain grammar shared by OpenQASM 2.0 and Ketwise's OpenQASM 3 subset.
 *
 * Grammar (after the OpenQASM 2.0 paper, arXiv:1707.03429 §3, and the OpenQASM 3
 * specification for the 3-only forms):
 *   program    := statement*
 *   statement  := 'OPENQASM' version ';' | 'include' string ';'
 *               | ('qreg'|'creg') id '[' int ']' ';'
 *               | ('qubit'|'bit') ('[' int ']')? id ('=' 'measure' operand)? ';'
 *               | 'input' ('float'|'angle') ('[' int ']')? id ';'
 *               | 'gate' id ('(' ids? ')')? ids '{' (call | barrier)* '}'
 *               | 'opaque' id ('(' ids? ')')? ids ';'
 *               | 'measure' operand ('->' operand)? ';' | operand '=' 'measure' operand ';'
 *               | 'reset' operand ';' | 'barrier' operands? ';' | call
 *   call       := id ('(' exprs? ')')? operands ';'
 *   operand    := id ('[' int ']')?
 *   expr       := term (('+'|'-') term)* ; term := unary (('*'|'/') unary)*
 *   unary      := '-' unary | '+' unary | power ; power := primary (('^'|'**') unary)?
 *   primary    := number | id | id '(' exprs ')' | '(' expr ')'
 * Dialect differences (which operator means power, which statements exist) are checked
 * after parsing, except for reserved OpenQASM 3 words, which are rejected here.
 */
import { EmbeddedActionsParser, type IToken } from "chevrotain";
import type { BarrierStmt, Expr, GateBodyStmt, GateCallStmt, Ident, Operand, Pos, Stmt } from "./ast";
import { semanticError, unsupported3 } from "./circuit-errors";
import { qasmErrorMessages } from "./parse-errors";
import * as T from "./tokens";

export function posOf(tok: IToken): Pos {
  return { line: tok.startLine ?? 1, column: tok.startColumn ?? 1, start: tok.startOffset, end: (tok.endOffset ?? tok.startOffset) + 1 };
}

function span(a: Pos, b: Pos): Pos {
  return { line: a.line, column: a.column, start: a.start, end: b.end };
}

/** Human description of a reserved OpenQASM 3 word, for the "not supported" error. */
function describeReserved(word: string): string {
  const lw = word.toLowerCase();
  if (["for", "while", "if", "else", "switch", "case", "default", "break", "continue", "end", "return"].includes(lw)) {
    return `'${word}' (classical control flow)`;
  }
  if (["ctrl", "negctrl", "inv", "pow"].includes(lw)) return `gate modifier '${word} @'`;
  if (["def", "extern"].includes(lw)) return `subroutines ('${word}')`;
  if (["defcal", "defcalgrammar", "cal"].includes(lw)) return `pulse-level calibration ('${word}')`;
  if (["delay", "box", "duration", "stretch", "durationof"].includes(lw)) return `timing ('${word}')`;
  if (lw === "gphase") return "'gphase' (global phase statements)";
  if (lw === "output") return "'output' declarations";
  if (lw === "opaque") return "'opaque' gates";
  return `'${word}' (classical types and variables)`;
}

class QasmParser extends EmbeddedActionsParser {
  constructor() {
    super(T.allTokens, { recoveryEnabled: false, maxLookahead: 5, errorMessageProvider: qasmErrorMessages });
    this.performSelfAnalysis();
  }

  private fail(make: () => Error): void {
    this.ACTION(() => {
      throw make();
    });
  }

  public program = this.RULE("program", (): Stmt[] => {
    const out: Stmt[] = [];
    this.MANY(() => {
      const s = this.SUBRULE(this.statement);
      this.ACTION(() => out.push(...s));
    });
    return out;
  });

  private statement = this.RULE("statement", (): Stmt[] =>
    this.OR([
      { ALT: () => [this.SUBRULE(this.versionStmt)] },
      { ALT: () => [this.SUBRULE(this.includeStmt)] },
      { ALT: () => [this.SUBRULE(this.oldRegister)] },
      { ALT: () => this.SUBRULE(this.newRegister) },
      { ALT: () => [this.SUBRULE(this.inputStmt)] },
      { ALT: () => [this.SUBRULE(this.gateDef)] },
      { ALT: () => [this.SUBRULE(this.opaqueDef)] },
      { ALT: () => [this.SUBRULE(this.measureStmt)] },
      { ALT: () => [this.SUBRULE(this.assignMeasure)] },
      { ALT: () => [this.SUBRULE(this.resetStmt)] },
      { ALT: () => [this.SUBRULE(this.barrierStmt)] },
      { ALT: () => [this.SUBRULE(this.gateCall)] },
      { ALT: () => this.SUBRULE(this.rejected) },
    ]),
  );

  private versionStmt = this.RULE("versionStmt", (): Stmt => {
    const kw = this.CONSUME(T.Openqasm);
    const v = this.OR([{ ALT: () => this.CONSUME(T.Real) }, { ALT: () => this.CONSUME(T.Integer) }]);
    this.CONSUME(T.Semicolon);
    return { kind: "version", version: v.image, pos: span(posOf(kw), posOf(v)) };
  });

  private includeStmt = this.RULE("includeStmt", (): Stmt => {
    const kw = this.CONSUME(T.Include);
    const file = this.CONSUME(T.StringLiteral);
    this.CONSUME(T.Semicolon);
    return { kind: "include", file: file.image.slice(1, -1), pos: span(posOf(kw), posOf(file)) };
  });

  private oldRegister = this.RULE("oldRegister", (): Stmt => {
    const kw = this.OR([{ ALT: () => this.CONSUME(T.Qreg) }, { ALT: () => this.CONSUME(T.Creg) }]);
    const name = this.CONSUME(T.Identifier);
    this.CONSUME(T.LBracket);
    const size = this.CONSUME(T.Integer);
    this.CONSUME(T.RBracket);
    this.CONSUME(T.Semicolon);
    return {
      kind: "register", quantum: kw.image === "qreg", name: name.image, size: Number(size.image),
      sizePos: posOf(size), pos: posOf(name), keyword: kw.image,
    };
  });

  /** `qubit[n] q;`, `qubit q;`, `bit[n] c;`, `bit c;`, `bit[n] c = measure q;` (OpenQASM 3). */
  private newRegister = this.RULE("newRegister", (): Stmt[] => {
    const kw = this.OR([{ ALT: () => this.CONSUME(T.Qubit) }, { ALT: () => this.CONSUME(T.Bit) }]);
    let size: IToken | null = null;
    this.OPTION(() => {
      this.CONSUME(T.LBracket);
      size = this.CONSUME(T.Integer);
      this.CONSUME(T.RBracket);
    });
    const name = this.CONSUME(T.Identifier);
    let init: { eq: IToken; source: Operand } | null = null;
    this.OPTION2(() => {
      const eq = this.CONSUME(T.Equals);
      this.CONSUME(T.Measure);
      init = { eq, source: this.SUBRULE(this.operand) };
    });
    this.CONSUME(T.Semicolon);
    return this.ACTION(() => {
      const sizeTok = size as IToken | null;
      const quantum = kw.image === "qubit";
      const reg: Stmt = {
        kind: "register", quantum, name: name.image, size: sizeTok ? Number(sizeTok.image) : null,
        sizePos: sizeTok ? posOf(sizeTok) : null, pos: posOf(name), keyword: kw.image,
      };
      const i = init as { eq: IToken; source: Operand } | null;
      if (i === null) return [reg];
      if (quantum) throw unsupported3("initialising a qubit declaration", posOf(i.eq));
      const target: Operand = { name: name.image, index: null, pos: posOf(name) };
      return [reg, { kind: "measure", source: i.source, target, form: "assign", pos: posOf(name) }];
    });
  });

  private inputStmt = this.RULE("inputStmt", (): Stmt => {
    this.CONSUME(T.Input);
    const type = this.OR([
      { ALT: () => this.CONSUME(T.Float) },
      { ALT: () => this.CONSUME(T.Angle) },
      {
        ALT: () => {
          const t = this.OR2([{ ALT: () => this.CONSUME(T.UnsupportedKeyword) }, { ALT: () => this.CONSUME(T.Bit) }]);
          this.fail(() => unsupported3(`input of type '${t.image}' (inputs must be 'float' or 'angle')`, posOf(t)));
          return t;
        },
      },
    ]);
    this.OPTION(() => {
      this.CONSUME(T.LBracket);
      this.CONSUME(T.Integer);
      this.CONSUME(T.RBracket);
    });
    const name = this.CONSUME(T.Identifier);
    this.CONSUME(T.Semicolon);
    return { kind: "input", name: name.image, type: type.image === "angle" ? "angle" : "float", pos: posOf(name) };
  });

  private identList = this.RULE("identList", (): Ident[] => {
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

  private gateSignature = this.RULE("gateSignature", () => {
    const name = this.CONSUME(T.Identifier);
    let params: Ident[] = [];
    this.OPTION(() => {
      this.CONSUME(T.LParen);
      this.OPTION2(() => {
        params = this.SUBRULE(this.identList);
      });
      this.CONSUME(T.RParen);
    });
    const qubits = this.SUBRULE2(this.identList);
    return { name, params, qubits };
  });

  private gateDef = this.RULE("gateDef", (): Stmt => {
    this.CONSUME(T.Gate);
    const sig = this.SUBRULE(this.gateSignature);
    this.CONSUME(T.LBrace);
    const body: GateBodyStmt[] = [];
    this.MANY(() => {
      const s = this.SUBRULE(this.gateBodyStatement);
      this.ACTION(() => body.push(s));
    });
    this.CONSUME(T.RBrace);
    return this.ACTION((): Stmt => ({ kind: "gateDef", name: sig.name.image, params: sig.params, qubits: sig.qubits, body, pos: posOf(sig.name) }));
  });

  private opaqueDef = this.RULE("opaqueDef", (): Stmt => {
    this.CONSUME(T.Opaque);
    const sig = this.SUBRULE(this.gateSignature);
    this.CONSUME(T.Semicolon);
    return this.ACTION((): Stmt => ({ kind: "gateDef", name: sig.name.image, params: sig.params, qubits: sig.qubits, body: null, pos: posOf(sig.name) }));
  });

  private gateBodyStatement = this.RULE("gateBodyStatement", (): GateBodyStmt =>
    this.OR([
      { ALT: () => this.SUBRULE(this.barrierStmt) },
      { ALT: () => this.SUBRULE(this.gateCall) },
      { ALT: () => this.SUBRULE(this.rejected) as unknown as GateBodyStmt },
    ]),
  );

  private measureStmt = this.RULE("measureStmt", (): Stmt => {
    const kw = this.CONSUME(T.Measure);
    const source = this.SUBRULE(this.operand);
    let target: Operand | null = null;
    this.OPTION(() => {
      this.CONSUME(T.Arrow);
      target = this.SUBRULE2(this.operand);
    });
    this.CONSUME(T.Semicolon);
    return { kind: "measure", source, target, form: "arrow", pos: posOf(kw) };
  });

  private assignMeasure = this.RULE("assignMeasure", (): Stmt => {
    const target = this.SUBRULE(this.operand);
    this.CONSUME(T.Equals);
    this.CONSUME(T.Measure);
    const source = this.SUBRULE2(this.operand);
    this.CONSUME(T.Semicolon);
    return this.ACTION((): Stmt => ({ kind: "measure", source, target, form: "assign", pos: target.pos }));
  });

  private resetStmt = this.RULE("resetStmt", (): Stmt => {
    const kw = this.CONSUME(T.Reset);
    const arg = this.SUBRULE(this.operand);
    this.CONSUME(T.Semicolon);
    return { kind: "reset", arg, pos: posOf(kw) };
  });

  private barrierStmt = this.RULE("barrierStmt", (): BarrierStmt => {
    const kw = this.CONSUME(T.Barrier);
    let args: Operand[] = [];
    this.OPTION(() => {
      args = this.SUBRULE(this.operandList);
    });
    this.CONSUME(T.Semicolon);
    return { kind: "barrier", args, pos: posOf(kw) };
  });

  private gateCall = this.RULE("gateCall", (): GateCallStmt => {
    const name = this.CONSUME(T.Identifier);
    let params: Expr[] = [];
    this.OPTION(() => {
      this.CONSUME(T.LParen);
      this.OPTION2(() => {
        params = this.SUBRULE(this.exprList);
      });
      this.CONSUME(T.RParen);
    });
    const args = this.SUBRULE(this.operandList);
    this.CONSUME(T.Semicolon);
    return { kind: "call", name: name.image, params, args, pos: posOf(name), namePos: posOf(name) };
  });

  /** Statements outside the supported language: always throws a specific error. */
  private rejected = this.RULE("rejected", (): Stmt[] => {
    this.OR([
      {
        ALT: () => {
          const t = this.CONSUME(T.If);
          this.fail(() => semanticError("classically controlled gates are not supported ('if')", posOf(t)));
        },
      },
      {
        ALT: () => {
          const t = this.CONSUME(T.UnsupportedKeyword);
          this.fail(() => unsupported3(describeReserved(t.image), posOf(t)));
        },
      },
      {
        ALT: () => {
          const t = this.OR2([{ ALT: () => this.CONSUME(T.Float) }, { ALT: () => this.CONSUME(T.Angle) }]);
          this.fail(() => unsupported3(`classical variable declarations ('${t.image}'); use 'input ${t.image} name;' for a parameter`, posOf(t)));
        },
      },
      {
        ALT: () => {
          const t = this.CONSUME(T.Pragma);
          this.fail(() => unsupported3("pragmas ('#pragma')", posOf(t)));
        },
      },
      {
        ALT: () => {
          const t = this.CONSUME(T.Annotation);
          this.fail(() => unsupported3(`annotations ('${t.image}')`, posOf(t)));
        },
      },
    ]);
    return [];
  });

  private operandList = this.RULE("operandList", (): Operand[] => {
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

  private operand = this.RULE("operand", (): Operand =>
    this.OR([
      {
        ALT: () => {
          const name = this.CONSUME(T.Identifier);
          let index: number | null = null;
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
          this.fail(() => unsupported3(`physical qubits ('${t.image}'); declare 'qubit[n] q;' and use q[i]`, posOf(t)));
          return { name: t.image, index: null, pos: posOf(t) };
        },
      },
    ]),
  );

  private index = this.RULE("index", (): number =>
    this.OR([
      {
        ALT: () => {
          const t = this.CONSUME(T.Integer);
          this.OPTION(() => {
            const c = this.CONSUME(T.Colon);
            this.fail(() => unsupported3("register slices (q[a:b])", posOf(c)));
          });
          return Number(t.image);
        },
      },
      {
        ALT: () => {
          const c = this.CONSUME2(T.Colon);
          this.fail(() => unsupported3("register slices (q[a:b])", posOf(c)));
          return 0;
        },
      },
      {
        ALT: () => {
          const b = this.CONSUME(T.LBrace);
          this.fail(() => unsupported3("index sets (q[{a, b}])", posOf(b)));
          return 0;
        },
      },
    ]),
  );

  private exprList = this.RULE("exprList", (): Expr[] => {
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

  private expr = this.RULE("expr", (): Expr => {
    let left = this.SUBRULE(this.term);
    this.MANY(() => {
      const op = this.OR([{ ALT: () => this.CONSUME(T.Plus) }, { ALT: () => this.CONSUME(T.Minus) }]);
      const right = this.SUBRULE2(this.term);
      left = this.ACTION(() => ({ kind: "binary", op: op.image as "+" | "-", left, right, pos: span(left.pos, right.pos) }));
    });
    return left;
  });

  private term = this.RULE("term", (): Expr => {
    let left = this.SUBRULE(this.unary);
    this.MANY(() => {
      const op = this.OR([{ ALT: () => this.CONSUME(T.Star) }, { ALT: () => this.CONSUME(T.Slash) }]);
      const right = this.SUBRULE2(this.unary);
      left = this.ACTION(() => ({ kind: "binary", op: op.image as "*" | "/", left, right, pos: span(left.pos, right.pos) }));
    });
    return left;
  });

  private unary = this.RULE("unary", (): Expr =>
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
  private power = this.RULE("power", (): Expr => {
    const base = this.SUBRULE(this.primary);
    let result = base;
    this.OPTION(() => {
      const op = this.OR([{ ALT: () => this.CONSUME(T.Caret) }, { ALT: () => this.CONSUME(T.DoubleStar) }]);
      const exponent = this.SUBRULE(this.unary);
      result = this.ACTION((): Expr => ({ kind: "binary", op: op.image as "^" | "**", left: base, right: exponent, pos: span(base.pos, exponent.pos) }));
    });
    return result;
  });

  private primary = this.RULE("primary", (): Expr =>
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
            return { kind: "call", fn: name.image, args: c.args, pos: span(posOf(name), posOf(c.close)) };
          });
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

  private numberLiteral(tok: IToken): Expr {
    return { kind: "number", value: Number(tok.image), pos: posOf(tok) };
  }
}

let parser: QasmParser | null = null;

/** The shared parser instance (built on first use; chevrotain parsers are reusable). */
export function getParser(): QasmParser {
  parser ??= new QasmParser();
  return parser;
}
