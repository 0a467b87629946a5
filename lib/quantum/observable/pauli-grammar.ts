/**
 * Chevrotain grammar of the Pauli-sum text. It only checks the shape
 * (signs, coefficients, words) and returns the raw tokens of each term; the
 * analyser (`pauli-parse.ts`) turns them into masks and gives the specific errors.
 */
import { EmbeddedActionsParser, type IToken } from "chevrotain";
import { Coefficient, Minus, Plus, Star, Word, pauliTokens } from "./pauli-lexer";

export interface RawTerm {
  /** The "+"/"-" before the term (absent for a first term without sign). */
  sign?: IToken;
  /** A second sign directly before the coefficient, as in "X0 + -0.5 Z1" (checked by the analyser). */
  innerSign?: IToken;
  /** Any further signs (always rejected). */
  extraSigns: IToken[];
  coefficient?: IToken;
  star?: IToken;
  words: IToken[];
}

class PauliSumGrammar extends EmbeddedActionsParser {
  constructor() {
    super(pauliTokens, { maxLookahead: 2 });
    this.performSelfAnalysis();
  }

  public sum = this.RULE("sum", (): RawTerm[] => {
    const terms: RawTerm[] = [];
    const signs: IToken[] = [];
    this.MANY(() => {
      signs.push(this.OR([{ ALT: () => this.CONSUME(Plus) }, { ALT: () => this.CONSUME(Minus) }]));
    });
    const first = this.SUBRULE(this.term);
    terms.push({ ...first, ...splitSigns(signs) });
    this.MANY2(() => {
      const ops: IToken[] = [];
      this.AT_LEAST_ONE(() => {
        ops.push(
          this.OR2([{ ALT: () => this.CONSUME2(Plus) }, { ALT: () => this.CONSUME2(Minus) }]),
        );
      });
      const t = this.SUBRULE2(this.term);
      terms.push({ ...t, ...splitSigns(ops) });
    });
    return terms;
  });

  private term = this.RULE("term", (): RawTerm => {
    const words: IToken[] = [];
    let coefficient: IToken | undefined;
    let star: IToken | undefined;
    this.OR([
      {
        ALT: () => {
          coefficient = this.CONSUME(Coefficient);
          this.OPTION(() => {
            this.OPTION2(() => {
              star = this.CONSUME(Star);
            });
            this.SUBRULE(this.factors, { ARGS: [words] });
          });
        },
      },
      { ALT: () => this.SUBRULE2(this.factors, { ARGS: [words] }) },
    ]);
    return { coefficient, star, words, extraSigns: [] };
  });

  /** word ([“*”] word)* — factors may be joined by "*" as in "0.5*Z0*Z1". */
  private factors = this.RULE("factors", (words: IToken[]): void => {
    const first = this.CONSUME(Word);
    this.ACTION(() => words.push(first));
    this.MANY(() => {
      this.OPTION(() => this.CONSUME(Star));
      const next = this.CONSUME2(Word);
      this.ACTION(() => words.push(next));
    });
  });
}

/** The first sign is the joining operator; a second one is kept for the analyser; more are extra. */
function splitSigns(signs: IToken[]): Pick<RawTerm, "sign" | "innerSign" | "extraSigns"> {
  return { sign: signs[0], innerSign: signs[1], extraSigns: signs.slice(2) };
}

/** One shared instance (chevrotain parsers are reusable: set `input`, call the rule). */
export const pauliSumGrammar = new PauliSumGrammar();
