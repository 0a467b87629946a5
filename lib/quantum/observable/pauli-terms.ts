/**
 * Observables as data: `{ format: "terms", terms: [{ coefficient, pauli }] }`, one Pauli
 * word per entry (sparse "X0 Z3" or dense "XIZY", qubit 0 first), for Hamiltonians made
 * by programs. The words obey exactly the rules of Pauli-sum text (pauli-parse.ts): a
 * word that is not plain letters/qubit numbers is read by the same parser so the
 * message is the same; every problem points at `observable.terms[i].pauli` (or
 * `.coefficient`). Equal words are summed; exact zeros are dropped.
 */
import { EngineError, isEngineError, type EngineIssue } from "../errors";
import type { PauliSum, PauliTerm } from "../types";
import { MAX_PAULI_QUBIT_INDEX } from "./bits";
import { parsePauliSum } from "./pauli-parse";
import { masksToWord, setLetter, type PauliLetter } from "./pauli-word";

export interface PauliTermInput {
  coefficient: number;
  pauli: string;
}

/** A parsed term list: the sum, and for each kept term the index of its first entry. */
export interface ParsedPauliTerms extends PauliSum {
  /** Length of the dense words when any entry used one (all must agree), else null. */
  denseLength: number | null;
  /** Entry index of the first dense word (null without dense words). */
  denseEntry: number | null;
  /** `entries[i]` is the request index of the first entry that made `terms[i]`. */
  entries: number[];
}

const MAX_ISSUES = 20;
const SPARSE = /^\s*(?:[XYZI]\d+\s*)+$/;
const DENSE = /^\s*([XYZI]+)\s*$/;

function path(i: number, field: "pauli" | "coefficient"): (string | number)[] {
  return ["observable", "terms", i, field];
}

interface Word {
  dense: string | null;
  factors: { letter: PauliLetter; qubit: number }[];
}

/** One entry's word, or an issue with the message Pauli-sum text would give. */
function readWord(text: unknown, i: number, issues: EngineIssue[]): Word | null {
  const at = `observable.terms[${i}].pauli`;
  if (typeof text !== "string") {
    issues.push({
      path: path(i, "pauli"),
      message: `${at} must be a string (a Pauli word such as "X0 Z3" or "XIZY")`,
    });
    return null;
  }
  const dense = DENSE.exec(text);
  if (dense && !/\d/.test(text)) {
    if (dense[1].length > MAX_PAULI_QUBIT_INDEX + 1) {
      issues.push({
        path: path(i, "pauli"),
        message: `${at}: the dense word has ${dense[1].length} letters (at most ${MAX_PAULI_QUBIT_INDEX + 1})`,
      });
      return null;
    }
    return { dense: dense[1] === "I" ? null : dense[1], factors: [] };
  }
  if (SPARSE.test(text)) {
    const factors: Word["factors"] = [];
    let ok = true;
    for (const m of text.matchAll(/([XYZI])(\d+)/g)) {
      const qubit = Number(m[2]);
      if (qubit > MAX_PAULI_QUBIT_INDEX || factors.some((f) => f.qubit === qubit)) ok = false;
      factors.push({ letter: m[1] as PauliLetter, qubit });
    }
    if (ok) return { dense: null, factors };
  }
  // Anything else: the Pauli-text parser gives the specific message (or accepts text
  // such as "2 X0" or "X0 + Z1", which is more than one word).
  try {
    parsePauliSum(text);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    const first = e.issues[0];
    const where = first?.column !== undefined ? ` (column ${first.column})` : "";
    const message = `${at}${where}: ${(first?.message ?? e.message).replace(/^term 1 \("[^"]*"\)(: )?/, "")}`;
    issues.push({ path: path(i, "pauli"), message });
    return null;
  }
  issues.push({
    path: path(i, "pauli"),
    message: `${at} must be one Pauli word ("X0 Z3" or "XIZY"), got "${text}"; put the number in coefficient and each word in its own entry`,
  });
  return null;
}

/** Parses and checks a term list (all problems reported at once, at most 20). */
export function parsePauliTerms(terms: unknown): ParsedPauliTerms {
  if (!Array.isArray(terms) || terms.length === 0) {
    const message = "observable.terms must be a non-empty list of { coefficient, pauli }";
    throw new EngineError("observable_invalid", message, [
      { path: ["observable", "terms"], message },
    ]);
  }
  const issues: EngineIssue[] = [];
  const words: (Word | null)[] = terms.map((t, i) => {
    const entry = (typeof t === "object" && t !== null ? t : {}) as Partial<PauliTermInput>;
    if (typeof entry.coefficient !== "number" || !Number.isFinite(entry.coefficient)) {
      issues.push({
        path: path(i, "coefficient"),
        message: `observable.terms[${i}].coefficient must be a finite real number, got ${JSON.stringify(entry.coefficient ?? null)}`,
      });
    }
    return readWord(entry.pauli, i, issues);
  });
  let denseLength: number | null = null;
  let denseEntry: number | null = null;
  words.forEach((w, i) => {
    if (w?.dense == null) return;
    if (denseLength === null) {
      denseLength = w.dense.length;
      denseEntry = i;
    } else if (w.dense.length !== denseLength) {
      issues.push({
        path: path(i, "pauli"),
        message: `observable.terms[${i}].pauli: dense word "${w.dense}" has ${w.dense.length} letters but the earlier dense word (terms[${denseEntry}]) has ${denseLength}; dense words need one letter per qubit`,
      });
    }
  });
  if (denseLength !== null) {
    const n: number = denseLength;
    words.forEach((w, i) => {
      const beyond = w?.factors.find((f) => f.qubit >= n);
      if (beyond) {
        issues.push({
          path: path(i, "pauli"),
          message: `observable.terms[${i}].pauli names qubit ${beyond.qubit} but the dense words have ${n} letters (qubits 0 to ${n - 1})`,
        });
      }
    });
  }
  if (issues.length > 0)
    throw new EngineError("observable_invalid", issues[0].message, issues.slice(0, MAX_ISSUES));
  return combine(terms as PauliTermInput[], words as Word[], denseLength, denseEntry);
}

function combine(
  input: PauliTermInput[],
  words: Word[],
  denseLength: number | null,
  denseEntry: number | null,
): ParsedPauliTerms {
  let numQubits = denseLength ?? 0;
  const byKey = new Map<string, { term: PauliTerm; entry: number }>();
  words.forEach((w, i) => {
    const masks = { x: 0, z: 0 };
    if (w.dense !== null)
      for (let q = 0; q < w.dense.length; q++) setLetter(masks, q, w.dense[q] as PauliLetter);
    for (const f of w.factors) {
      numQubits = Math.max(numQubits, f.qubit + 1);
      setLetter(masks, f.qubit, f.letter);
    }
    const key = `${masks.x},${masks.z}`;
    const hit = byKey.get(key);
    if (hit) hit.term.coefficient += input[i].coefficient;
    else
      byKey.set(key, {
        term: { coefficient: input[i].coefficient, xMask: masks.x, zMask: masks.z, word: "" },
        entry: i,
      });
  });
  const kept = [...byKey.values()].filter((e) => e.term.coefficient !== 0);
  const entries =
    kept.length > 0 ? kept : [{ term: { coefficient: 0, xMask: 0, zMask: 0, word: "" }, entry: 0 }];
  return {
    numQubits,
    denseLength,
    denseEntry,
    terms: entries.map((e) => ({
      ...e.term,
      word: masksToWord(e.term.xMask, e.term.zMask, numQubits),
    })),
    entries: entries.map((e) => e.entry),
  };
}

export { pauliTermsToText } from "./pauli-terms-text";
