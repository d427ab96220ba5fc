// Helpers that write fixes as text: find a declaration or property in the syntax tree, write a
// value in the unit the text already uses, add a property line indented like its neighbours.
// Shared by the fix producers of the model builder's findings and of the checks.
import type { DeclarationNode, PropertyNode, QuantityNode, SyntaxTree, ValueNode } from "../syntax/ast";
import type { TextEdit } from "../findings/fix";
import type { ValueShape } from "./schema";
import { DIMENSIONS, type DimensionName } from "../units/dimension";
import { fromSI, parseUnit, sameDimension, USUAL_UNIT } from "../units/quantity";
import { formatNumber } from "../units/format";

export function declarations(tree: SyntaxTree): readonly DeclarationNode[] {
  return tree.arms[0]?.declarations ?? [];
}

export function declarationNamed(
  tree: SyntaxTree,
  keyword: string,
  name: string,
): DeclarationNode | undefined {
  return declarations(tree).find((d) => d.keyword.text === keyword && d.name?.text === name);
}

/** The declaration whose words make a part: its own, or for a part a parallelogram generates
 * (`reach.lower`, `reach.upper_root`) the parallelogram's. */
export function declarationOf(tree: SyntaxTree, id: string): DeclarationNode | undefined {
  const name = id.split(".")[0]!;
  return declarations(tree).find((d) => d.name?.text === name);
}

export function propertyOf(decl: DeclarationNode, key: string): PropertyNode | undefined {
  return decl.properties.find((p) => p.key.text === key);
}

export function quantitiesIn(v: ValueNode): QuantityNode[] {
  switch (v.kind) {
    case "quantity":
      return [v];
    case "range":
      return [v.low, v.high];
    case "point":
      return [v.x, v.y];
    case "region":
      return [v.low.x, v.low.y, v.high.x, v.high.y];
    case "dims":
      return [v.first, v.second];
    case "reference":
      return v.point ? [v.point.x, v.point.y] : [];
    default:
      return [];
  }
}

/** The first dimension a property's shape expects (a sequence: its first quantity). */
export function dimensionOfShape(shape: ValueShape): DimensionName | undefined {
  switch (shape.type) {
    case "quantity":
    case "range":
    case "vector":
    case "dims":
      return shape.dimension;
    case "quantity-or":
      return shape.dimensions[0];
    case "point":
    case "named-point":
      return "length";
    case "sequence":
      for (const item of shape.items)
        if (item.type !== "keyword") {
          const d = dimensionOfShape(item);
          if (d) return d;
        }
      return undefined;
    default:
      return undefined;
  }
}

/** Text of a new property line after `after`, indented like it. */
export function lineAfter(text: string, after: PropertyNode, line: string): TextEdit {
  const lineStart = text.lastIndexOf("\n", after.span.start - 1) + 1;
  const indent = /^[ \t]*/.exec(text.slice(lineStart))![0];
  let end = text.indexOf("\n", after.span.end);
  if (end < 0) end = text.length;
  return { span: { start: end, end }, newText: `\n${indent}${line}` };
}

/** The value written in the same unit as an existing quantity (or the usual unit). */
export function writeIn(
  valueSI: number,
  written: QuantityNode | undefined,
  dimension: DimensionName,
): string {
  const unit = written?.unit?.text ?? USUAL_UNIT[dimension];
  const v = fromSI(valueSI, unit);
  return v === undefined ? "" : `${formatNumber(v)} ${unit}`;
}

/** A finite number, else undefined. */
export function finiteNumber(x: unknown): number | undefined {
  return typeof x === "number" && Number.isFinite(x) ? x : undefined;
}

/** The value in the unit of `written` when that unit has the right dimension (a preload written
 * as an angle gets a torque in the usual unit instead). */
export function writeInDimension(
  valueSI: number,
  written: ValueNode | undefined,
  dimension: DimensionName,
): string {
  const q = written?.kind === "quantity" ? written : undefined;
  const parsed = q?.unit ? parseUnit(q.unit.text) : undefined;
  const fits = parsed?.ok && sameDimension(parsed.unit.dimension, DIMENSIONS[dimension]);
  return writeIn(valueSI, fits ? q : undefined, dimension);
}
