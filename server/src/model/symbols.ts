// A plain table of every declaration and every reference to one, for outline, go-to-definition,
// find references and rename (the language server reads it; the core never needs it).
import type { Span } from "../syntax/span";
import type { DeclarationKeyword } from "../syntax/ast";

/** Every declaration keyword, plus the names that are not declared by a keyword of their own. */
export type SymbolKind =
  | DeclarationKeyword
  /** A named point of a body (`id` is `body.point`). */
  | "point"
  /** A body a parallelogram creates (`reach.lower`, `reach.upper`, `reach.head`). */
  | "body";

export interface SymbolDeclaration {
  /** Model id: the name; `body.point` for points; `NAME.lower` etc. for generated bodies. */
  id: string;
  kind: SymbolKind;
  /** The name as written (for points, the point's own name). */
  name: string;
  /** Span of the name: for implicit symbols (a link's `start`/`end`, a parallelogram's bodies),
   * the span of the declaration that makes them. */
  nameSpan: Span;
  /** The whole declaration (or the `point` property). */
  span: Span;
  /** Points: the body they belong to; generated bodies: their parallelogram. */
  container?: string;
  /** Not written in the text (a link's `start` and `end`, a parallelogram's bodies): no rename. */
  implicit?: boolean;
}

export interface SymbolReference {
  /** The span of the referring name part (`end` in `mast.end` for the point; `mast` for the body). */
  span: Span;
  target: { kind: SymbolKind; id: string };
}

export interface SymbolTable {
  declarations: SymbolDeclaration[];
  references: SymbolReference[];
}

export function emptySymbols(): SymbolTable {
  return { declarations: [], references: [] };
}
