// The syntax tree: plain values with exact source spans. No semantics here: the model builder
// decides what a property's values mean. Parsing never fails; it returns a tree and errors.
import type { Span } from "./span";

export interface Identifier {
  readonly text: string;
  readonly span: Span;
}

/** A number with an optional unit, e.g. `500 g`, `0.35 N/mm`, `-40 deg`, `3` (unit missing). */
export interface QuantityNode {
  readonly kind: "quantity";
  readonly value: number;
  /** The number's own text, as written. */
  readonly numberText: string;
  readonly numberSpan: Span;
  /** The unit as written (`N/mm`, `lbf*in/deg`), absent when the number stands alone. */
  readonly unit?: Identifier;
  readonly span: Span;
}

/** `lo .. hi` */
export interface RangeNode {
  readonly kind: "range";
  readonly low: QuantityNode;
  readonly high: QuantityNode;
  readonly span: Span;
}

/** `(x, y)`, or `(x, y, z)` for a working load in three dimensions */
export interface PointNode {
  readonly kind: "point";
  readonly x: QuantityNode;
  readonly y: QuantityNode;
  readonly z?: QuantityNode;
  readonly span: Span;
}

/** `(x1, y1) .. (x2, y2)`: a rectangle between two corners (a `tune anchor` region). */
export interface RegionNode {
  readonly kind: "region";
  readonly low: PointNode;
  readonly high: PointNode;
  readonly span: Span;
}

/** `a x b`: two quantities joined by `x` (a section's sides, a footprint, a tube's OD x wall). */
export interface DimsNode {
  readonly kind: "dims";
  readonly first: QuantityNode;
  readonly second: QuantityNode;
  readonly span: Span;
}

/**
 * A name or a dotted path, optionally with an inline point:
 * `mast`, `mast.end`, `reach.head`, `reach.lower(100 mm, 0 mm)`, `steel`, `double`.
 * A bare word (an enumerated choice, a material, a kind word) is a reference with one part;
 * the model builder decides which it is.
 */
export interface ReferenceNode {
  readonly kind: "reference";
  readonly parts: readonly Identifier[];
  readonly point?: PointNode;
  readonly span: Span;
}

/** `"Overhead camera arm"` */
export interface StringNode {
  readonly kind: "string";
  readonly value: string;
  readonly span: Span;
}

export type ValueNode =
  QuantityNode | RangeNode | PointNode | RegionNode | DimsNode | ReferenceNode | StringNode;

/** `key value value ...` on one line (or up to `;`). Connective words such as `to`, `and`,
 * `at` stay in `values` as one-part references; the model builder reads them by position. */
export interface PropertyNode {
  readonly kind: "property";
  readonly key: Identifier;
  readonly values: readonly ValueNode[];
  readonly span: Span;
}

export type DeclarationKeyword =
  | "material"
  | "base"
  | "link"
  | "joint"
  | "swivel"
  | "parallelogram"
  | "spring"
  | "payload"
  | "bearing"
  | "fastening"
  | "require"
  | "sweep"
  | "aged";

/** `keyword name { properties }`; `require` and `sweep` have no name. */
export interface DeclarationNode {
  readonly kind: "declaration";
  readonly keyword: Identifier & { readonly text: DeclarationKeyword | string };
  readonly name?: Identifier;
  readonly properties: readonly PropertyNode[];
  /** From the opening to the closing brace (the closing brace may be missing: then to the last token). */
  readonly bodySpan: Span;
  readonly span: Span;
}

/** `arm "title" { ... }`. Arm-level properties (e.g. `gravity 9.81 m/s^2`) sit beside declarations. */
export interface ArmNode {
  readonly kind: "arm";
  readonly keywordSpan: Span;
  readonly title?: StringNode;
  readonly declarations: readonly DeclarationNode[];
  readonly properties: readonly PropertyNode[];
  readonly bodySpan: Span;
  readonly span: Span;
}

export interface SyntaxError {
  readonly message: string;
  readonly span: Span;
}

/** A comment `# ...` to end of line (kept for formatting and folding). */
export interface CommentNode {
  readonly text: string;
  readonly span: Span;
}

export interface SyntaxTree {
  /** Every `arm` block in the file; more than one is a model error, not a syntax error. */
  readonly arms: readonly ArmNode[];
  readonly comments: readonly CommentNode[];
  readonly errors: readonly SyntaxError[];
  /** Set when reading stopped midway (the analysis was cancelled or out of time): the tree is
   * empty, not the text. */
  readonly stopped?: true;
}
