// Mutations for the fuzzer: token-level edits that make a valid spec nearly valid (delete,
// duplicate, swap tokens, drop braces, wrong-dimension units, extreme numbers) and byte-level
// edits of whole files (inserts and deletes of arbitrary characters incl. unicode, CR, NUL, tabs).
import fc from "fast-check";
import { ALL_UNITS } from "./spec-arbitrary";

/** Splits text into tokens such that joining them gives the text back. */
export function tokenize(text: string): string[] {
  return (
    text.match(
      /\s+|#[^\r\n]*|"[^"\r\n]*"?|[A-Za-z_][A-Za-z0-9_]*(?:[*/^][A-Za-z0-9_]+)*|[-+]?\d[\d.]*(?:[eE][-+]?\d+)?|\.\.|[^\s]/g,
    ) ?? []
  );
}

const isSpace = (t: string) => /^\s+$/.test(t);
const isNumber = (t: string) => /^[-+]?\d/.test(t);
const isUnit = (t: string) => ALL_UNITS.includes(t);

/** Numbers that sit at the edges of what a double or a parser can hold, or only look numeric. */
export const EXTREME_NUMBERS = [
  "0",
  "-0",
  "-1",
  "1e300",
  "-1e300",
  "1e-300",
  "1e309",
  "5e-324",
  "NaN",
  "Infinity",
  "-Infinity",
  "1e",
  "1e+",
  ".5",
  "5.",
  "1.2.3",
  "0x10",
  "1_000",
  "99999999999999999999999",
  "00012",
  "-",
  "+3",
  "1e-7",
  "3.4028236e38",
];

/** Words the language knows plus a few it does not: replacing a token with one of these keeps
 * the text close to valid. */
export const NEAR_WORDS = [
  "arm",
  "base",
  "link",
  "joint",
  "parallelogram",
  "spring",
  "payload",
  "require",
  "sweep",
  "material",
  "connects",
  "to",
  "and",
  "at",
  "on",
  "between",
  "range",
  "fixed",
  "angle",
  "length",
  "spacing",
  "rate",
  "mass",
  "point",
  "extension",
  "zero_length",
  "elastic",
  "gas",
  "torsion",
  "x",
  "rect",
  "tube",
  "rod",
  "steps",
  "grid",
  "..",
  "{",
  "}",
  "(",
  ")",
  ",",
  ";",
  '"',
  "#",
  ".",
  "end",
  "start",
  "head",
  "lower",
  "upper",
  "undefined",
  "__proto__",
  "constructor",
  "toString",
  "hasOwnProperty",
  "NaN",
];

export type TokenMutation =
  | { op: "delete"; at: number }
  | { op: "duplicate"; at: number }
  | { op: "swap"; at: number; with: number }
  | { op: "drop-brace"; at: number }
  | { op: "wrong-unit"; at: number; unit: number }
  | { op: "extreme-number"; at: number; pick: number }
  | { op: "replace-word"; at: number; pick: number }
  | { op: "insert-word"; at: number; pick: number };

const frac = fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true });

export const tokenMutationArb: fc.Arbitrary<TokenMutation> = fc.oneof(
  fc.record({ op: fc.constant("delete" as const), at: frac }),
  fc.record({ op: fc.constant("duplicate" as const), at: frac }),
  fc.record({ op: fc.constant("swap" as const), at: frac, with: frac }),
  fc.record({ op: fc.constant("drop-brace" as const), at: frac }),
  fc.record({ op: fc.constant("wrong-unit" as const), at: frac, unit: fc.nat() }),
  fc.record({ op: fc.constant("extreme-number" as const), at: frac, pick: fc.nat() }),
  fc.record({ op: fc.constant("replace-word" as const), at: frac, pick: fc.nat() }),
  fc.record({ op: fc.constant("insert-word" as const), at: frac, pick: fc.nat() }),
);

/** Index of the `at`-th token (as a fraction) among those that pass `keep`, or -1. */
function pickIndex(tokens: string[], at: number, keep: (t: string) => boolean): number {
  const candidates: number[] = [];
  tokens.forEach((t, i) => {
    if (keep(t)) candidates.push(i);
  });
  if (candidates.length === 0) return -1;
  return candidates[Math.floor(at * candidates.length)]!;
}

export function applyTokenMutation(tokens: string[], m: TokenMutation): void {
  const solid = (t: string) => !isSpace(t);
  switch (m.op) {
    case "delete": {
      const i = pickIndex(tokens, m.at, solid);
      if (i >= 0) tokens.splice(i, 1);
      break;
    }
    case "duplicate": {
      const i = pickIndex(tokens, m.at, solid);
      if (i >= 0) tokens.splice(i, 0, tokens[i]!, " ");
      break;
    }
    case "swap": {
      const i = pickIndex(tokens, m.at, solid);
      const j = pickIndex(tokens, m.with, solid);
      if (i >= 0 && j >= 0) [tokens[i], tokens[j]] = [tokens[j]!, tokens[i]!];
      break;
    }
    case "drop-brace": {
      const i = pickIndex(tokens, m.at, (t) => t === "{" || t === "}");
      if (i >= 0) tokens.splice(i, 1);
      break;
    }
    case "wrong-unit": {
      const i = pickIndex(tokens, m.at, isUnit);
      if (i >= 0) tokens[i] = ALL_UNITS[m.unit % ALL_UNITS.length]!;
      break;
    }
    case "extreme-number": {
      const i = pickIndex(tokens, m.at, isNumber);
      if (i >= 0) tokens[i] = EXTREME_NUMBERS[m.pick % EXTREME_NUMBERS.length]!;
      break;
    }
    case "replace-word": {
      const i = pickIndex(tokens, m.at, solid);
      if (i >= 0) tokens[i] = NEAR_WORDS[m.pick % NEAR_WORDS.length]!;
      break;
    }
    case "insert-word": {
      const i = Math.floor(m.at * (tokens.length + 1));
      tokens.splice(i, 0, " ", NEAR_WORDS[m.pick % NEAR_WORDS.length]!, " ");
      break;
    }
  }
}

export function mutateTokens(text: string, mutations: readonly TokenMutation[]): string {
  const tokens = tokenize(text);
  for (const m of mutations) applyTokenMutation(tokens, m);
  return tokens.join("");
}

/** Characters that trip up lexers and offset arithmetic: NUL, CR alone, tabs, BOM, line and
 * paragraph separators, lone surrogate halves, astral characters, combining marks. */
const NASTY_CHARS = [
  "\0",
  "\r",
  "\n",
  "\r\n",
  "\t",
  "\v",
  "\f",
  "\ufeff",
  "\u00a0",
  "\u2028",
  "\u2029",
  "\ud800",
  "\udfff",
  "\u{1F600}",
  "e\u0301",
  "\u200b",
  "\u202e",
  "\uffff",
  "ä",
  "µ",
  "°",
  "×",
  "−",
  "{",
  "}",
  "(",
  ")",
  "..",
  ";",
  ",",
  '"',
  "#",
  ".",
  "^",
  "*",
  "/",
  "-",
  "e",
  "9",
];

const chunkArb: fc.Arbitrary<string> = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...NASTY_CHARS) },
  { weight: 2, arbitrary: fc.string({ maxLength: 6 }) },
  { weight: 1, arbitrary: fc.string({ unit: "binary", maxLength: 4 }) },
  {
    weight: 1,
    arbitrary: fc.array(fc.constantFrom(...NASTY_CHARS), { maxLength: 5 }).map((a) => a.join("")),
  },
);

export type ByteMutation =
  | { op: "insert"; at: number; chunk: string }
  | { op: "delete"; at: number; count: number }
  | { op: "replace"; at: number; chunk: string };

export const byteMutationArb: fc.Arbitrary<ByteMutation> = fc.oneof(
  fc.record({ op: fc.constant("insert" as const), at: frac, chunk: chunkArb }),
  fc.record({ op: fc.constant("delete" as const), at: frac, count: fc.integer({ min: 1, max: 40 }) }),
  fc.record({ op: fc.constant("replace" as const), at: frac, chunk: chunkArb }),
);

export function mutateBytes(text: string, mutations: readonly ByteMutation[]): string {
  let t = text;
  for (const m of mutations) {
    const i = Math.floor(m.at * (t.length + 1));
    if (m.op === "insert") t = t.slice(0, i) + m.chunk + t.slice(i);
    else if (m.op === "delete") t = t.slice(0, i) + t.slice(i + m.count);
    else t = t.slice(0, i) + m.chunk + t.slice(i + m.chunk.length);
  }
  return t;
}

/** Nearly-valid specs: a valid spec with 1 to 4 token mutations. */
export function nearlyValidArb(valid: fc.Arbitrary<string>): fc.Arbitrary<string> {
  return fc
    .tuple(valid, fc.array(tokenMutationArb, { minLength: 1, maxLength: 4 }))
    .map(([t, ms]) => mutateTokens(t, ms));
}

/** Byte-level mutants of the given sample texts. */
export function byteMutantArb(samples: readonly string[]): fc.Arbitrary<string> {
  return fc
    .tuple(fc.constantFrom(...samples), fc.array(byteMutationArb, { minLength: 1, maxLength: 8 }))
    .map(([t, ms]) => mutateBytes(t, ms));
}

/** Texts that are not specs at all, or degenerate ones. */
export const junkArb: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    "",
    " ",
    "\n",
    "\r",
    "\0",
    "arm",
    "arm {",
    'arm "',
    'arm "x" {',
    "}",
    "{{{{",
    'arm "a" {}\narm "b" {}',
    "#",
    "# only a comment",
    '\ufeffarm "x" {}',
    'arm "x" { base b { point p (1e309 mm, NaN mm) } }',
  ),
  fc.string({ maxLength: 200 }),
  fc.string({ unit: "binary", maxLength: 100 }),
  fc
    .array(fc.constantFrom(...NEAR_WORDS, ...ALL_UNITS, ...EXTREME_NUMBERS, " ", "\n"), { maxLength: 80 })
    .map((a) => a.join(" ")),
);
