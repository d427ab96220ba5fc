// Folding: the arm block, each declaration, and runs of two or more comment lines.
import { FoldingRangeKind, type FoldingRange } from "vscode-languageserver";
import type { ServerFeature } from "../context";
import type { SyntaxView } from "../session/syntax-view";
import { guarded } from "../safe";

export function foldingRanges(view: SyntaxView): FoldingRange[] {
  const out: FoldingRange[] = [];
  const block = (startOffset: number, endOffset: number) => {
    const startLine = view.lines.position(startOffset).line;
    // Stop the fold on the line before the closing brace, so the brace stays visible.
    const endLine = view.lines.position(endOffset).line - 1;
    if (endLine > startLine) out.push({ startLine, endLine });
  };
  for (const arm of view.tree.arms) {
    block(arm.bodySpan.start, arm.bodySpan.end);
    for (const d of arm.declarations) block(d.bodySpan.start, d.bodySpan.end);
  }
  let runStart = -1;
  let runEnd = -1;
  const flush = () => {
    if (runStart >= 0 && runEnd > runStart)
      out.push({ startLine: runStart, endLine: runEnd, kind: FoldingRangeKind.Comment });
    runStart = runEnd = -1;
  };
  for (const c of view.tree.comments) {
    const line = view.lines.position(c.span.start).line;
    const lineStart = view.lines.offset({ line, character: 0 });
    const ownLine = view.text.slice(lineStart, c.span.start).trim() === "";
    if (!ownLine) {
      flush();
      continue;
    }
    if (runStart >= 0 && line === runEnd + 1) runEnd = line;
    else {
      flush();
      runStart = runEnd = line;
    }
  }
  flush();
  return out;
}

export const foldingFeature: ServerFeature = {
  name: "folding",
  capabilities: () => ({ foldingRangeProvider: true }),
  register(ctx) {
    ctx.connection.onFoldingRanges(
      guarded("folding", [] as FoldingRange[], (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        return view ? foldingRanges(view) : [];
      }),
    );
  },
};
