// Semantic highlighting from the fast parse: declaration keywords, property keys, numbers, units,
// strings and names coloured by what they name (body, stage, joint, spring, payload, material,
// point). Standard token types where one fits; `unit` is our own (package.json gives its super type).
import { SemanticTokensBuilder, type SemanticTokens, type SemanticTokensLegend } from "vscode-languageserver";
import type { ValueNode } from "../../syntax/ast";
import type { Span } from "../../syntax/span";
import type { ServerFeature } from "../context";
import { CONNECTIVES, SECTION_SHAPES, type NameKind } from "../../services/names";
import { guarded } from "../safe";
import type { SyntaxView } from "../session/syntax-view";
import { allQuantities } from "../../services/tree-walk";

export const TOKEN_TYPES = [
  "keyword",
  "property",
  "number",
  "string",
  "unit",
  "class",
  "struct",
  "function",
  "event",
  "variable",
  "type",
  "enumMember",
] as const;
export const TOKEN_MODIFIERS = ["declaration", "defaultLibrary"] as const;
type TokenType = (typeof TOKEN_TYPES)[number];

export const LEGEND: SemanticTokensLegend = {
  tokenTypes: [...TOKEN_TYPES],
  tokenModifiers: [...TOKEN_MODIFIERS],
};

const TYPE_OF_NAME: Record<NameKind, TokenType> = {
  base: "class",
  link: "class",
  bar: "class",
  head: "class",
  parallelogram: "struct",
  joint: "function",
  swivel: "function",
  spring: "event",
  payload: "variable",
  bearing: "struct",
  fastening: "struct",
  material: "type",
  point: "enumMember",
};

interface Token {
  span: Span;
  type: TokenType;
  modifiers: number;
}

export function semanticTokens(view: SyntaxView): SemanticTokens {
  const tokens: Token[] = [];
  const add = (span: Span, type: TokenType, modifiers = 0) => {
    if (span.end > span.start) tokens.push({ span, type, modifiers });
  };
  const words = (v: ValueNode) => {
    if (v.kind === "reference" && v.parts.length === 1) {
      const w = v.parts[0]!.text;
      if (CONNECTIVES.has(w) || SECTION_SHAPES.has(w)) add(v.parts[0]!.span, "keyword");
    }
    if (v.kind === "string") add(v.span, "string");
  };
  for (const arm of view.tree.arms) {
    add(arm.keywordSpan, "keyword");
    if (arm.title) add(arm.title.span, "string");
    const properties = [...arm.properties, ...arm.declarations.flatMap((d) => d.properties)];
    for (const d of arm.declarations) add(d.keyword.span, "keyword");
    for (const p of properties) {
      add(p.key.span, "property");
      for (const q of allQuantities(p)) {
        add(q.numberSpan, "number");
        if (q.unit) add(q.unit.span, "unit");
      }
      p.values.forEach(words);
    }
  }
  for (const o of view.names.occurrences) {
    const s = view.names.symbols.get(o.symbolId);
    if (!s) continue;
    add(o.span, TYPE_OF_NAME[s.kind], (o.declaration ? 1 : 0) | (s.builtin ? 2 : 0));
  }
  tokens.sort((a, b) => a.span.start - b.span.start || b.span.end - a.span.end);
  const builder = new SemanticTokensBuilder();
  let lastEnd = -1;
  for (const t of tokens) {
    if (t.span.start < lastEnd) continue; // overlapping: the first (widest) wins
    const start = view.lines.position(t.span.start);
    const end = view.lines.position(t.span.end);
    if (end.line !== start.line) continue; // tokens never span lines in this language but a string might
    builder.push(
      start.line,
      start.character,
      end.character - start.character,
      TOKEN_TYPES.indexOf(t.type),
      t.modifiers,
    );
    lastEnd = t.span.end;
  }
  return builder.build();
}

export const semanticTokensFeature: ServerFeature = {
  name: "semantic tokens",
  capabilities: () => ({ semanticTokensProvider: { legend: LEGEND, full: true, range: false } }),
  register(ctx) {
    ctx.connection.languages.semanticTokens.on(
      guarded("semantic tokens", { data: [] } as SemanticTokens, (params) => {
        const view = ctx.syntax(params.textDocument.uri);
        return view ? semanticTokens(view) : { data: [] };
      }),
    );
  },
};
