// Quick fixes over the protocol: the core's fixes of each diagnostic (server/src/fixes.ts, pure
// text edits found by the finding code and data riding in the diagnostic) mapped to code actions.
import {
  CodeActionKind,
  type CodeAction,
  type CodeActionParams,
  type Diagnostic,
  type TextEdit,
} from "vscode-languageserver";
import type { FeatureContext, ServerFeature } from "../context";
import type { DiagnosticData } from "../convert";
import { DIAGNOSTIC_SOURCE } from "../convert";
import { guarded } from "../safe";
import { cachedFixes } from "../../fixes";
import { parse } from "../../syntax/parser";
import { LineIndex } from "../../syntax/span";
import { CODES } from "../../findings/codes";
import type { FixRequest, TextFix } from "../../findings/fix";

function toAction(uri: string, index: LineIndex, fix: TextFix, diagnostic: Diagnostic): CodeAction {
  const edits: TextEdit[] = fix.edits.map((e) => ({
    range: { start: index.position(e.span.start), end: index.position(e.span.end) },
    newText: e.newText,
  }));
  return {
    title: fix.title,
    kind: CodeActionKind.QuickFix,
    diagnostics: [diagnostic],
    isPreferred: fix.preferred ?? false,
    edit: { changes: { [uri]: edits } },
  };
}

export const codeActionsFeature: ServerFeature = {
  name: "quick fixes",
  capabilities: () => ({ codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix] } }),
  register(ctx: FeatureContext) {
    ctx.connection.onCodeAction(
      guarded("code actions", [] as CodeAction[], (params: CodeActionParams) => {
        const doc = ctx.documents.get(params.textDocument.uri);
        if (!doc) return [];
        const text = doc.getText();
        const index = new LineIndex(text);
        const tree = ctx.syntax(doc.uri)?.tree ?? parse(text);
        const actions: CodeAction[] = [];
        for (const diagnostic of params.context.diagnostics) {
          if (diagnostic.source !== DIAGNOSTIC_SOURCE) continue;
          const data = diagnostic.data as DiagnosticData | undefined;
          // A diagnostic from this server carries its finding's code and typed data.
          const code = data?.code ?? (typeof diagnostic.code === "string" ? diagnostic.code : undefined);
          if (!code || !(code in CODES)) continue;
          // The editor keeps the diagnostic's range in step with edits; the data's span is of the
          // analysed text, which may be older.
          const span = {
            start: index.offset(diagnostic.range.start),
            end: index.offset(diagnostic.range.end),
          };
          const req = { code, span, data: data?.detail ?? {} } as FixRequest;
          for (const fix of cachedFixes(text, tree, req))
            actions.push(toAction(doc.uri, index, fix, diagnostic));
        }
        return actions;
      }),
    );
  },
};
