// Tuned values as text edits in the spec's own units, keeping its layout and comments: a
// property's value where it is written (a new line beside the spring's properties where it is
// not), an end's inline point `boom(x, y)` in place, a named point in its body's `point` line
// when nothing else uses it (else the spring's reference becomes an inline point, so the joint
// or payload that shares the name stays where it is).
import type { DeclarationNode, PointNode, PropertyNode, ReferenceNode, SyntaxTree } from "../syntax/ast";
import type { TextEdit } from "../findings/fix";
import {
  declarationNamed,
  declarations,
  lineAfter,
  propertyOf,
  writeIn,
  writeInDimension,
} from "../model/fix-words";
import { formatNumber } from "../units/format";
import { parseUnit, sameDimension } from "../units/quantity";
import { DIMENSIONS } from "../units/dimension";
import type { Variable } from "./variables";

export interface WrittenValue {
  spring: string;
  what: string;
  /** The value as written into the text (`0.62 N/mm`, `(4 mm, 61.5 mm)`). */
  text: string;
}

/** The edits that write `values` (one per variable) into `text`, and each value as written.
 * Undefined when some value has nowhere to go (the spring's declaration is missing). */
export function tunedEdits(
  text: string,
  tree: SyntaxTree,
  vars: readonly Variable[],
  values: readonly number[],
): { edits: TextEdit[]; written: WrittenValue[] } | undefined {
  const edits: TextEdit[] = [];
  const written: WrittenValue[] = [];
  const bySpring = new Map<string, number[]>();
  vars.forEach((v, i) => bySpring.set(v.spring, [...(bySpring.get(v.spring) ?? []), i]));
  for (const [spring, idx] of bySpring) {
    const decl = declarationNamed(tree, "spring", spring);
    if (!decl) return undefined;
    const ends = new Map<string, { x?: number; y?: number }>();
    for (const i of idx) {
      const v = vars[i]!;
      if (v.axis) {
        const e = ends.get(v.what) ?? {};
        e[v.axis] = values[i]!;
        ends.set(v.what, e);
        continue;
      }
      const w = propertyEdit(text, decl, v, values[i]!);
      if (!w) return undefined;
      edits.push(w.edit);
      written.push({ spring, what: v.what, text: w.text });
    }
    for (const [what, xy] of ends) {
      const w = endEdit(text, tree, decl, what, xy);
      if (!w) return undefined;
      edits.push(w.edit);
      written.push({ spring, what, text: w.text });
    }
  }
  return { edits: edits.sort((a, b) => a.span.start - b.span.start), written };
}

/** The text with the edits applied (they do not overlap). */
export function applyEdits(text: string, edits: readonly TextEdit[]): string {
  let out = text;
  for (const e of [...edits].sort((a, b) => b.span.start - a.span.start))
    out = out.slice(0, e.span.start) + e.newText + out.slice(e.span.end);
  return out;
}

function valueText(v: Variable, value: number, written: PropertyNode | undefined): string {
  if (v.dimension === "dimensionless") return formatNumber(v.integer ? Math.round(value) : value);
  return writeInDimension(value, written?.values[0], v.dimension);
}

function propertyEdit(
  text: string,
  decl: DeclarationNode,
  v: Variable,
  value: number,
): { edit: TextEdit; text: string } | undefined {
  const prop = propertyOf(decl, v.what);
  const newText = valueText(v, value, prop);
  if (!newText) return undefined;
  const first = prop?.values[0];
  if (prop && first) return { edit: { span: first.span, newText }, text: newText };
  // Not written yet (an initial tension, strands): a line after the spring's last property that
  // is not a tuning line.
  const after = [...decl.properties].reverse().find((p) => p.key.text !== "tune" && p.key.text !== "adjust");
  if (!after) return undefined;
  return { edit: lineAfter(text, after, `${v.what} ${newText}`), text: newText };
}

/** The first and second references of `between` (anchor, hook). */
function endReference(decl: DeclarationNode, what: string): ReferenceNode | undefined {
  const between = propertyOf(decl, "between");
  const refs = (between?.values ?? []).filter(
    (x): x is ReferenceNode =>
      x.kind === "reference" && !(x.parts.length === 1 && x.parts[0]!.text === "and" && !x.point),
  );
  return what === "anchor" ? refs[0] : what === "hook" ? refs[refs.length - 1] : undefined;
}

function pointText(p: PointNode, xy: { x?: number; y?: number }): string {
  const x = xy.x === undefined ? textOfQuantity(p, "x") : writeIn(xy.x, p.x, "length");
  const y = xy.y === undefined ? textOfQuantity(p, "y") : writeIn(xy.y, p.y, "length");
  return `(${x}, ${y})`;
}

function textOfQuantity(p: PointNode, axis: "x" | "y"): string {
  const q = p[axis];
  return `${q.numberText}${q.unit ? ` ${q.unit.text}` : ""}`;
}

function endEdit(
  text: string,
  tree: SyntaxTree,
  decl: DeclarationNode,
  what: string,
  xy: { x?: number; y?: number },
): { edit: TextEdit; text: string } | undefined {
  const ref = endReference(decl, what);
  if (!ref) return undefined;
  if (ref.point) {
    const t = pointText(ref.point, xy);
    return { edit: { span: ref.point.span, newText: t }, text: t };
  }
  // A named point `body.name`: its body's `point name (x, y)` line.
  if (ref.parts.length !== 2) return undefined;
  const [body, name] = [ref.parts[0]!.text, ref.parts[1]!.text];
  const owner = declarations(tree).find((d) => d.name?.text === body);
  const line = owner?.properties.find(
    (p) => p.key.text === "point" && p.values[0]?.kind === "reference" && p.values[0].parts[0]?.text === name,
  );
  // `point anchor (x, y)` reads as the name with its point, or as the name and a point.
  const first = line?.values[0];
  const point =
    (first?.kind === "reference" ? first.point : undefined) ??
    line?.values.find((x): x is PointNode => x.kind === "point");
  if (!point) return undefined;
  const t = pointText(point, xy);
  const uses = text.match(new RegExp(`\\b${body}\\s*\\.\\s*${name}\\b`, "g"))?.length ?? 0;
  if (uses <= 1) return { edit: { span: point.span, newText: t }, text: t };
  // Shared with a joint or another part: the spring gets its own inline point instead.
  return { edit: { span: ref.span, newText: `${body}${t}` }, text: `${body}${t}` };
}

/** The torsion springs whose `preload` is written as an angle (`preload 200 deg`). */
export function anglePreloadsOf(tree: SyntaxTree): Set<string> {
  const out = new Set<string>();
  for (const d of declarations(tree)) {
    if (d.keyword.text !== "spring" || !d.name) continue;
    const v = propertyOf(d, "preload")?.values[0];
    const unit = v?.kind === "quantity" ? v.unit?.text : undefined;
    const parsed = unit ? parseUnit(unit) : undefined;
    if (parsed?.ok && sameDimension(parsed.unit.dimension, DIMENSIONS.angle)) out.add(d.name.text);
  }
  return out;
}
