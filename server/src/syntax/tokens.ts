// Every token of the arm-spec language, in the order the lexer tries them (first match wins, so
// longer or more specific patterns come before the ones they would otherwise lose to).
import { createToken, Lexer, type TokenType } from "chevrotain";

/** Category of every token that may appear inside a line (not newline, `;` or braces): lets the
 * grammar swallow the rest of a bad line as one piece. */
export const LineToken = createToken({ name: "LineToken", pattern: Lexer.NA });
/** Category of the line tokens that cannot start an item or a value: where one appears, the rest
 * of the line is junk. */
/** Category of the line tokens other than words: a line that starts with one is not an item. */
export const NonWord = createToken({ name: "NonWord", pattern: Lexer.NA, categories: [LineToken] });
export const StrayStart = createToken({ name: "StrayStart", pattern: Lexer.NA, categories: [NonWord] });

export const NewLine = createToken({ name: "NewLine", pattern: /\r\n|\r|\n/, line_breaks: true });
export const WhiteSpace = createToken({
  name: "WhiteSpace",
  pattern: /[ \t\f\v\u00A0\uFEFF]+/,
  group: Lexer.SKIPPED,
});
export const Comment = createToken({ name: "Comment", pattern: /#[^\r\n]*/, group: "comments" });
export const StringLiteral = createToken({
  name: "StringLiteral",
  pattern: /"(?:[^"\\\r\n]|\\.)*"/,
  categories: [NonWord],
});
/** A string whose closing quote is missing before the end of the line. */
export const UnclosedString = createToken({
  name: "UnclosedString",
  pattern: /"(?:[^"\\\r\n]|\\.)*\\?/,
  categories: [NonWord],
});
export const LCurly = createToken({ name: "LCurly", pattern: /\{/ });
export const RCurly = createToken({ name: "RCurly", pattern: /\}/ });
export const LParen = createToken({ name: "LParen", pattern: /\(/, categories: [NonWord] });
export const RParen = createToken({ name: "RParen", pattern: /\)/, categories: [StrayStart] });
export const Comma = createToken({ name: "Comma", pattern: /,/, categories: [StrayStart] });
export const Semicolon = createToken({ name: "Semicolon", pattern: /;/ });
/** `..` before Number, so that `1..2` reads as 1, `..`, 2. */
export const DotDot = createToken({ name: "DotDot", pattern: /\.\./, categories: [StrayStart] });
/** A decimal number, optionally signed, with an optional exponent: `-40`, `0.35`, `.5`, `2.1e9`.
 * A decimal point needs a digit after it, so `1..2` is a range. */
export const NumberLiteral = createToken({
  name: "NumberLiteral",
  pattern: /[-+]?(?:\d+(?:\.\d+)?|\.\d+)(?:[eE][-+]?\d+)?/,
  categories: [NonWord],
});
export const Dot = createToken({ name: "Dot", pattern: /\./, categories: [StrayStart] });
/** A unit built with `*`, `/` or `^` (`N/mm`, `m/s^2`, `lbf*in/deg`, `mm^2`). Written without
 * spaces; a plain word such as `mm` lexes as an Identifier and becomes a unit by position. */
export const CompoundUnit = createToken({
  name: "CompoundUnit",
  pattern:
    /[A-Za-z_][A-Za-z0-9_]*(?:\^[-+]?\d+(?:[*/][A-Za-z_][A-Za-z0-9_]*(?:\^[-+]?\d+)?)*|(?:[*/][A-Za-z_][A-Za-z0-9_]*(?:\^[-+]?\d+)?)+)/,
  categories: [StrayStart],
});
/** Any word: names, keys, keywords, enumerated choices, unit symbols. Letters beyond ASCII lex as
 * part of a word so the model can say the name is not allowed (instead of a cascade of errors). */
export const Identifier = createToken({
  name: "Identifier",
  pattern:
    /[A-Za-z_\u00C0-\u00D6\u00D8-\u00F6\u00F8-\uFFFF][A-Za-z0-9_\u00C0-\u00D6\u00D8-\u00F6\u00F8-\uFFFF]*/,
  categories: [LineToken],
});
/** `x` between two quantities (`20 mm x 6 mm`); the multiplication sign is accepted too. A word
 * that merely starts with x (`xmax`) stays an Identifier. */
export const Cross = createToken({
  name: "Cross",
  pattern: /x|\u00D7/,
  longer_alt: Identifier,
  categories: [StrayStart],
});

/** In lexing order. */
export const ALL_TOKENS: TokenType[] = [
  LineToken,
  NonWord,
  StrayStart,
  NewLine,
  WhiteSpace,
  Comment,
  StringLiteral,
  UnclosedString,
  LCurly,
  RCurly,
  LParen,
  RParen,
  Comma,
  Semicolon,
  DotDot,
  NumberLiteral,
  Dot,
  CompoundUnit,
  Cross,
  Identifier,
];

/** The lexer's options. Its validations (empty or overlapping patterns) run in the tests
 * (test/syntax/definitions.test.ts), not at every start of the server and the command: they cost
 * tens of milliseconds of each `poise` run and find nothing new in a lexer that does not change. */
export const LEXER_OPTIONS = { positionTracking: "full", ensureOptimizations: false } as const;

export const armLexer = new Lexer(ALL_TOKENS, { ...LEXER_OPTIONS, skipValidations: true });
