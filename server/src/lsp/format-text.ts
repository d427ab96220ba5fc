// The canonical layout of a spec, computed from its tokens alone (so it keeps every word, even in
// text that does not parse): 2-space indent per block, one property per line, single spaces,
// comments kept where they were (own line or end of line), at most one blank line in a row.
// Formatting its own output changes nothing.

type Tok =
  | { t: "word"; s: string; glued: boolean }
  | { t: "open" | "close" | "lparen" | "rparen" | "comma" | "semi" | "range"; s: string; glued: boolean }
  | { t: "comment"; s: string; line: number; glued: boolean }
  | { t: "nl"; s: string; glued: boolean };

const SINGLE: Record<string, Tok["t"]> = { "{": "open", "}": "close", "(": "lparen", ")": "rparen", ",": "comma", ";": "semi" };

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
      out.push({ t: "comment", s: text.slice(i, j).trimEnd(), line, glued });
      i = j;
      continue;
    }
    if (c === '"') {
      let j = i + 1;
      while (j < text.length && text[j] !== '"' && text[j] !== "\n" && text[j] !== "\r") j++;
      if (text[j] === '"') j++;
      out.push({ t: "word", s: text.slice(i, j), glued });
      i = j;
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
    pieces.forEach((p, k) => out.push(p === ".." ? { t: "range", s: p, glued: k === 0 ? glued : true } : { t: "word", s: p, glued: k === 0 ? glued : true }));
    i = j;
    glued = true;
  }
  return out;
}

const INDENT = "  ";

export function formatSpec(text: string): string {
  const eol = text.includes("\r\n") ? "\r\n" : "\n";
  const lines: { depth: number; text: string; comment?: string; endsOpen: boolean; sourceLine: number }[] = [];
  let depth = 0;
  let parens = 0;
  let current = "";
  let currentLine = 0;
  let prev: Tok | undefined;
  let blankPending = false;
  let sawNewline = 0; // newlines since the last token: 2 or more make a blank line
  let sourceLine = 0;

  const emit = (lineText: string, endsOpen: boolean, comment?: string) => {
    const isClose = lineText === "}";
    const last = lines[lines.length - 1];
    if (blankPending && last && !last.endsOpen && !isClose) lines.push({ depth: 0, text: "", endsOpen: false, sourceLine: -1 });
    blankPending = false;
    lines.push({ depth, text: lineText, endsOpen, sourceLine: currentLine, ...(comment !== undefined ? { comment } : {}) });
  };
  const endLine = (endsOpen = false) => {
    if (current.length > 0) emit(current, endsOpen);
    current = "";
    prev = undefined;
  };
  const append = (s: string, space: boolean) => {
    if (current.length === 0) currentLine = sourceLine;
    current += current.length > 0 && space ? ` ${s}` : s;
  };

  for (const tok of tokenize(text)) {
    if (tok.t === "nl") {
      sourceLine++;
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
          emit(code, false, tok.s);
        } else if (last && last.sourceLine === tok.line && last.comment === undefined && last.text !== "") {
          last.comment = tok.s;
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
        prev = tok;
    }
  }
  endLine();
  const out = lines.map((l) => {
    const body = l.text === "" && l.comment === undefined ? "" : INDENT.repeat(l.depth) + l.text;
    if (l.comment === undefined) return body;
    return l.text === "" ? INDENT.repeat(l.depth) + l.comment : `${body} ${l.comment}`;
  });
  while (out.length > 0 && out[out.length - 1] === "") out.pop();
  return out.length === 0 ? "" : out.join(eol) + eol;
}
