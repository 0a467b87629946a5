/**
 * OpenQASM highlighting for CodeMirror 6: a small stream tokenizer (no grammar — the
 * engine's parser is the judge of validity, its errors come back as lint markers).
 * Covers OpenQASM 2.0 and the OpenQASM 3 subset Ketwise reads: keywords, types,
 * built-in and standard gate names, constants, numbers, strings, line and block comments.
 */
import { StreamLanguage, type StreamParser } from "@codemirror/language";

const KEYWORDS = new Set([
  "OPENQASM",
  "include",
  "qreg",
  "creg",
  "qubit",
  "bit",
  "gate",
  "opaque",
  "measure",
  "reset",
  "barrier",
  "if",
  "input",
  "output",
  "const",
  "let",
  "def",
  "return",
  "for",
  "while",
  "in",
  "else",
  // OpenQASM 3 gate modifiers (ctrl @, negctrl @, inv @, pow(k) @).
  "ctrl",
  "negctrl",
  "inv",
  "pow",
]);
const TYPES = new Set(["float", "angle", "int", "uint", "bool", "complex", "duration", "stretch"]);
const CONSTANTS = new Set(["pi", "π", "tau", "τ", "euler", "ℇ", "true", "false"]);
const FUNCTIONS = new Set(["sin", "cos", "tan", "exp", "ln", "sqrt", "arcsin", "arccos", "arctan"]);
/** Gates of qelib1.inc (arXiv:1707.03429) and stdgates.inc, plus the built-ins U and CX. */
export const STANDARD_GATES = new Set([
  "U",
  "CX",
  "u",
  "u0",
  "u1",
  "u2",
  "u3",
  "p",
  "phase",
  "id",
  "x",
  "y",
  "z",
  "h",
  "s",
  "sdg",
  "t",
  "tdg",
  "sx",
  "sxdg",
  "rx",
  "ry",
  "rz",
  "cx",
  "cy",
  "cz",
  "ch",
  "csx",
  "crx",
  "cry",
  "crz",
  "cu1",
  "cp",
  "cphase",
  "cu3",
  "cu",
  "ccx",
  "cswap",
  "swap",
  "rxx",
  "rzz",
  "rccx",
  "rc3x",
  "c3x",
  "c3sqrtx",
  "c4x",
  "gphase",
]);

export type QasmState = { inBlockComment: boolean; afterGateKeyword: boolean };

export const qasmStreamParser: StreamParser<QasmState> = {
  name: "openqasm",
  startState: () => ({ inBlockComment: false, afterGateKeyword: false }),
  copyState: (s) => ({ ...s }),
  token(stream, state) {
    if (state.inBlockComment) {
      if (stream.skipTo("*/")) {
        stream.pos += 2;
        state.inBlockComment = false;
      } else stream.skipToEnd();
      return "comment";
    }
    if (stream.eatSpace()) return null;
    if (stream.match("//")) {
      stream.skipToEnd();
      return "comment";
    }
    if (stream.match("/*")) {
      state.inBlockComment = true;
      return "comment";
    }
    if (stream.match(/^"[^"\n]*"?/)) return "string";
    if (stream.match(/^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?(?:im)?/)) return "number";
    if (stream.match(/^(?:->|==|!=|<=|>=|\*\*|[-+*/^=<>!%&|~])/)) return "operator";
    const word = stream.match(
      /^[A-Za-z_\u0370-\u03ff\u2107][\w\u0370-\u03ff]*/,
    ) as RegExpMatchArray | null;
    if (word) {
      const w = word[0];
      if (state.afterGateKeyword) {
        state.afterGateKeyword = false;
        return "variableName.definition";
      }
      if (w === "gate" || w === "opaque") state.afterGateKeyword = true;
      if (KEYWORDS.has(w)) return "keyword";
      if (TYPES.has(w)) return "typeName";
      if (CONSTANTS.has(w)) return "atom";
      if (FUNCTIONS.has(w)) return "variableName.function";
      if (STANDARD_GATES.has(w)) return "variableName.standard";
      return "variableName";
    }
    if (stream.match(/^[[\](){};,:]/)) return "punctuation";
    stream.next();
    return "invalid";
  },
  languageData: { commentTokens: { line: "//", block: { open: "/*", close: "*/" } } },
};

export const qasmLanguage = StreamLanguage.define(qasmStreamParser);

/**
 * Pauli-sum text (grammar in DEVELOPERS.md): coefficients, sparse factors like X0 Y3 or dense words
 * like XIZY, and the joining signs.
 */
export const pauliStreamParser: StreamParser<Record<string, never>> = {
  name: "pauli-sum",
  startState: () => ({}),
  token(stream) {
    if (stream.eatSpace()) return null;
    if (stream.match("#") || stream.match("//")) {
      stream.skipToEnd();
      return "comment";
    }
    if (stream.match(/^(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?j?/)) return "number";
    if (stream.match(/^[XYZ]\d+/)) return "variableName.standard";
    if (stream.match(/^I\d*/)) return "atom";
    if (stream.match(/^[IXYZ]+(?![\w])/)) return "variableName.standard";
    if (stream.match(/^[-+*]/)) return "operator";
    if (stream.match(/^[()]/)) return "punctuation";
    stream.next();
    return "invalid";
  },
};

export const pauliLanguage = StreamLanguage.define(pauliStreamParser);
