// The outline: the arm, its declarations, and inside them named points and properties.
import { SymbolKind, type DocumentSymbol } from "vscode-languageserver";
import type { DeclarationNode, PropertyNode } from "../../syntax/ast";
import type { LineIndex } from "../../syntax/span";
import type { ServerFeature } from "../context";
import { spanToRange } from "../convert";
import { guarded } from "../safe";

const KIND_OF_DECLARATION: Record<string, SymbolKind> = {
  material: SymbolKind.Constant,
  base: SymbolKind.Module,
  link: SymbolKind.Class,
  joint: SymbolKind.Interface,
  parallelogram: SymbolKind.Struct,
  spring: SymbolKind.Event,
  payload: SymbolKind.Object,
  require: SymbolKind.Namespace,
  sweep: SymbolKind.Namespace,
  aged: SymbolKind.Namespace,
};

function propertySymbol(p: PropertyNode, lines: LineIndex, text: string): DocumentSymbol {
  const first = p.values[0];
  const isPoint = p.key.text === "point" && first?.kind === "reference";
  const name = isPoint ? first.parts.map((x) => x.text).join(".") : p.key.text;
  const detailSpan = isPoint ? p.values[1]?.span : undefined;
  const detail = text.slice(detailSpan?.start ?? p.key.span.end, detailSpan?.end ?? p.span.end).trim();
  return {
    name,
    detail: detail.length > 60 ? `${detail.slice(0, 57)}...` : detail,
    kind: isPoint ? SymbolKind.Field : SymbolKind.Property,
    range: spanToRange(lines, p.span),
    selectionRange: spanToRange(lines, isPoint ? first.span : p.key.span),
  };
}

function declarationSymbol(d: DeclarationNode, lines: LineIndex, text: string): DocumentSymbol {
  const children = d.properties.map((p) => propertySymbol(p, lines, text));
  if (d.keyword.text === "parallelogram" && d.name) {
    for (const part of ["lower", "upper", "head"]) {
      children.push({
        name: `${d.name.text}.${part}`,
        detail: part === "head" ? "far upright" : "bar",
        kind: SymbolKind.Class,
        range: spanToRange(lines, d.name.span),
        selectionRange: spanToRange(lines, d.name.span),
      });
    }
  }
  return {
    name: d.name?.text ?? d.keyword.text,
    detail: d.name ? d.keyword.text : "",
    kind: KIND_OF_DECLARATION[d.keyword.text] ?? SymbolKind.Object,
    range: spanToRange(lines, d.span),
    selectionRange: spanToRange(lines, d.name?.span ?? d.keyword.span),
    children,
  };
}

export const documentSymbolsFeature: ServerFeature = {
  name: "document symbols",
  capabilities: () => ({ documentSymbolProvider: { label: "Counterpoise" } }),
  register(ctx) {
    ctx.connection.onDocumentSymbol(
      guarded("document symbols", [] as DocumentSymbol[], (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        if (!view) return [];
        return view.tree.arms.map((arm) => ({
          name: arm.title?.value || "arm",
          detail: "arm",
          kind: SymbolKind.Package,
          range: spanToRange(view.lines, arm.span),
          selectionRange: spanToRange(view.lines, arm.title?.span ?? arm.keywordSpan),
          children: [
            ...arm.properties.map((p) => propertySymbol(p, view.lines, view.text)),
            ...arm.declarations.map((d) => declarationSymbol(d, view.lines, view.text)),
          ],
        }));
      }),
    );
  },
};
