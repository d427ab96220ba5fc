// Where the cursor stands, read lexically from the text before it (the text being typed rarely
// parses cleanly): block depth, the enclosing declaration, and the words of the current property.

export interface CursorContext {
  /** 0 outside any block, 1 inside `arm { }`, 2 inside a declaration. */
  depth: number;
  /** The enclosing declaration's keyword and name (depth 2). */
  keyword?: string;
  name?: string;
  /** Offset of the innermost open `{`. */
  blockStart: number;
  /** Words of the current property before the cursor, the last one possibly partial ("" when the
   * cursor follows a space). Inline points `(...)` count as one word "()". */
  words: string[];
  /** Inside a comment or a string: no completion there. */
  quiet: boolean;
}

const WORD_CHAR = /[A-Za-z0-9_.\-+*/^]/;

export function cursorContext(text: string, offset: number): CursorContext {
  const stack: number[] = [];
  let lineStart = 0; // start of the current property: after a newline, `;`, `{` or `}`
  let inString = false;
  let inComment = false;
  for (let i = 0; i < offset; i++) {
    const c = text[i]!;
    if (inComment) {
      if (c === "\n") {
        inComment = false;
        lineStart = i + 1;
      }
      continue;
    }
    if (inString) {
      if (c === '"' || c === "\n") inString = false;
      continue;
    }
    if (c === "#") inComment = true;
    else if (c === '"') inString = true;
    else if (c === "{") {
      stack.push(i);
      lineStart = i + 1;
    } else if (c === "}") {
      stack.pop();
      lineStart = i + 1;
    } else if (c === "\n" || c === ";") lineStart = i + 1;
  }
  const blockStart = stack.length > 0 ? stack[stack.length - 1]! : 0;
  const ctx: CursorContext = {
    depth: stack.length,
    blockStart,
    words: splitWords(text.slice(lineStart, offset)),
    quiet: inString || inComment,
  };
  if (stack.length >= 2) {
    const header = splitWords(text.slice(headerStart(text, blockStart), blockStart));
    ctx.keyword = header[0];
    ctx.name = header[1];
  }
  return ctx;
}

/** Start of the words before a `{`: back to the previous newline, `;`, `{` or `}`. */
function headerStart(text: string, brace: number): number {
  for (let i = brace - 1; i >= 0; i--) {
    const c = text[i];
    if (c === "\n" || c === ";" || c === "{" || c === "}") return i + 1;
  }
  return 0;
}

function splitWords(s: string): string[] {
  const words: string[] = [];
  let i = 0;
  while (i < s.length) {
    const c = s[i]!;
    if (c === "(") {
      const close = s.indexOf(")", i);
      if (close < 0) return [...words, "(", ...splitWords(s.slice(i + 1))]; // inside an inline point
      // `body(x, y)` is one reference with its point: keep it glued to its word.
      if (words.length > 0 && i > 0 && WORD_CHAR.test(s[i - 1]!)) words[words.length - 1] += "()";
      else words.push("()");
      i = close + 1;
    } else if (WORD_CHAR.test(c)) {
      let j = i;
      while (j < s.length && WORD_CHAR.test(s[j]!)) j++;
      words.push(s.slice(i, j));
      i = j;
    } else i++;
  }
  if (s.length === 0 || !WORD_CHAR.test(s[s.length - 1]!)) words.push("");
  return words;
}

/** The text of an enclosing block, to see what it already holds (e.g. a spring's kind). */
export function blockText(text: string, blockStart: number): string {
  let depth = 0;
  for (let i = blockStart; i < text.length; i++) {
    const c = text[i];
    if (c === "{") depth++;
    else if (c === "}" && --depth === 0) return text.slice(blockStart, i);
  }
  return text.slice(blockStart);
}
