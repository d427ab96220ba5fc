// Go to definition, find references, highlights and rename, over the name index of the current
// text. Renaming a parallelogram renames the prefix of `reach.lower` too (it is the same word).
import {
  ResponseError,
  ErrorCodes,
  type Location,
  type Range,
  type TextEdit,
  type WorkspaceEdit,
  type DocumentHighlight,
  DocumentHighlightKind,
} from "vscode-languageserver";
import type { ServerFeature } from "../context";
import { spanToRange } from "../convert";
import { IDENTIFIER, occurrenceAt, occurrencesOf, type NameSymbol } from "../../services/names";
import { guarded } from "../safe";
import type { SyntaxView } from "../session/syntax-view";
import { DECLARATIONS } from "../../model/schema";
import { SPRING_KIND_WORDS } from "../../model/spring-kinds";

function symbolAt(view: SyntaxView, offset: number): { symbol: NameSymbol; range: Range } | undefined {
  const occ = occurrenceAt(view.names, offset);
  const symbol = occ && view.names.symbols.get(occ.symbolId);
  return occ && symbol ? { symbol, range: spanToRange(view.lines, occ.span) } : undefined;
}

/** Where a name is defined: its own name, a generated body's parallelogram, a built-in point's
 * body. Library materials have no location. */
function definitionSpan(view: SyntaxView, symbol: NameSymbol) {
  if (symbol.nameSpan) return symbol.nameSpan;
  const parent = symbol.parent ? view.names.symbols.get(symbol.parent) : undefined;
  return parent?.nameSpan;
}

/** Words a new name may not be: declaration keywords and the words the grammar reads by position. */
const RESERVED = new Set([
  "arm",
  "to",
  "and",
  "at",
  "x",
  "rect",
  "tube",
  "rod",
  "on",
  "off",
  "single",
  "double",
  "fixed",
  "yaw",
  ...SPRING_KIND_WORDS,
]);

function renameEdits(view: SyntaxView, symbol: NameSymbol, newName: string): TextEdit[] {
  if (!IDENTIFIER.test(newName) || RESERVED.has(newName) || DECLARATIONS.some((d) => d.keyword === newName)) {
    throw new ResponseError(
      ErrorCodes.InvalidParams,
      `"${newName}" cannot be a name: use letters, digits and _ (not a keyword), starting with a letter or _.`,
    );
  }
  const clashId = symbol.parent && symbol.kind === "point" ? `${symbol.parent}.${newName}` : newName;
  if (newName !== symbol.name && view.names.symbols.has(clashId)) {
    throw new ResponseError(ErrorCodes.InvalidParams, `"${newName}" is already a name in this arm.`);
  }
  return occurrencesOf(view.names, symbol.id).map((o) => ({
    range: spanToRange(view.lines, o.span),
    newText: newName,
  }));
}

export const navigationFeature: ServerFeature = {
  name: "navigation",
  capabilities: () => ({
    definitionProvider: true,
    referencesProvider: true,
    documentHighlightProvider: true,
    renameProvider: { prepareProvider: true },
  }),
  register(ctx) {
    const { connection } = ctx;
    connection.onDefinition(
      guarded("definition", null as Location | null, (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return null;
        const hit = symbolAt(view, view.lines.offset(params.position));
        const span = hit && definitionSpan(view, hit.symbol);
        return span ? { uri: view.uri, range: spanToRange(view.lines, span) } : null;
      }),
    );
    connection.onReferences(
      guarded("references", [] as Location[], (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return [];
        const hit = symbolAt(view, view.lines.offset(params.position));
        if (!hit) return [];
        return occurrencesOf(view.names, hit.symbol.id)
          .filter((o) => params.context.includeDeclaration || !o.declaration)
          .map((o) => ({ uri: view.uri, range: spanToRange(view.lines, o.span) }));
      }),
    );
    connection.onDocumentHighlight(
      guarded("highlight", [] as DocumentHighlight[], (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return [];
        const hit = symbolAt(view, view.lines.offset(params.position));
        if (!hit) return [];
        return occurrencesOf(view.names, hit.symbol.id).map((o) => ({
          range: spanToRange(view.lines, o.span),
          kind: o.declaration ? DocumentHighlightKind.Write : DocumentHighlightKind.Read,
        }));
      }),
    );
    connection.onPrepareRename(
      guarded("prepare rename", null as { range: Range; placeholder: string } | null, (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return null;
        const hit = symbolAt(view, view.lines.offset(params.position));
        if (!hit) return null;
        // Built-in names and the bodies a parallelogram makes cannot be renamed (rename the
        // parallelogram itself instead).
        if (!hit.symbol.renameable) return null;
        return { range: hit.range, placeholder: hit.symbol.name };
      }),
    );
    connection.onRenameRequest(async (params) => {
      // Not `guarded`: a refused name must reach the user as an error, not as an empty edit.
      try {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return null;
        const hit = symbolAt(view, view.lines.offset(params.position));
        if (!hit || !hit.symbol.renameable) return null;
        const edit: WorkspaceEdit = {
          changes: { [view.uri]: renameEdits(view, hit.symbol, params.newName) },
        };
        return edit;
      } catch (err) {
        if (err instanceof ResponseError) return err;
        ctx.log(`Counterpoise: rename failed: ${String(err)}`);
        return null;
      }
    });
  },
};
