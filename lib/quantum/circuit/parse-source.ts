/**
 * Source text → syntax tree, for one dialect. Lexing and parsing use chevrotain; the
 * first lexing or recognition error becomes an EngineError ("qasm_syntax").
 */
import type { ProgramAst } from "./ast";
import { fromLexingError, fromRecognitionError } from "./parse-errors";
import { getParser } from "./parser";
import { getLexers } from "./tokens";

export type QasmFormat = "qasm2" | "qasm3";

export function parseSource(format: QasmFormat, source: string): ProgramAst {
  const lexed = getLexers()[format].tokenize(source);
  if (lexed.errors.length > 0) throw fromLexingError(lexed.errors[0], source);
  const parser = getParser();
  parser.input = lexed.tokens;
  const statements = parser.program();
  if (parser.errors.length > 0) throw fromRecognitionError(parser.errors[0]);
  const first = lexed.tokens[0];
  const firstToken = first ? { line: first.startLine ?? 1, column: first.startColumn ?? 1 } : null;
  return { statements, source, firstToken };
}
