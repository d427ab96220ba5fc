// The grammar as a Chevrotain CST parser. It is deliberately permissive: every line is an item
// (`word values... { block }?`), and what does not fit is kept as a `junk` node, so that one typo
// costs one diagnostic and the builder (build-tree.ts) can say precisely what is wrong.
import { CstParser, type IToken } from "chevrotain";
import {
  ALL_TOKENS,
  Comma,
  CompoundUnit,
  Cross,
  Dot,
  DotDot,
  Identifier,
  LCurly,
  LineToken,
  LParen,
  NewLine,
  NonWord,
  NumberLiteral,
  RCurly,
  RParen,
  Semicolon,
  StrayStart,
  StringLiteral,
  UnclosedString,
} from "./tokens";
import { DECLARATION_KEYWORDS } from "./keywords";
import { isUnitSymbol } from "../units/unit-table";
import { pastDeadline } from "../stop";

/** Blocks nest: the file (0) holds the arm, the arm's body (1) holds declarations, a declaration's
 * body (2) holds properties. */
const DECLARATION_BODY_DEPTH = 2;
/** The language nests two blocks deep; past this, braces are left unparsed (one error) rather
 * than recursing until the stack runs out on pathological input. */
const MAX_NESTING = 64;

const DECLARATION_STARTERS: ReadonlySet<string> = new Set([...DECLARATION_KEYWORDS, "arm"]);

/** Thrown out of the grammar when the analysis it reads for is cancelled or out of time (stop.ts):
 * parse() ends with an empty tree marked as stopped. */
export class ParseStopped extends Error {}

/** Rules entered between two looks at the clock: a look costs a clock read, a rule a few dozen
 * token tests. */
const RULES_PER_CLOCK_LOOK = 256;

export class ArmGrammar extends CstParser {
  /** Open blocks at the current position (reset with each input). */
  private depth = 0;
  /** Rules entered since the last look at the clock. */
  private sinceLook = 0;

  /** `validate`: run Chevrotain's grammar validations (ambiguities, left recursion), which
   * throw on a faulty grammar. The tests do (test/syntax/definitions.test.ts); the server and
   * the command skip them, since they cost tens of milliseconds at every start. */
  constructor(validate = false) {
    // Node locations let the tree builder take spans without walking every node's tokens.
    super(ALL_TOKENS, {
      recoveryEnabled: true,
      maxLookahead: 3,
      nodeLocationTracking: "onlyOffset",
      skipValidations: !validate,
    });
    this.performSelfAnalysis();
  }

  resetDepth(): void {
    this.depth = 0;
    this.sinceLook = 0;
  }

  /** A long text is read cooperatively: now and then, the running analysis's stop is asked. */
  private lookAtClock(): void {
    this.ACTION(() => {
      if (++this.sinceLook < RULES_PER_CLOCK_LOOK) return;
      this.sinceLook = 0;
      if (pastDeadline()) throw new ParseStopped("stopped");
    });
  }

  /** A line inside a declaration's body that starts a new declaration (`link arm2 {`, `require {`)
   * means the body's closing brace is missing: end the body there instead of swallowing the rest. */
  private startsDeclarationLine(): boolean {
    const first = this.LA(1);
    if (first.tokenType !== Identifier || !DECLARATION_STARTERS.has(first.image)) return false;
    const second = this.LA(2);
    if (second.tokenType === LCurly) return true;
    const third = this.LA(3);
    return (
      (second.tokenType === Identifier || second.tokenType === StringLiteral) && third.tokenType === LCurly
    );
  }

  private isUnitWord(token: IToken): boolean {
    return token.tokenType === CompoundUnit || (token.tokenType === Identifier && isUnitSymbol(token.image));
  }

  public document = this.RULE("document", () => {
    this.MANY(() => {
      this.OR([
        { ALT: () => this.CONSUME(NewLine) },
        { ALT: () => this.CONSUME(Semicolon) },
        { ALT: () => this.CONSUME(RCurly) },
        { ALT: () => this.SUBRULE(this.item) },
        { GATE: () => this.depth < MAX_NESTING, ALT: () => this.SUBRULE(this.block) },
        { ALT: () => this.SUBRULE(this.strayLine) },
      ]);
    });
  });

  /** `{ ... }`; the closing brace may be missing (the builder reports it). */
  public block = this.RULE("block", () => {
    this.CONSUME(LCurly);
    this.ACTION(() => this.depth++);
    this.SUBRULE(this.body);
    this.ACTION(() => this.depth--);
    this.OPTION(() => this.CONSUME(RCurly));
  });

  public body = this.RULE("body", () => {
    this.MANY({
      GATE: () => !(this.depth >= DECLARATION_BODY_DEPTH && this.startsDeclarationLine()),
      DEF: () => {
        this.OR([
          { ALT: () => this.CONSUME(NewLine) },
          { ALT: () => this.CONSUME(Semicolon) },
          { ALT: () => this.SUBRULE(this.item) },
          { GATE: () => this.depth < MAX_NESTING, ALT: () => this.SUBRULE(this.block) },
          { ALT: () => this.SUBRULE(this.strayLine) },
        ]);
      },
    });
  });

  /** A property (`key values`) or, with a block, a declaration (`keyword name { }`). */
  public item = this.RULE("item", () => {
    this.lookAtClock();
    this.CONSUME(Identifier);
    this.MANY(() => this.SUBRULE(this.value));
    this.OPTION(() => this.SUBRULE(this.junk));
    this.OPTION2({ GATE: () => this.depth < MAX_NESTING, DEF: () => this.SUBRULE(this.block) });
  });

  /** A line that starts with something other than a word. */
  public strayLine = this.RULE("strayLine", () => {
    this.CONSUME(NonWord);
    this.MANY(() => this.CONSUME(LineToken));
  });

  /** The rest of a line that fits nothing. */
  public junk = this.RULE("junk", () => {
    this.CONSUME(StrayStart);
    this.MANY(() => this.CONSUME(LineToken));
  });

  public value = this.RULE("value", () => {
    this.lookAtClock();
    this.OR([
      { ALT: () => this.SUBRULE(this.quantityForm) },
      { ALT: () => this.SUBRULE(this.pointForm) },
      { ALT: () => this.SUBRULE(this.reference) },
      { ALT: () => this.CONSUME(StringLiteral) },
      { ALT: () => this.CONSUME(UnclosedString) },
    ]);
  });

  /** A quantity, a range `lo .. hi` or dims `a x b`; the second quantity may be missing. */
  public quantityForm = this.RULE("quantityForm", () => {
    this.SUBRULE(this.quantity);
    this.OPTION(() => {
      this.OR([
        {
          ALT: () => {
            this.CONSUME(DotDot);
            this.OPTION2(() => this.SUBRULE2(this.quantity));
          },
        },
        {
          ALT: () => {
            this.CONSUME(Cross);
            this.OPTION3(() => this.SUBRULE3(this.quantity));
          },
        },
      ]);
    });
  });

  /** A point, or a region `(x1, y1) .. (x2, y2)`; the second point may be missing. */
  public pointForm = this.RULE("pointForm", () => {
    this.SUBRULE(this.point);
    this.OPTION(() => this.SUBRULE(this.regionTail));
  });

  /** `.. (x2, y2)` after a point (also after an inline point: `anchor (x1, y1) .. (x2, y2)`). */
  public regionTail = this.RULE("regionTail", () => {
    this.CONSUME(DotDot);
    this.OPTION(() => this.SUBRULE(this.point));
  });

  public quantity = this.RULE("quantity", () => {
    this.CONSUME(NumberLiteral);
    this.OPTION({
      GATE: () => this.isUnitWord(this.LA(1)),
      DEF: () => {
        this.OR([{ ALT: () => this.CONSUME(CompoundUnit) }, { ALT: () => this.CONSUME(Identifier) }]);
      },
    });
  });

  /** `(x, y)` or `(x, y, z)`; every part may be missing (the builder reports which). */
  public point = this.RULE("point", () => {
    this.CONSUME(LParen);
    this.OPTION(() => this.SUBRULE(this.quantity));
    this.OPTION2(() => this.CONSUME(Comma));
    this.OPTION3(() => this.SUBRULE2(this.quantity));
    this.OPTION5(() => {
      this.CONSUME2(Comma);
      this.OPTION6(() => this.SUBRULE3(this.quantity));
    });
    this.OPTION4(() => this.CONSUME(RParen));
  });

  /** `name`, `body.point`, `body(x, y)`; a trailing dot without a name is kept for the message. */
  public reference = this.RULE("reference", () => {
    this.CONSUME(Identifier);
    this.MANY(() => {
      this.CONSUME(Dot);
      this.OPTION(() => this.CONSUME2(Identifier));
    });
    this.OPTION2(() => {
      this.SUBRULE(this.point);
      this.OPTION3(() => this.SUBRULE(this.regionTail));
    });
  });
}

/** One parser instance, reused: parse() resets its input. */
export const armGrammar = new ArmGrammar();
