/**
 * Plain-English syntax messages for the chevrotain parser ("expected ';' after 'q[0]'
 * but found 'cx'") and the conversion of chevrotain's lexing/recognition errors into
 * EngineErrors with a 1-based line and column.
 */
import {
  EOF,
  type ILexingError,
  type IParserErrorMessageProvider,
  type IRecognitionException,
  type IToken,
  type TokenType,
} from "chevrotain";
import { syntaxError, type Location } from "./circuit-errors";
import type { EngineError } from "../errors";

/** What each rule expects when none of its alternatives matches. */
const RULE_EXPECTATIONS: Record<string, string> = {
  program: "a statement",
  statement: "a statement (a declaration, gate call, measure, reset or barrier)",
  gateBodyStatement: "a gate call, a barrier or '}'",
  operand: "a qubit or register (e.g. q or q[0])",
  index: "an index (a non-negative integer)",
  primary: "a number, a name or '('",
  unary: "a number, a name or '('",
  versionStmt: "a version number",
  inputStmt: "a type ('float' or 'angle')",
  classicalType: "a type (int, uint, float or angle)",
  loopSet: "a range such as [0:3] or a set such as {0, 2}",
  modifier: "a gate modifier (ctrl, negctrl, inv or pow(k))",
};

function label(t: TokenType): string {
  return t.LABEL ?? t.name;
}

function isEof(tok: IToken | undefined): boolean {
  return tok === undefined || tok.tokenType === EOF;
}

function shown(image: string): string {
  const s = image.length > 30 ? `${image.slice(0, 30)}…` : image;
  return `'${s}'`;
}

function after(previous: IToken | undefined): string {
  if (previous === undefined || isEof(previous) || !(previous.startOffset >= 0)) return "";
  return ` after ${shown(previous.image)}`;
}

function found(actual: IToken | undefined): string {
  return isEof(actual) ? " but the program ended" : ` but found ${shown(actual!.image)}`;
}

function oneOf(labels: string[]): string {
  const uniq = [...new Set(labels)];
  if (uniq.length <= 1) return uniq[0] ?? "something else";
  return `one of ${uniq.slice(0, -1).join(", ")} or ${uniq[uniq.length - 1]}`;
}

export const qasmErrorMessages: IParserErrorMessageProvider = {
  buildMismatchTokenMessage({ expected, actual, previous }) {
    return `expected ${label(expected)}${after(previous)}${found(actual)}`;
  },
  buildNotAllInputParsedMessage({ firstRedundant }) {
    return `expected ${RULE_EXPECTATIONS.statement}${found(firstRedundant)}`;
  },
  buildNoViableAltMessage({ expectedPathsPerAlt, actual, previous, ruleName }) {
    const what =
      RULE_EXPECTATIONS[ruleName] ??
      oneOf(expectedPathsPerAlt.flat().map((path) => label(path[0])));
    return `expected ${what}${after(previous)}${found(actual[0])}`;
  },
  buildEarlyExitMessage({ expectedIterationPaths, actual, previous, ruleName }) {
    const what =
      RULE_EXPECTATIONS[ruleName] ?? oneOf(expectedIterationPaths.map((path) => label(path[0])));
    return `expected ${what}${after(previous)}${found(actual[0])}`;
  },
};

/**
 * Where to point for a recognition error: at the offending token, unless it sits on a
 * later line than the last good token (a missing ';' at a line end) or is the end of
 * input — then just after the last good token.
 */
function errorLocation(token: IToken, previous: IToken | undefined): Location {
  const prevOk = previous !== undefined && !isEof(previous) && previous.startOffset >= 0;
  if (prevOk && (isEof(token) || (token.startLine ?? 0) > (previous.endLine ?? 0))) {
    return { line: previous.endLine ?? 1, column: (previous.endColumn ?? 0) + 1 };
  }
  if (isEof(token)) return { line: 1, column: 1 };
  return { line: token.startLine ?? 1, column: token.startColumn ?? 1 };
}

export function fromRecognitionError(e: IRecognitionException): EngineError {
  const previous = (e as IRecognitionException & { previousToken?: IToken }).previousToken;
  return syntaxError(e.message, errorLocation(e.token, previous));
}

export function fromLexingError(e: ILexingError, source: string): EngineError {
  const ch = source.charAt(e.offset);
  const cp = source.codePointAt(e.offset) ?? 0;
  const shownChar =
    cp < 0x20 || cp === 0x7f
      ? `U+${cp.toString(16).toUpperCase().padStart(4, "0")}`
      : `'${String.fromCodePoint(cp)}'`;
  const message =
    ch === '"' || ch === "'"
      ? "unterminated string: a file name in quotes must end on the same line"
      : ch === "/" && source.charAt(e.offset + 1) === "*"
        ? "unterminated comment: '/*' without a closing '*/'"
        : `unexpected character ${shownChar}`;
  return syntaxError(message, { line: e.line ?? 1, column: e.column ?? 1 });
}
