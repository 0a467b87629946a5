/**
 * Tokens of the Pauli-sum text (grammar below and in DEVELOPERS.md), built with chevrotain 11.
 *
 *   sum   := [sign] term (sign term)*          sign := "+" | "-" | "−" (U+2212)
 *   term  := coef [["*"] factors] | factors      factors := word (["*"] word)*
 *   coef  := decimal or exponent number (e.g. 2, 0.5, .5, 1e-3, 2.5E+2)
 *   word  := sparse factors "X0 Y3 Z12" / "X0Y3", or one dense word "XIZY"
 *
 * Complex numbers (`0.5j`), NaN/Infinity and unknown words are lexed as their own
 * tokens so the analyser can reject them with a specific message.
 */
import { createToken, Lexer, type TokenType } from "chevrotain";

export const WhiteSpace = createToken({
  name: "WhiteSpace",
  pattern: /[ \t\r\n\f\v]+/,
  group: Lexer.SKIPPED,
  line_breaks: true,
});

/** Category matched by the grammar where a coefficient may stand. */
export const Coefficient = createToken({ name: "Coefficient", pattern: Lexer.NA });
/** Category matched by the grammar where a Pauli word may stand. */
export const Word = createToken({ name: "Word", pattern: Lexer.NA });

/** Any identifier that is not a Pauli word ("foo", "x0", "Xa") — rejected by the analyser. */
export const BadWord = createToken({
  name: "BadWord",
  pattern: /[A-Za-z_][A-Za-z0-9_]*/,
  categories: [Word],
});
export const ImagNumber = createToken({
  name: "ImagNumber",
  pattern: /(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?[ij]/,
  categories: [Coefficient],
});
export const NumberLiteral = createToken({
  name: "NumberLiteral",
  pattern: /(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/,
  categories: [Coefficient],
});
export const NonFinite = createToken({
  name: "NonFinite",
  pattern: /nan|infinity|inf/i,
  longer_alt: BadWord,
  categories: [Coefficient],
});
/** A run of Pauli letters and digits, e.g. "XIZY", "X0", "X0Y3"; refined by the analyser. */
export const PauliWord = createToken({
  name: "PauliWord",
  pattern: /[XYZI][XYZI0-9]*/,
  longer_alt: BadWord,
  categories: [Word],
});
export const Plus = createToken({ name: "Plus", pattern: /\+/ });
export const Minus = createToken({ name: "Minus", pattern: /-|\u2212/ });
export const Star = createToken({ name: "Star", pattern: /\*|\u00d7|\u00b7/ });

export const pauliTokens: TokenType[] = [
  WhiteSpace,
  Coefficient,
  Word,
  ImagNumber,
  NumberLiteral,
  NonFinite,
  PauliWord,
  BadWord,
  Plus,
  Minus,
  Star,
];

export const pauliLexer = new Lexer(pauliTokens, {
  positionTracking: "full",
  ensureOptimizations: false,
});
