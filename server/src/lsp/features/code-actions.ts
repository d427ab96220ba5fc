// Quick fixes over the protocol: the core's fixes of each diagnostic (server/src/fixes.ts, pure
// text edits found by the finding code and data riding in the diagnostic), each applied to a copy
// of the text and re-analysed in the analysis worker (server/src/recheck.ts) before it is mapped
// to a code action: a fix that would make the design worse is never offered.
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
import { LineIndex } from "../../syntax/span";
import { CODES } from "../../findings/codes";
import type { FixRequest, TextFix } from "../../findings/fix";
import { TUNE_COMMAND, TUNE_FIX_TITLE } from "../custom-protocol";
import type { DeclarationNode, SyntaxTree } from "../../syntax/ast";

/** The tune command as a code action: on a balance diagnostic (a quick fix), or anywhere in a
 * spring that has a `tune` line. It runs the search when chosen, not when the lightbulb asks. */
function tuneAction(uri: string, diagnostics: Diagnostic[]): CodeAction {
  return {
    title: TUNE_FIX_TITLE,
    kind: CodeActionKind.QuickFix,
    ...(diagnostics.length > 0 ? { diagnostics } : {}),
    command: { title: TUNE_FIX_TITLE, command: TUNE_COMMAND, arguments: [uri] },
  };
}

/** The spring declaration with a `tune` line whose text holds `offset`. */
function tunedSpringAt(tree: SyntaxTree, offset: number): DeclarationNode | undefined {
  return tree.arms[0]?.declarations.find(
    (d) =>
      d.keyword.text === "spring" &&
      d.span.start <= offset &&
      offset <= d.span.end &&
      d.properties.some((p) => p.key.text === "tune"),
  );
}

/** The re-checks of one request may take this many analyses' budgets in all: the text as it is,
 * and a candidate or two (common practice, no source). */
const FIX_CHECK_BUDGETS = 3;
/** Answers remembered per text and diagnostic: the editor asks again each time the cursor rests
 * on a diagnostic, and each answer costs whole analyses. */
const CHECKED_CACHE_SIZE = 32;
const checkedCache = new Map<string, TextFix[]>();

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

function hash(s: string): number {
  let h = 2166136261;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 16777619);
  return h >>> 0;
}

/** The request of a diagnostic from this server (its finding's code and typed data), at the
 * diagnostic's range in the current text. */
function requestOf(index: LineIndex, diagnostic: Diagnostic): FixRequest | undefined {
  if (diagnostic.source !== DIAGNOSTIC_SOURCE) return undefined;
  const data = diagnostic.data as DiagnosticData | undefined;
  const code = data?.code ?? (typeof diagnostic.code === "string" ? diagnostic.code : undefined);
  if (!code || !(code in CODES)) return undefined;
  // The editor keeps the diagnostic's range in step with edits; the data's span is of the analysed
  // text, which may be older.
  const span = { start: index.offset(diagnostic.range.start), end: index.offset(diagnostic.range.end) };
  return { code, span, data: data?.detail ?? {} } as FixRequest;
}

/** The checked fixes of each request, from the cache or the worker. */
async function checkedFixesOf(
  ctx: FeatureContext,
  text: string,
  requests: FixRequest[],
): Promise<TextFix[][]> {
  const keys = requests.map((r) => `${text.length}:${hash(text)}:${JSON.stringify(r)}`);
  const missing = requests.filter((_, i) => !checkedCache.has(keys[i]!));
  if (missing.length > 0) {
    const budgetMs = ctx.settings().analysisBudgetMs * FIX_CHECK_BUDGETS;
    const answers = await ctx.checkFixes(text, { requests: missing, budgetMs });
    // A job that failed or ran out of time offers nothing, and is asked again next time.
    if (!answers) return requests.map((_, i) => checkedCache.get(keys[i]!) ?? []);
    missing.forEach((r, i) => {
      const key = `${text.length}:${hash(text)}:${JSON.stringify(r)}`;
      if (checkedCache.size >= CHECKED_CACHE_SIZE) checkedCache.delete(checkedCache.keys().next().value!);
      checkedCache.set(key, answers[i] ?? []);
    });
  }
  return keys.map((k) => checkedCache.get(k) ?? []);
}

export const codeActionsFeature: ServerFeature = {
  name: "quick fixes",
  capabilities: () => ({ codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix] } }),
  register(ctx: FeatureContext) {
    ctx.connection.onCodeAction(
      guarded("code actions", [] as CodeAction[], async (params: CodeActionParams) => {
        const doc = ctx.documents.get(params.textDocument.uri);
        if (!doc) return [];
        const text = doc.getText();
        const index = new LineIndex(text);
        const asked: { diagnostic: Diagnostic; request: FixRequest }[] = [];
        for (const diagnostic of params.context.diagnostics) {
          const request = requestOf(index, diagnostic);
          if (request) asked.push({ diagnostic, request });
        }
        // The tune command: on a balance diagnostic, or inside a spring with a `tune` line.
        const balance = asked.filter((a) => a.request.code === "balance.unbalanced").map((a) => a.diagnostic);
        const tree = ctx.syntax(doc.uri)?.tree;
        const tune =
          balance.length > 0 || (tree && tunedSpringAt(tree, index.offset(params.range.start)))
            ? [tuneAction(doc.uri, balance)]
            : [];
        if (asked.length === 0) return tune;
        const fixes = await checkedFixesOf(
          ctx,
          text,
          asked.map((a) => a.request),
        );
        // The text may have changed while the worker checked: edits of an older text are stale.
        if (ctx.documents.get(doc.uri)?.getText() !== text) return [];
        return [
          ...asked.flatMap((a, i) => (fixes[i] ?? []).map((f) => toAction(doc.uri, index, f, a.diagnostic))),
          ...tune,
        ];
      }),
    );
  },
};
