/**
 * Syntax tree produced by the chevrotain parser (both dialects share it). Purely
 * syntactic: names are not resolved and nothing is checked yet (see compile-program.ts).
 */

/** Source position: 1-based line/column of the first character, and the offset span. */
export interface Pos {
  line: number;
  column: number;
  /** Offset of the first character. */
  start: number;
  /** Offset one past the last character. */
  end: number;
}

export type BinaryOp = "+" | "-" | "*" | "/" | "^" | "**";

export type Expr =
  | { kind: "number"; value: number; pos: Pos }
  | { kind: "name"; name: string; pos: Pos }
  | { kind: "negate"; arg: Expr; pos: Pos }
  | { kind: "binary"; op: BinaryOp; left: Expr; right: Expr; pos: Pos }
  | { kind: "call"; fn: string; args: Expr[]; pos: Pos };

/** `q` (whole register or single qubit) or `q[3]` (OpenQASM 3 also `q[i + 1]` with constants). */
export interface Operand {
  name: string;
  index: Expr | null;
  pos: Pos;
}

/** OpenQASM 3 gate modifiers, in source order (`ctrl @ inv @ g` = ctrl(inv(g))). */
export type Modifier =
  | { kind: "inv"; pos: Pos }
  | { kind: "pow"; exponent: Expr; pos: Pos }
  | { kind: "ctrl" | "negctrl"; count: Expr | null; pos: Pos };

/** Classical types of `const` declarations and loop variables. */
export type ClassicalType = "int" | "uint" | "float" | "angle";

/** `for` iteration: `[start:end]`, `[start:step:end]` (both ends included) or `{a, b, …}`. */
export type LoopSet =
  | { kind: "range"; start: Expr; step: Expr | null; end: Expr; pos: Pos }
  | { kind: "set"; values: Expr[]; pos: Pos };

export interface Ident {
  name: string;
  pos: Pos;
}

export interface GateCallStmt {
  kind: "call";
  modifiers: Modifier[];
  name: string;
  params: Expr[];
  args: Operand[];
  pos: Pos;
  /** Position of the gate name (errors about the gate point here). */
  namePos: Pos;
}

export interface BarrierStmt {
  kind: "barrier";
  args: Operand[];
  pos: Pos;
}

export type GateBodyStmt = GateCallStmt | BarrierStmt;

export type Stmt =
  | { kind: "version"; version: string; pos: Pos }
  | { kind: "include"; file: string; pos: Pos }
  /** qreg/creg/qubit/bit; `size` null for the scalar forms `qubit q;` / `bit c;`. */
  | {
      kind: "register";
      quantum: boolean;
      name: string;
      size: Expr | null;
      pos: Pos;
      keyword: string;
    }
  | { kind: "input"; name: string; type: "float" | "angle"; pos: Pos }
  | {
      kind: "gateDef";
      name: string;
      params: Ident[];
      qubits: Ident[];
      body: GateBodyStmt[] | null; // null for `opaque`
      pos: Pos;
    }
  | GateCallStmt
  | BarrierStmt
  /** `measure a -> b;`, `b = measure a;` (target null for a bare `measure a;`). */
  | { kind: "measure"; source: Operand; target: Operand | null; form: "arrow" | "assign"; pos: Pos }
  | { kind: "reset"; arg: Operand; pos: Pos }
  /** `const int n = 3;` (OpenQASM 3): a value known before the run. */
  | { kind: "const"; name: string; type: ClassicalType; value: Expr; pos: Pos }
  /** `for int i in [0:3] { … }` (OpenQASM 3), unrolled when the program is compiled. */
  | { kind: "for"; name: string; type: ClassicalType | null; set: LoopSet; body: Stmt[]; pos: Pos };

export interface ProgramAst {
  statements: Stmt[];
  source: string;
  /** Where the first token starts (null for a program of only comments and blanks). */
  firstToken: { line: number; column: number } | null;
}
