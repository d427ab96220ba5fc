// The canonical layout of a spec, computed from its tokens alone (so it keeps every word, even in
// text that does not parse): 2-space indent per block, one property per line, single spaces,
// comments kept where they were (own line or end of line, with the user's spacing before an
// end-of-line comment so aligned comments stay aligned), at most one blank line in a row.
// Formatting its own output changes nothing, and the output stays within a small multiple of the
// input whatever the text (indent depth is capped; see MAX_INDENT_DEPTH).
import { StringLiteral } from "../syntax/tokens";

type Tok =
  | { t: "word"; s: string; glued: boolean; unclosed?: boolean }
  | { t: "open" | "close" | "lparen" | "rparen" | "comma" | "semi" | "range"; s: string; glued: boolean }
  | { t: "comment"; s: string; line: number; glued: boolean; gap: string }
  | { t: "nl"; s: string; glued: boolean };

/** A closed string exactly as the lexer reads one (escapes included), anchored where it starts. */
const CLOSED_STRING = new RegExp((StringLiteral.PATTERN as RegExp).source, "y");

/** Where a string starting at `start` (a `"`) ends, and whether it is closed. A string the lexer
 * does not close is kept to the end of its line, verbatim: the lexer ends an unclosed string
 * there (tokens.ts, UnclosedString), so nothing after it on the line may be re-spaced (a space
 * after a trailing `\` would become an escape) and nothing may be joined onto it. */
function stringEnd(text: string, start: number): { end: number; closed: boolean } {
  CLOSED_STRING.lastIndex = start;
  if (CLOSED_STRING.test(text)) return { end: CLOSED_STRING.lastIndex, closed: true };
  let j = start + 1;
  while (j < text.length && text[j] !== "\n" && text[j] !== "\r") j++;
  return { end: j, closed: false };
}

/** The white space right before position `at` on its line, as written: tabs stay tabs, any other
 * space becomes a plain space (a line or paragraph separator must not reach the output). */
function gapBefore(text: string, at: number): string {
  let k = at;
  while (k > 0 && /[^\S\r\n]/.test(text[k - 1]!)) k--;
  return text.slice(k, at).replace(/[^\t]/g, " ");
}

const SINGLE: Record<string, Tok["t"]> = {
  "{": "open",
  "}": "close",
  "(": "lparen",
  ")": "rparen",
  ",": "comma",
  ";": "semi",
};

function tokenize(text: string): Tok[] {
  const out: Tok[] = [];
  let line = 0;
  let i = 0;
  let glued = false; // no whitespace since the previous token
  while (i < text.length) {
    const c = text[i]!;
    if (c === "\r" || c === "\n") {
      if (c === "\r" && text[i + 1] === "\n") i++;
      out.push({ t: "nl", s: "", glued: false });
      line++;
      i++;
      glued = false;
      continue;
    }
    // Any other white space (tabs, no-break and ideographic spaces, U+2028 ...) separates words;
    // it must be the same set the word scan below stops at, or the scan would not advance.
    if (/\s/.test(c)) {
      i++;
      glued = false;
      continue;
    }
    if (c === "#") {
      let j = i;
      while (j < text.length && text[j] !== "\n" && text[j] !== "\r") j++;
      out.push({
        t: "comment",
        s: text.slice(i, j).trimEnd(),
        line,
        glued,
        gap: glued ? "" : gapBefore(text, i),
      });
      i = j;
      continue;
    }
    if (c === '"') {
      const { end, closed } = stringEnd(text, i);
      out.push({ t: "word", s: text.slice(i, end), glued, ...(closed ? {} : { unclosed: true }) });
      i = end;
      glued = true;
      continue;
    }
    const single = SINGLE[c];
    if (single) {
      out.push({ t: single, s: c, glued } as Tok);
      i++;
      glued = true;
      continue;
    }
    let j = i + 1; // at least one character: the scan always advances
    while (j < text.length && !/[\s{}(),;"#]/.test(text[j]!)) j++;
    // `..` inside a run (`-30deg..45deg`) is the range operator: split it out.
    const run = text.slice(i, j);
    const pieces = run.split(/(\.\.)/).filter((p) => p.length > 0);
    pieces.forEach((p, k) =>
      out.push(
        p === ".."
          ? { t: "range", s: p, glued: k === 0 ? glued : true }
          : { t: "word", s: p, glued: k === 0 ? glued : true },
      ),
    );
    i = j;
    glued = true;
  }
  return out;
}

const INDENT = "  ";
/** The deepest indent the formatter writes. The language nests two levels (a property inside a
 * declaration inside the arm: docs/language.md); deeper nesting is only ever malformed text, e.g.
 * thousands of `{`, where an indent per level would make the output grow with the square of the
 * depth (10,000 `{` gave 100 MB). Lines deeper than this keep this indent. Two levels is also what
 * keeps the output within 8 x the input: a lone `{` or `}` becomes at most 4 spaces, itself and a
 * CRLF, 7 characters for 1. */
const MAX_INDENT_DEPTH = 2;

function indentFor(depth: number): string {
  return INDENT.repeat(Math.min(depth, MAX_INDENT_DEPTH));
}

export function formatSpec(text: string): string {
  const eol = text.includes("\r\n") ? "\r\n" : "\n";
  const lines: {
    depth: number;
    text: string;
    comment?: string;
    gap?: string;
    endsOpen: boolean;
    sourceLine: number;
  }[] = [];
  let depth = 0;
  let parens = 0;
  let current = "";
  let currentLine = 0;
  let prev: Tok | undefined;
  let endsUnclosed = false; // the line so far ends in a string the lexer leaves unclosed
  let blankPending = false;
  let sawNewline = 0; // newlines since the last token: 2 or more make a blank line
  let sourceLine = 0;

  const emit = (lineText: string, endsOpen: boolean, comment?: string, gap?: string) => {
    const isClose = lineText === "}";
    const last = lines[lines.length - 1];
    if (blankPending && last && !last.endsOpen && !isClose)
      lines.push({ depth: 0, text: "", endsOpen: false, sourceLine: -1 });
    blankPending = false;
    lines.push({
      depth,
      text: lineText,
      endsOpen,
      sourceLine: currentLine,
      ...(comment !== undefined ? { comment, gap: gap ?? "" } : {}),
    });
  };
  const endLine = (endsOpen = false) => {
    if (current.length > 0) emit(current, endsOpen);
    current = "";
    prev = undefined;
    endsUnclosed = false;
  };
  const append = (s: string, space: boolean) => {
    if (current.length === 0) currentLine = sourceLine;
    current += current.length > 0 && space ? ` ${s}` : s;
    endsUnclosed = false;
  };

  for (const tok of tokenize(text)) {
    if (tok.t === "nl") {
      sourceLine++;
      // The lexer ends an unclosed string at the end of its line, and the point it was in with it:
      // joining the next line on would make that line string text on the next pass.
      if (endsUnclosed) parens = 0;
      if (parens > 0) continue; // a point written over two lines stays one property
      sawNewline++;
      if (sawNewline >= 2 && lines.length > 0) blankPending = true;
      endLine();
      continue;
    }
    sawNewline = 0;
    switch (tok.t) {
      case "comment": {
        const last = lines[lines.length - 1];
        if (current.length > 0) {
          const code = current;
          current = "";
          prev = undefined;
          endsUnclosed = false;
          emit(code, false, tok.s, tok.gap);
        } else if (last && last.sourceLine === tok.line && last.comment === undefined && last.text !== "") {
          last.comment = tok.s;
          last.gap = tok.gap;
        } else emit("", false, tok.s);
        break;
      }
      case "open":
        append("{", true);
        endLine(true); // the line holding `{` stays at the outer depth
        depth++;
        break;
      case "close":
        endLine();
        depth = Math.max(0, depth - 1);
        parens = 0;
        currentLine = sourceLine;
        emit("}", false);
        prev = undefined;
        break;
      case "semi":
        if (parens > 0) append(";", false);
        else endLine();
        break;
      case "lparen":
        parens++;
        append("(", !(tok.glued && prev?.t === "word"));
        prev = tok;
        break;
      case "rparen":
        parens = Math.max(0, parens - 1);
        append(")", false);
        prev = tok;
        break;
      case "comma":
        append(",", false);
        prev = tok;
        break;
      default:
        append(tok.s, prev?.t !== "lparen");
        if (tok.t === "word" && tok.unclosed) endsUnclosed = true;
        prev = tok;
    }
  }
  endLine();
  const out = lines.map((l) => {
    const body = l.text === "" && l.comment === undefined ? "" : indentFor(l.depth) + l.text;
    if (l.comment === undefined) return body;
    // The user's spacing before an end-of-line comment is kept (aligned comments), at least one space.
    return l.text === "" ? indentFor(l.depth) + l.comment : `${body}${l.gap || " "}${l.comment}`;
  });
  while (out.length > 0 && out[out.length - 1] === "") out.pop();
  return out.length === 0 ? "" : out.join(eol) + eol;
}
