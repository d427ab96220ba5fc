// Finding things in the syntax tree by offset: the property, declaration and quantity under the
// cursor.
import type { DeclarationNode, PropertyNode, QuantityNode, SyntaxTree, ValueNode } from "../syntax/ast";
import { spanContains } from "../syntax/span";

export interface TreeSpot {
  declaration?: DeclarationNode;
  property?: PropertyNode;
  quantity?: QuantityNode;
}

function quantitiesOf(v: ValueNode): QuantityNode[] {
  switch (v.kind) {
    case "quantity":
      return [v];
    case "range":
      return [v.low, v.high];
    case "dims":
      return [v.first, v.second];
    case "point":
      return [v.x, v.y];
    case "region":
      return [v.low.x, v.low.y, v.high.x, v.high.y];
    case "reference":
      return v.point ? [v.point.x, v.point.y] : [];
    default:
      return [];
  }
}

export function allQuantities(p: PropertyNode): QuantityNode[] {
  return p.values.flatMap(quantitiesOf);
}

export function spotAt(tree: SyntaxTree, offset: number): TreeSpot {
  const spot: TreeSpot = {};
  for (const arm of tree.arms) {
    if (!spanContains(arm.span, offset)) continue;
    const inProperty = (p: PropertyNode) => {
      if (!spanContains(p.span, offset)) return false;
      spot.property = p;
      spot.quantity = allQuantities(p).find((q) => spanContains(q.span, offset));
      return true;
    };
    for (const p of arm.properties) if (inProperty(p)) return spot;
    for (const d of arm.declarations) {
      if (!spanContains(d.span, offset)) continue;
      spot.declaration = d;
      for (const p of d.properties) if (inProperty(p)) return spot;
      return spot;
    }
  }
  return spot;
}
