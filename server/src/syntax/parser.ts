// Text to syntax tree. Never throws: whatever the text, it returns a tree (as much as could be
// read) and the syntax errors, each at the words that need to change.
import type { ILexingError } from "chevrotain";
import type { CommentNode, SyntaxError, SyntaxTree } from "./ast";
import { armLexer } from "./tokens";
import { armGrammar, ParseStopped } from "./grammar";
import { TreeBuilder, tokenSpan } from "./build-tree";
import { span } from "./span";
import { MAX_SPEC_CHARS } from "../limits";

export function parse(text: string): SyntaxTree {
  // Past the size limit nothing is read (analyse() says why, with an analysis.limit finding).
  if (text.length > MAX_SPEC_CHARS) return { arms: [], comments: [], errors: [] };
  try {
    return parseUnguarded(text);
  } catch (err) {
    if (err instanceof ParseStopped) return { arms: [], comments: [], errors: [], stopped: true };
    // A fault in the parser itself must not take the editor down: say so and return nothing.
    const detail = err instanceof Error ? err.message : String(err);
    return {
      arms: [],
      comments: [],
      errors: [{ message: `internal parser fault: ${detail}`, span: span(0, 0) }],
    };
  }
}

function parseUnguarded(text: string): SyntaxTree {
  const lexed = armLexer.tokenize(text);
  const comments: CommentNode[] = (lexed.groups["comments"] ?? []).map((t) => ({
    text: t.image,
    span: tokenSpan(t),
  }));
  const lexErrors = lexingErrors(text, lexed.errors);

  armGrammar.resetDepth();
  armGrammar.input = lexed.tokens;
  const cst = armGrammar.document();
  const last = lexed.tokens[lexed.tokens.length - 1];
  const builder = new TreeBuilder(text, last ? last.endOffset! + 1 : 0);
  for (const e of lexErrors) builder.error(e.message, e.span);
  const arms = builder.document(cst);
  // The grammar accepts any token sequence, so the parser's own errors are rare; keep them, in
  // plain words, in case recovery was needed.
  for (const e of armGrammar.errors) {
    const t = e.token;
    const at = Number.isFinite(t.startOffset) ? tokenSpan(t) : span(text.length, text.length);
    builder.error(`unexpected \`${t.image || "end of file"}\``, at);
  }
  const errors = [...builder.errors].sort((a, b) => a.span.start - b.span.start);
  return { arms, comments, errors };
}

/** Adjacent bad characters make one error. */
function lexingErrors(text: string, errors: ILexingError[]): SyntaxError[] {
  const out: { start: number; end: number }[] = [];
  for (const e of errors) {
    const prev = out[out.length - 1];
    if (prev && prev.end === e.offset) prev.end = e.offset + e.length;
    else out.push({ start: e.offset, end: e.offset + e.length });
  }
  return out.map((r) => {
    const chars = text.slice(r.start, r.end);
    const message =
      chars === "\u00B0" ? "write angles with `deg`, e.g. `30 deg`" : `unexpected character \`${chars}\``;
    return { message, span: span(r.start, r.end) };
  });
}
