/**
 * Pauli-sum text → `PauliSum`. Every problem becomes an
 * `EngineError` ("observable_syntax" for the shape, "observable_invalid" for
 * meaning) with path ["observable","terms"], a line, a column and a specific message.
 */
import { tokenMatcher, type IRecognitionException, type IToken } from "chevrotain";
import { EngineError, type EngineIssue } from "../errors";
import type { PauliSum, PauliTerm } from "../types";
import { MAX_PAULI_QUBIT_INDEX } from "./bits";
import { pauliSumGrammar, type RawTerm } from "./pauli-grammar";
import {
  BadWord,
  Coefficient,
  ImagNumber,
  Minus,
  NonFinite,
  Star,
  pauliLexer,
} from "./pauli-lexer";
import { masksToWord, setLetter, type PauliLetter } from "./pauli-word";

/** Where a (combined) term was first written (its coefficient or word; the sign is not included). */
export interface TermOrigin {
  line: number;
  column: number;
  /** The term as written, e.g. "- 0.5 * X0 Z1". */
  text: string;
}

export interface ParsedPauliSum extends PauliSum {
  /** Length of the dense words when the text used any (all must agree), else null. */
  denseLength: number | null;
  /** Where the first dense word is written (null without dense words). */
  denseAt: { line: number; column: number } | null;
  /** `origins[i]` is where `terms[i]` first appears. */
  origins: TermOrigin[];
}

const PATH = ["observable", "terms"];
const MAX_ISSUES = 20;

interface Factor {
  letter: PauliLetter;
  qubit: number;
  line: number;
  column: number;
}

interface AnalysedTerm {
  coefficient: number;
  factors: Factor[];
  dense: string | null;
  /** Position of the dense word. */
  denseAt: { line: number; column: number };
  origin: TermOrigin;
}

/** Parses Pauli-sum text. Terms with equal words are summed; exact zeros are dropped. */
export function parsePauliSum(text: string): ParsedPauliSum {
  if (text.trim() === "") {
    fail(
      "observable_syntax",
      'the observable is empty: write at least one term, e.g. "0.5 Z0 Z1 + 0.2 X0"',
      1,
      1,
    );
  }
  const lexed = pauliLexer.tokenize(text);
  if (lexed.errors.length > 0) {
    const e = lexed.errors[0];
    const ch = text.substr(e.offset, e.length).charAt(0);
    const hint =
      ch === "(" || ch === ")"
        ? " (parentheses are not supported: write each term as a real coefficient times a Pauli word)"
        : "";
    fail("observable_syntax", `unexpected character "${ch}"${hint}`, e.line ?? 1, e.column ?? 1);
  }
  pauliSumGrammar.input = lexed.tokens;
  const raw = pauliSumGrammar.sum();
  if (pauliSumGrammar.errors.length > 0) {
    const { message, line, column } = describeSyntaxError(pauliSumGrammar.errors[0], lexed.tokens);
    fail("observable_syntax", message, line, column);
  }
  const issues: EngineIssue[] = [];
  const analysed = raw.map((t, i) => analyseTerm(t, i, text, issues));
  if (issues.length === 0) checkDenseConsistency(analysed, issues);
  if (issues.length > 0)
    throw new EngineError("observable_invalid", issues[0].message, issues.slice(0, MAX_ISSUES));
  return combine(analysed);
}

function fail(
  code: "observable_syntax" | "observable_invalid",
  message: string,
  line: number,
  column: number,
): never {
  throw new EngineError(code, message, [{ path: PATH, message, line, column }]);
}

function describeSyntaxError(
  err: IRecognitionException,
  tokens: IToken[],
): { message: string; line: number; column: number } {
  const tok = err.token;
  const atEnd = tok.tokenType?.name === "EOF" || Number.isNaN(tok.startOffset);
  const last = tokens[tokens.length - 1];
  const prev = atEnd ? last : [...tokens].reverse().find((t) => t.startOffset < tok.startOffset);
  const line = atEnd ? (last?.endLine ?? 1) : (tok.startLine ?? 1);
  const column = atEnd ? (last?.endColumn ?? 0) + 1 : (tok.startColumn ?? 1);
  const found = atEnd ? "the end of the text" : `"${tok.image}"`;
  // A "*" followed by a number: a second coefficient after a word ("X0 * 2", "0.5*Z0*0.3*Z1").
  const star = tok.tokenType === Star ? tok : prev?.tokenType === Star ? prev : null;
  const afterStar = star ? tokens[tokens.indexOf(star) + 1] : undefined;
  if (star && afterStar && tokenMatcher(afterStar, Coefficient)) {
    const before = tokens[tokens.indexOf(star) - 1];
    const message = `unexpected "${star.image} ${afterStar.image}" after "${before?.image}": a term has one coefficient; put the coefficient before the Pauli word, e.g. "0.5 * X0 * Z1"`;
    return { message, line: star.startLine ?? 1, column: star.startColumn ?? 1 };
  }
  let message: string;
  if (err.name === "NotAllInputParsedException") {
    message =
      tok.tokenType === Star
        ? `expected a Pauli word after "${tok.image}", found ${afterStar ? `"${afterStar.image}"` : "the end of the text"}`
        : `missing "+" or "-" before "${tok.image}"`;
  } else if (prev?.tokenType === Star) {
    message = `expected a Pauli word after "${prev.image}", found ${found}`;
  } else if (prev && (prev.tokenType.name === "Plus" || prev.tokenType === Minus)) {
    message = `expected a term after "${prev.image}", found ${found}`;
  } else {
    message = `expected a coefficient or a Pauli word, found ${found}`;
  }
  return { message, line, column };
}

function termText(
  t: RawTerm,
  text: string,
): { text: string; bare: string; line: number; column: number } {
  const slice = (from: IToken, to: IToken) =>
    text.slice(from.startOffset, (to.endOffset ?? to.startOffset) + 1).replace(/\s+/g, " ");
  const toks = [t.innerSign, t.coefficient, t.star, ...t.words].filter(
    (x): x is IToken => x !== undefined,
  );
  const first = toks[0];
  const lastTok = toks[toks.length - 1];
  const body = slice(first, lastTok);
  const bareToks = toks.filter((x) => x !== t.innerSign);
  const lead = first;
  return {
    text: t.sign?.tokenType === Minus ? `-${body}` : body,
    bare: slice(bareToks[0], lastTok),
    line: lead.startLine ?? 1,
    column: lead.startColumn ?? 1,
  };
}

function issueAt(issues: EngineIssue[], tok: IToken, message: string): void {
  issues.push({ path: PATH, message, line: tok.startLine ?? 1, column: tok.startColumn ?? 1 });
}

function analyseTerm(t: RawTerm, index: number, text: string, issues: EngineIssue[]): AnalysedTerm {
  const { bare, ...origin } = termText(t, text);
  const name = `term ${index + 1} ("${origin.text}")`;
  let coefficient = t.sign?.tokenType === Minus ? -1 : 1;
  const c = t.coefficient;
  if (t.innerSign) {
    // "X0 + -0.5 Z1": a sign may stand directly before a number, nothing more.
    const extra = t.extraSigns[0] ?? t.innerSign;
    if (t.extraSigns.length > 0 || !c || c.tokenType === NonFinite) {
      issueAt(
        issues,
        extra,
        `two signs in a row before "${bare}"; write one "+" or "-" (a second sign may only stand directly before a number)`,
      );
    } else if (t.innerSign.tokenType === Minus) {
      coefficient = -coefficient;
    }
  }
  if (c) {
    if (c.tokenType === ImagNumber) {
      issueAt(
        issues,
        c,
        `${name} has a complex coefficient ${c.image}; a Pauli sum with non-real coefficients is not an observable`,
      );
    } else if (c.tokenType === NonFinite) {
      issueAt(issues, c, `${name}: the coefficient "${c.image}" is not a finite real number`);
    } else {
      const v = Number(c.image);
      if (!Number.isFinite(v))
        issueAt(issues, c, `${name}: the coefficient ${c.image} is not a finite number`);
      coefficient *= v;
    }
  }
  const factors: Factor[] = [];
  let dense: string | null = null;
  let denseAt = { line: origin.line, column: origin.column };
  let sparseTok: IToken | null = null;
  for (const w of t.words) {
    if (w.tokenType === BadWord) {
      issueAt(issues, w, badWordMessage(w.image, name, c !== undefined && w === t.words[0]));
      continue;
    }
    if (/\d/.test(w.image)) {
      if (!/^(?:[XYZI]\d+)+$/.test(w.image)) {
        issueAt(
          issues,
          w,
          `${name}: the word "${w.image}" mixes dense letters and qubit numbers; write sparse factors ("X0 Z1") or one dense word ("XZ")`,
        );
        continue;
      }
      if (dense !== null) {
        issueAt(
          issues,
          w,
          `${name} mixes a dense word ("${dense}") with sparse factors ("${w.image}")`,
        );
        continue;
      }
      sparseTok = w;
      for (const m of w.image.matchAll(/([XYZI])(\d+)/g)) {
        const qubit = Number(m[2]);
        if (qubit > MAX_PAULI_QUBIT_INDEX) {
          issueAt(
            issues,
            w,
            `${name}: qubit index ${m[2]} is too large (at most ${MAX_PAULI_QUBIT_INDEX})`,
          );
        } else if (factors.some((f) => f.qubit === qubit)) {
          issueAt(
            issues,
            w,
            `${name}: qubit ${qubit} appears twice in one Pauli word; write each qubit once per term`,
          );
        } else {
          factors.push({
            letter: m[1] as PauliLetter,
            qubit,
            line: w.startLine ?? 1,
            column: (w.startColumn ?? 1) + (m.index ?? 0),
          });
        }
      }
    } else if (sparseTok !== null) {
      issueAt(
        issues,
        w,
        `${name} mixes sparse factors ("${sparseTok.image}") with a dense word ("${w.image}")`,
      );
    } else if (dense !== null) {
      issueAt(issues, w, `missing "+" or "-" between "${dense}" and "${w.image}"`);
    } else if (w.image.length > MAX_PAULI_QUBIT_INDEX + 1) {
      issueAt(
        issues,
        w,
        `${name}: the dense word has ${w.image.length} letters (at most ${MAX_PAULI_QUBIT_INDEX + 1})`,
      );
    } else {
      dense = w.image;
      denseAt = { line: w.startLine ?? 1, column: w.startColumn ?? 1 };
    }
  }
  // "I" alone is the identity on any number of qubits, not a one-letter dense word.
  if (dense === "I") dense = null;
  return { coefficient, factors, dense, denseAt, origin };
}

function badWordMessage(image: string, name: string, afterCoefficient: boolean): string {
  if (afterCoefficient && (image === "i" || image === "j")) {
    return `${name} has a complex coefficient; a Pauli sum with non-real coefficients is not an observable`;
  }
  if (/^(nan|inf|infinity)$/i.test(image)) return `${name}: "${image}" is not a finite real number`;
  if (/^[XYZIxyzi][XYZIxyzi0-9]*$/.test(image)) {
    return `Pauli letters are upper-case (X, Y, Z, I): write "${image.toUpperCase()}" instead of "${image}"`;
  }
  return `unknown word "${image}": a Pauli word uses the letters X, Y, Z, I, dense ("XIZY") or with qubit numbers ("X0 Y3")`;
}

function checkDenseConsistency(terms: AnalysedTerm[], issues: EngineIssue[]): void {
  const firstDense = terms.find((t) => t.dense !== null);
  if (!firstDense) return;
  const n = firstDense.dense!.length;
  for (const t of terms) {
    if (t.dense !== null && t.dense.length !== n) {
      issues.push({
        path: PATH,
        ...t.denseAt,
        message: `dense word "${t.dense}" has ${t.dense.length} letters but the earlier dense word "${firstDense.dense}" has ${n}; dense words need one letter per qubit`,
      });
    }
    const beyond = t.factors.find((f) => f.qubit >= n);
    if (beyond) {
      issues.push({
        path: PATH,
        line: beyond.line,
        column: beyond.column,
        message: `term "${t.origin.text}" names qubit ${beyond.qubit} but the dense words have ${n} letters (qubits 0 to ${n - 1})`,
      });
    }
  }
}

function combine(analysed: AnalysedTerm[]): ParsedPauliSum {
  let numQubits = 0;
  let denseLength: number | null = null;
  let denseAt: { line: number; column: number } | null = null;
  const byKey = new Map<string, { term: PauliTerm; origin: TermOrigin }>();
  for (const a of analysed) {
    const masks = { x: 0, z: 0 };
    if (a.dense !== null) {
      denseLength = a.dense.length;
      denseAt ??= a.denseAt;
      numQubits = Math.max(numQubits, a.dense.length);
      for (let q = 0; q < a.dense.length; q++) setLetter(masks, q, a.dense[q] as PauliLetter);
    }
    for (const f of a.factors) {
      numQubits = Math.max(numQubits, f.qubit + 1);
      setLetter(masks, f.qubit, f.letter);
    }
    const key = `${masks.x},${masks.z}`;
    const hit = byKey.get(key);
    if (hit) hit.term.coefficient += a.coefficient;
    else
      byKey.set(key, {
        term: { coefficient: a.coefficient, xMask: masks.x, zMask: masks.z, word: "" },
        origin: a.origin,
      });
  }
  const kept = [...byKey.values()].filter((e) => e.term.coefficient !== 0);
  const entries =
    kept.length > 0
      ? kept
      : [{ term: { coefficient: 0, xMask: 0, zMask: 0, word: "" }, origin: analysed[0].origin }];
  return {
    numQubits,
    denseLength,
    denseAt,
    terms: entries.map((e) => ({
      ...e.term,
      word: masksToWord(e.term.xMask, e.term.zMask, numQubits),
    })),
    origins: entries.map((e) => e.origin),
  };
}
