/**
 * The chevrotain grammar shared by OpenQASM 2.0 and Ketwise's OpenQASM 3 subset.
 *
 * Grammar (after the OpenQASM 2.0 paper, arXiv:1707.03429 §3, and the OpenQASM 3
 * specification for the 3-only forms):
 *   program    := statement*
 *   statement  := 'OPENQASM' version ';' | 'include' string ';'
 *               | ('qreg'|'creg') id '[' int ']' ';'
 *               | ('qubit'|'bit') ('[' expr ']')? id ('=' 'measure' operand)? ';'
 *               | 'input' ('float'|'angle') ('[' int ']')? id ';'
 *               | 'const' type ('[' int ']')? id '=' expr ';'
 *               | 'for' type? id 'in' ('[' expr ':' expr (':' expr)? ']' | '{' exprs '}') (block | statement)
 *               | 'gate' id ('(' ids? ')')? ids '{' (call | barrier)* '}'
 *               | 'opaque' id ('(' ids? ')')? ids ';'
 *               | 'measure' operand ('->' operand)? ';' | operand '=' 'measure' operand ';'
 *               | 'reset' operand ';' | 'barrier' operands? ';' | call
 *   call       := modifier* id ('(' exprs? ')')? operands? ';'
 *   modifier   := ('inv' | 'pow' '(' expr ')' | ('ctrl'|'negctrl') ('(' expr ')')?) '@'
 *   type       := ('int'|'uint'|'float'|'angle') ('[' int ']')?
 * (operands and expressions: parser-base.ts).
 * Dialect differences (which operator means power, which statements exist) are checked
 * after parsing, except for reserved OpenQASM 3 words, which are rejected here.
 */
import type { IToken } from "chevrotain";
import type {
  BarrierStmt,
  ClassicalType,
  Expr,
  GateBodyStmt,
  GateCallStmt,
  Ident,
  LoopSet,
  Modifier,
  Operand,
  Stmt,
} from "./ast";
import { semanticError, unsupported3 } from "./circuit-errors";
import { ExpressionParser, posOf, span } from "./parser-base";
import * as T from "./tokens";

/** Human description of a reserved OpenQASM 3 word, for the "not supported" error. */
function describeReserved(word: string): string {
  const lw = word.toLowerCase();
  if (
    [
      "for",
      "while",
      "if",
      "else",
      "switch",
      "case",
      "default",
      "break",
      "continue",
      "end",
      "return",
    ].includes(lw)
  ) {
    return `'${word}' (classical control flow)`;
  }
  if (["ctrl", "negctrl", "inv", "pow"].includes(lw)) return `gate modifier '${word} @'`;
  if (["def", "extern"].includes(lw)) return `subroutines ('${word}')`;
  if (["defcal", "defcalgrammar", "cal"].includes(lw)) return `pulse-level calibration ('${word}')`;
  if (["delay", "box", "duration", "stretch", "durationof"].includes(lw))
    return `timing ('${word}')`;
  if (lw === "gphase") return "'gphase' (global phase statements)";
  if (lw === "output") return "'output' declarations";
  if (lw === "opaque") return "'opaque' gates";
  return `'${word}' (classical types and variables)`;
}

class QasmParser extends ExpressionParser {
  constructor() {
    super();
    this.performSelfAnalysis();
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
      { ALT: () => [this.SUBRULE(this.constStmt)] },
      { ALT: () => [this.SUBRULE(this.forStmt)] },
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
    const v = this.OR([
      { ALT: () => this.CONSUME(T.Real) },
      { ALT: () => this.CONSUME(T.Integer) },
    ]);
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
    // an expression, so that `qreg q[10^30]` can be answered with its real problem (too
    // many qubits); the compiler accepts only integer literals in OpenQASM 2.0
    const size = this.SUBRULE(this.expr);
    this.CONSUME(T.RBracket);
    this.CONSUME(T.Semicolon);
    return {
      kind: "register",
      quantum: kw.image === "qreg",
      name: name.image,
      size,
      pos: posOf(name),
      keyword: kw.image,
    };
  });

  /** `qubit[n] q;`, `qubit q;`, `bit[n] c;`, `bit c;`, `bit[n] c = measure q;` (OpenQASM 3). */
  private newRegister = this.RULE("newRegister", (): Stmt[] => {
    const kw = this.OR([{ ALT: () => this.CONSUME(T.Qubit) }, { ALT: () => this.CONSUME(T.Bit) }]);
    let size: Expr | null = null;
    this.OPTION(() => {
      this.CONSUME(T.LBracket);
      size = this.SUBRULE(this.expr);
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
      const quantum = kw.image === "qubit";
      const reg: Stmt = {
        kind: "register",
        quantum,
        name: name.image,
        size,
        pos: posOf(name),
        keyword: kw.image,
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
          const t = this.OR2([
            { ALT: () => this.CONSUME(T.UnsupportedKeyword) },
            { ALT: () => this.CONSUME(T.Bit) },
            { ALT: () => this.CONSUME(T.Int) },
            { ALT: () => this.CONSUME(T.Uint) },
          ]);
          this.fail(() =>
            unsupported3(
              `input of type '${t.image}' (inputs must be 'float' or 'angle')`,
              posOf(t),
            ),
          );
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
    return {
      kind: "input",
      name: name.image,
      type: type.image === "angle" ? "angle" : "float",
      pos: posOf(name),
    };
  });

  /** `int`, `uint`, `float` or `angle`, with an optional (ignored) bit width. */
  private classicalType = this.RULE("classicalType", (): ClassicalType => {
    const t = this.OR([
      { ALT: () => this.CONSUME(T.Int) },
      { ALT: () => this.CONSUME(T.Uint) },
      { ALT: () => this.CONSUME(T.Float) },
      { ALT: () => this.CONSUME(T.Angle) },
      {
        ALT: () => {
          const u = this.OR2([
            { ALT: () => this.CONSUME(T.UnsupportedKeyword) },
            { ALT: () => this.CONSUME(T.Bit) },
          ]);
          this.fail(() =>
            unsupported3(`the type '${u.image}' here (use int, uint, float or angle)`, posOf(u)),
          );
          return u;
        },
      },
    ]);
    this.OPTION(() => {
      this.CONSUME(T.LBracket);
      this.CONSUME(T.Integer);
      this.CONSUME(T.RBracket);
    });
    return t.image as ClassicalType;
  });

  private constStmt = this.RULE("constStmt", (): Stmt => {
    this.CONSUME(T.Const);
    const type = this.SUBRULE(this.classicalType);
    const name = this.CONSUME(T.Identifier);
    this.CONSUME(T.Equals);
    const value = this.SUBRULE(this.expr);
    this.CONSUME(T.Semicolon);
    return { kind: "const", name: name.image, type, value, pos: posOf(name) };
  });

  private forStmt = this.RULE("forStmt", (): Stmt => {
    const kw = this.CONSUME(T.For);
    let type: ClassicalType | null = null;
    this.OPTION(() => {
      type = this.SUBRULE(this.classicalType);
    });
    const name = this.CONSUME(T.Identifier);
    this.CONSUME(T.In);
    const set = this.SUBRULE(this.loopSet);
    const body: Stmt[] = [];
    this.OR([
      {
        ALT: () => {
          this.CONSUME(T.LBrace);
          this.MANY(() => {
            const s = this.SUBRULE(this.statement);
            this.ACTION(() => body.push(...s));
          });
          this.CONSUME(T.RBrace);
        },
      },
      {
        ALT: () => {
          const s = this.SUBRULE2(this.statement);
          this.ACTION(() => body.push(...s));
        },
      },
    ]);
    return { kind: "for", name: name.image, type, set, body, pos: posOf(kw) };
  });

  private loopSet = this.RULE("loopSet", (): LoopSet =>
    this.OR([
      {
        ALT: () => {
          const open = this.CONSUME(T.LBracket);
          const start = this.SUBRULE(this.expr);
          this.CONSUME(T.Colon);
          const second = this.SUBRULE2(this.expr);
          let third: Expr | null = null;
          this.OPTION(() => {
            this.CONSUME2(T.Colon);
            third = this.SUBRULE3(this.expr);
          });
          const close = this.CONSUME(T.RBracket);
          return this.ACTION((): LoopSet => {
            const t = third as Expr | null;
            const pos = span(posOf(open), posOf(close));
            return t === null
              ? { kind: "range", start, step: null, end: second, pos }
              : { kind: "range", start, step: second, end: t, pos };
          });
        },
      },
      {
        ALT: () => {
          const open = this.CONSUME(T.LBrace);
          const values = this.SUBRULE(this.exprList);
          const close = this.CONSUME(T.RBrace);
          return { kind: "set", values, pos: span(posOf(open), posOf(close)) };
        },
      },
    ]),
  );

  private modifier = this.RULE("modifier", (): Modifier => {
    const m = this.OR([
      { ALT: (): Modifier => ({ kind: "inv", pos: posOf(this.CONSUME(T.Inv)) }) },
      {
        ALT: (): Modifier => {
          const kw = this.CONSUME(T.Pow);
          this.CONSUME(T.LParen);
          const exponent = this.SUBRULE(this.expr);
          this.CONSUME(T.RParen);
          return { kind: "pow", exponent, pos: posOf(kw) };
        },
      },
      {
        ALT: (): Modifier => {
          const kw = this.OR2([
            { ALT: () => this.CONSUME(T.Ctrl) },
            { ALT: () => this.CONSUME(T.Negctrl) },
          ]);
          let count: Expr | null = null;
          this.OPTION(() => {
            this.CONSUME2(T.LParen);
            count = this.SUBRULE2(this.expr);
            this.CONSUME2(T.RParen);
          });
          return { kind: kw.image === "ctrl" ? "ctrl" : "negctrl", count, pos: posOf(kw) };
        },
      },
    ]);
    this.CONSUME(T.At);
    return m;
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
    return this.ACTION((): Stmt => ({
      kind: "gateDef",
      name: sig.name.image,
      params: sig.params,
      qubits: sig.qubits,
      body,
      pos: posOf(sig.name),
    }));
  });

  private opaqueDef = this.RULE("opaqueDef", (): Stmt => {
    this.CONSUME(T.Opaque);
    const sig = this.SUBRULE(this.gateSignature);
    this.CONSUME(T.Semicolon);
    return this.ACTION((): Stmt => ({
      kind: "gateDef",
      name: sig.name.image,
      params: sig.params,
      qubits: sig.qubits,
      body: null,
      pos: posOf(sig.name),
    }));
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
    return this.ACTION((): Stmt => ({
      kind: "measure",
      source,
      target,
      form: "assign",
      pos: target.pos,
    }));
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
    const modifiers: Modifier[] = [];
    this.MANY(() => {
      const m = this.SUBRULE(this.modifier);
      this.ACTION(() => modifiers.push(m));
    });
    const name = this.CONSUME(T.Identifier);
    let params: Expr[] = [];
    this.OPTION(() => {
      this.CONSUME(T.LParen);
      this.OPTION2(() => {
        params = this.SUBRULE(this.exprList);
      });
      this.CONSUME(T.RParen);
    });
    this.OPTION4(() => {
      this.CONSUME(T.At);
      this.fail(() =>
        semanticError(
          `unknown gate modifier '${name.image}' (the modifiers are ctrl, negctrl, inv and pow(k))`,
          posOf(name),
        ),
      );
    });
    let args: Operand[] = [];
    this.OPTION3(() => {
      args = this.SUBRULE(this.operandList);
    });
    this.CONSUME(T.Semicolon);
    const pos = modifiers.length > 0 ? modifiers[0].pos : posOf(name);
    return { kind: "call", modifiers, name: name.image, params, args, pos, namePos: posOf(name) };
  });

  /** Statements outside the supported language: always throws a specific error. */
  private rejected = this.RULE("rejected", (): Stmt[] => {
    this.OR([
      {
        ALT: () => {
          const t = this.CONSUME(T.If);
          this.fail(() =>
            semanticError("classically controlled gates are not supported ('if')", posOf(t)),
          );
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
          const t = this.OR2([
            { ALT: () => this.CONSUME(T.Float) },
            { ALT: () => this.CONSUME(T.Angle) },
          ]);
          this.fail(() =>
            unsupported3(
              `classical variable declarations ('${t.image}'); use 'input ${t.image} name;' for a parameter or 'const ${t.image} name = …;'`,
              posOf(t),
            ),
          );
        },
      },
      {
        ALT: () => {
          const t = this.OR3([
            { ALT: () => this.CONSUME(T.Int) },
            { ALT: () => this.CONSUME(T.Uint) },
          ]);
          this.fail(() =>
            unsupported3(
              `classical variables ('${t.image}'); declare a constant with 'const ${t.image} name = …;'`,
              posOf(t),
            ),
          );
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
}

let parser: QasmParser | null = null;

/** The shared parser instance (built on first use; chevrotain parsers are reusable). */
export function getParser(): QasmParser {
  parser ??= new QasmParser();
  return parser;
}
