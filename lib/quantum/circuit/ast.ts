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

/** `q` (whole register or single qubit) or `q[3]`. */
export interface Operand {
  name: string;
  index: number | null;
  pos: Pos;
}

export interface Ident {
  name: string;
  pos: Pos;
}

export interface GateCallStmt {
  kind: "call";
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
  | { kind: "register"; quantum: boolean; name: string; size: number | null; sizePos: Pos | null; pos: Pos; keyword: string }
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
  | { kind: "reset"; arg: Operand; pos: Pos };

export interface ProgramAst {
  statements: Stmt[];
  source: string;
  /** Where the first token starts (null for a program of only comments and blanks). */
  firstToken: { line: number; column: number } | null;
}
