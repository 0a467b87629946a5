/**
 * Token vocabulary of Ketwise's OpenQASM front end (chevrotain lexers).
 *
 * One parser serves both dialects; each dialect has its own lexer, which decides
 * which words are keywords:
 * - OpenQASM 2.0 (Cross et al., arXiv:1707.03429): OPENQASM, include, qreg, creg, gate,
 *   opaque, barrier, measure, reset, if. `U`, `CX`, `pi` and the functions are plain
 *   identifiers resolved later, so `qubit` or `input` stay ordinary names there.
 * - OpenQASM 3 (live specification): additionally qubit, bit, input, float, angle, const,
 *   int, uint, for, in, the gate modifiers ctrl, negctrl, inv, pow, and the reserved words
 *   of features outside Ketwise's subset (while, def, …), which the parser turns into a
 *   clear "not supported" error instead of a vague syntax error.
 */
import { createToken, Lexer, type TokenType } from "chevrotain";

function charRange(from: number, to: number): string[] {
  return Array.from({ length: to - from + 1 }, (_, i) => String.fromCharCode(from + i));
}

export const Identifier = createToken({
  name: "Identifier",
  label: "a name",
  // ASCII names; Latin-1/Latin Extended letters, Greek letters (θ, π) and ℇ are OpenQASM 3 only
  // (the OpenQASM 2.0 lexer uses AsciiIdentifier instead).
  pattern:
    /[A-Za-z_\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u024F\u0370-\u03FF\u2107][A-Za-z0-9_\u00C0-\u00D6\u00D8-\u00F6\u00F8-\u024F\u0370-\u03FF\u2107]*/,
  start_chars_hint: [
    ..."abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ_",
    ...charRange(0xc0, 0xd6),
    ...charRange(0xd8, 0xf6),
    ...charRange(0xf8, 0x24f),
    ...charRange(0x370, 0x3ff),
    "\u2107",
  ],
});

/** OpenQASM 2.0 names (ASCII only); categorised as Identifier so the parser sees one type. */
export const AsciiIdentifier = createToken({
  name: "AsciiIdentifier",
  label: "a name",
  pattern: /[A-Za-z_][A-Za-z0-9_]*/,
  categories: [Identifier],
});

let keywordCount = 0;
function keyword(word: string, longerAlt: TokenType, categories: TokenType[] = []): TokenType {
  keywordCount += 1;
  return createToken({
    name: `Kw_${word}_${keywordCount}`,
    label: `'${word}'`,
    pattern: new RegExp(word),
    longer_alt: longerAlt,
    categories,
  });
}

/** Reserved OpenQASM 3 words of features Ketwise does not simulate. */
export const UnsupportedKeyword = createToken({ name: "UnsupportedKeyword", pattern: Lexer.NA });

const UNSUPPORTED_WORDS = [
  "while",
  "if",
  "else",
  "def",
  "defcal",
  "defcalgrammar",
  "cal",
  "let",
  "bool",
  "complex",
  "duration",
  "stretch",
  "delay",
  "box",
  "output",
  "extern",
  "return",
  "break",
  "continue",
  "switch",
  "case",
  "default",
  "array",
  "durationof",
  "sizeof",
  "opaque",
  "end",
  "true",
  "false",
  "readonly",
  "mutable",
  "void",
] as const;

// Category tokens consumed by the parser (chevrotain matches a token by its categories);
// each dialect's lexer produces its own keyword token in that category.
export const Openqasm = createToken({ name: "Openqasm", label: "'OPENQASM'", pattern: Lexer.NA });
export const Include = createToken({ name: "Include", label: "'include'", pattern: Lexer.NA });
export const Qreg = createToken({ name: "Qreg", label: "'qreg'", pattern: Lexer.NA });
export const Creg = createToken({ name: "Creg", label: "'creg'", pattern: Lexer.NA });
export const Gate = createToken({ name: "Gate", label: "'gate'", pattern: Lexer.NA });
export const Barrier = createToken({ name: "Barrier", label: "'barrier'", pattern: Lexer.NA });
export const Measure = createToken({ name: "Measure", label: "'measure'", pattern: Lexer.NA });
export const Reset = createToken({ name: "Reset", label: "'reset'", pattern: Lexer.NA });

// Keywords common to both dialects, built once per identifier flavour.
function commonKeywords(id: TokenType): TokenType[] {
  return [
    keyword("OPENQASM", id, [Openqasm]),
    keyword("include", id, [Include]),
    keyword("qreg", id, [Qreg]),
    keyword("creg", id, [Creg]),
    keyword("gate", id, [Gate]),
    keyword("barrier", id, [Barrier]),
    keyword("measure", id, [Measure]),
    keyword("reset", id, [Reset]),
  ];
}

const kw2 = commonKeywords(AsciiIdentifier);
const kw3 = commonKeywords(Identifier);

// OpenQASM 2.0 only.
export const Opaque = keyword("opaque", AsciiIdentifier);
export const If = keyword("if", AsciiIdentifier);

// OpenQASM 3 only.
export const Qubit = keyword("qubit", Identifier);
export const Bit = keyword("bit", Identifier);
export const Input = keyword("input", Identifier);
export const Float = keyword("float", Identifier);
export const Angle = keyword("angle", Identifier);
export const Const = keyword("const", Identifier);
export const Int = keyword("int", Identifier);
export const Uint = keyword("uint", Identifier);
export const For = keyword("for", Identifier);
export const In = keyword("in", Identifier);
export const Ctrl = keyword("ctrl", Identifier);
export const Negctrl = keyword("negctrl", Identifier);
export const Inv = keyword("inv", Identifier);
/** `pow(k) @` modifier; in expressions `pow(a, b)` stays the power function. */
export const Pow = keyword("pow", Identifier);
// Order matters: a keyword that is a prefix of another ("in" of "int", "inv", "input") comes after it.
const qasm3Words = [
  Qubit,
  Bit,
  Input,
  Float,
  Angle,
  Const,
  Uint,
  Int,
  Inv,
  In,
  For,
  Negctrl,
  Ctrl,
  Pow,
];
// Longest first, so that `defcal` is not lexed as `def` + longer name.
const unsupportedTokens = [...UNSUPPORTED_WORDS]
  .sort((a, b) => b.length - a.length)
  .map((w) => keyword(w, Identifier, [UnsupportedKeyword]));
/** `#pragma …` lines and `@annotation`s (OpenQASM 3), rejected by the parser. */
export const Pragma = createToken({
  name: "Pragma",
  label: "a pragma",
  pattern: /#pragma[^\n\r]*/,
});
const ANNOTATION = /@[A-Za-z_][A-Za-z0-9_.]*/y;
/**
 * `@keyword …` at the start of a statement (after ';', '{', '}' or the program start). After
 * a gate modifier (`ctrl @x q;`) the '@' is the modifier separator and the name a gate.
 */
export const Annotation = createToken({
  name: "Annotation",
  label: "an annotation",
  line_breaks: false,
  start_chars_hint: ["@"],
  pattern: {
    exec: (text: string, offset: number): RegExpExecArray | null => {
      let i = offset - 1;
      while (i >= 0 && /\s/.test(text[i])) i--;
      if (i >= 0 && !";{}/".includes(text[i])) return null;
      ANNOTATION.lastIndex = offset;
      return ANNOTATION.exec(text);
    },
  },
});
/** Physical qubit `$3` (OpenQASM 3), rejected by the parser. */
export const HardwareQubit = createToken({
  name: "HardwareQubit",
  label: "a physical qubit",
  pattern: /\$[0-9]+/,
});
export const Colon = createToken({ name: "Colon", label: "':'", pattern: /:/ });
export const At = createToken({ name: "At", label: "'@'", pattern: /@/ });

// Literals and punctuation (both dialects).
export const Real = createToken({
  name: "Real",
  label: "a number",
  pattern: /(?:[0-9]+\.[0-9]*|\.[0-9]+)(?:[eE][+-]?[0-9]+)?|[0-9]+[eE][+-]?[0-9]+/,
});
export const Integer = createToken({ name: "Integer", label: "an integer", pattern: /[0-9]+/ });
export const StringLiteral = createToken({
  name: "StringLiteral",
  label: "a file name in quotes",
  pattern: /"[^"\n\r]*"|'[^'\n\r]*'/,
});
export const Arrow = createToken({ name: "Arrow", label: "'->'", pattern: /->/ });
export const EqEq = createToken({ name: "EqEq", label: "'=='", pattern: /==/ });
export const Equals = createToken({ name: "Equals", label: "'='", pattern: /=/ });
export const DoubleStar = createToken({ name: "DoubleStar", label: "'**'", pattern: /\*\*/ });
export const Star = createToken({ name: "Star", label: "'*'", pattern: /\*/ });
export const Slash = createToken({ name: "Slash", label: "'/'", pattern: /\// });
export const Plus = createToken({ name: "Plus", label: "'+'", pattern: /\+/ });
export const Minus = createToken({ name: "Minus", label: "'-'", pattern: /-/ });
export const Caret = createToken({ name: "Caret", label: "'^'", pattern: /\^/ });
export const LParen = createToken({ name: "LParen", label: "'('", pattern: /\(/ });
export const RParen = createToken({ name: "RParen", label: "')'", pattern: /\)/ });
export const LBracket = createToken({ name: "LBracket", label: "'['", pattern: /\[/ });
export const RBracket = createToken({ name: "RBracket", label: "']'", pattern: /]/ });
export const LBrace = createToken({ name: "LBrace", label: "'{'", pattern: /{/ });
export const RBrace = createToken({ name: "RBrace", label: "'}'", pattern: /}/ });
export const Semicolon = createToken({ name: "Semicolon", label: "';'", pattern: /;/ });
export const Comma = createToken({ name: "Comma", label: "','", pattern: /,/ });

export const WhiteSpace = createToken({
  name: "WhiteSpace",
  pattern: /[ \t\r\n\f\v\u00A0\uFEFF]+/,
  group: Lexer.SKIPPED,
  line_breaks: true,
});
export const LineComment = createToken({
  name: "LineComment",
  pattern: /\/\/[^\n\r]*/,
  group: Lexer.SKIPPED,
});
export const BlockComment = createToken({
  name: "BlockComment",
  pattern: /\/\*[\s\S]*?\*\//,
  group: Lexer.SKIPPED,
  line_breaks: true,
});

const punctuation = [
  Real,
  Integer,
  StringLiteral,
  Arrow,
  EqEq,
  Equals,
  DoubleStar,
  Star,
  Slash,
  Plus,
  Minus,
  Caret,
  LParen,
  RParen,
  LBracket,
  RBracket,
  LBrace,
  RBrace,
  Semicolon,
  Comma,
];

/** Token order of the OpenQASM 2.0 lexer (comments before '/', keywords before names). */
export const qasm2LexerTokens: TokenType[] = [
  WhiteSpace,
  LineComment,
  BlockComment,
  ...kw2,
  Opaque,
  If,
  AsciiIdentifier,
  ...punctuation,
];

/** Token order of the OpenQASM 3 lexer. */
export const qasm3LexerTokens: TokenType[] = [
  WhiteSpace,
  LineComment,
  BlockComment,
  Pragma,
  Annotation,
  HardwareQubit,
  ...kw3,
  ...qasm3Words,
  ...unsupportedTokens,
  Identifier,
  Colon,
  At,
  ...punctuation,
];

/** Every token type the shared parser knows (categories included). */
export const allTokens: TokenType[] = [
  WhiteSpace,
  LineComment,
  BlockComment,
  Pragma,
  Annotation,
  HardwareQubit,
  Openqasm,
  Include,
  Qreg,
  Creg,
  Gate,
  Barrier,
  Measure,
  Reset,
  UnsupportedKeyword,
  ...kw2,
  ...kw3,
  Opaque,
  If,
  ...qasm3Words,
  ...unsupportedTokens,
  AsciiIdentifier,
  Identifier,
  Colon,
  At,
  ...punctuation,
];

let lexers: { qasm2: Lexer; qasm3: Lexer } | null = null;

/** The two lexers, built once on first use. */
export function getLexers(): { qasm2: Lexer; qasm3: Lexer } {
  lexers ??= {
    qasm2: new Lexer(qasm2LexerTokens, { positionTracking: "full", ensureOptimizations: false }),
    qasm3: new Lexer(qasm3LexerTokens, { positionTracking: "full", ensureOptimizations: false }),
  };
  return lexers;
}
