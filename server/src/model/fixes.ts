// Fixes for the model builder's findings, as pure text edits: add a missing unit, take the
// suggested name or unit, write a value in the form the builder knows is right (a reversed range
// the right way round). They read the finding's typed data, never its message.
import type { PropertyNode, SyntaxTree } from "../syntax/ast";
import type { Span } from "../syntax/span";
import type { TextData } from "../findings/data";
import type { FixRequest, TextFix } from "../findings/fix";
import { ARM_PROPERTIES, declarationSpec, type PropertySpec } from "./schema";
import { USUAL_UNIT } from "../units/quantity";
import { dimensionOfShape, quantitiesIn } from "./fix-words";

// ---- a missing unit ----------------------------------------------------------------------------

export function missingUnitFix(
  tree: SyntaxTree,
  span: Span,
  data: TextData | undefined,
): TextFix | undefined {
  for (const arm of tree.arms) {
    const scopes: { keyword?: string; properties: readonly PropertyNode[] }[] = [
      { properties: arm.properties },
      ...arm.declarations.map((d) => ({ keyword: d.keyword.text, properties: d.properties })),
    ];
    for (const scope of scopes) {
      for (const prop of scope.properties) {
        if (span.start < prop.span.start || span.start >= prop.span.end) continue;
        const quantities = prop.values.flatMap(quantitiesIn);
        const q = quantities.find(
          (n) => !n.unit && span.start >= n.span.start && span.start < Math.max(n.span.end, n.span.start + 1),
        );
        if (!q) continue;
        // A sibling that has a unit (the other end of a range, the other coordinate) says it best.
        let unit = quantities.find((n) => n.unit)?.unit?.text;
        const suggestion = data?.suggestion;
        if (!unit && suggestion?.startsWith(q.numberText + " "))
          unit = suggestion.slice(q.numberText.length + 1);
        if (!unit) {
          const specs: readonly PropertySpec[] = scope.keyword
            ? (declarationSpec(scope.keyword)?.properties ?? [])
            : ARM_PROPERTIES;
          const spec = specs.find((p) => p.key === prop.key.text);
          const dim = spec && dimensionOfShape(spec.shape);
          unit = dim ? USUAL_UNIT[dim] : undefined;
        }
        if (!unit) return undefined;
        return {
          title: `Add the unit: ${q.numberText} ${unit}`,
          edits: [{ span: { start: q.numberSpan.end, end: q.numberSpan.end }, newText: ` ${unit}` }],
          preferred: true,
        };
      }
    }
  }
  return undefined;
}

// ---- an unknown name ---------------------------------------------------------------------------

/** The suggestion of a name or unit finding, from its data (never from its message). */
export function suggestionOf(data: TextData | undefined): string | undefined {
  return data?.suggestion || undefined;
}

export function unknownNameFix(text: string, span: Span, data: TextData | undefined): TextFix | undefined {
  const suggestion = suggestionOf(data);
  if (!suggestion || span.end <= span.start) return undefined;
  const written = text.slice(span.start, span.end);
  if (written === suggestion) return undefined;
  // A finding on a whole dotted reference whose suggestion is one part: replace the last part.
  if (written.includes(".") && !suggestion.includes(".")) {
    const dot = written.lastIndexOf(".");
    return {
      title: `Change ${written.slice(dot + 1)} to ${suggestion}`,
      edits: [{ span: { start: span.start + dot + 1, end: span.end }, newText: suggestion }],
      preferred: true,
    };
  }
  return {
    title: `Change ${written} to ${suggestion}`,
    edits: [{ span, newText: suggestion }],
    preferred: true,
  };
}

// ---- a value the model builder knows the right form of ------------------------------------------

/** A finding whose data carries the corrected text of exactly the words it points at (a reversed
 * range written the right way round). */
export function suggestedValueFix(text: string, span: Span, data: TextData | undefined): TextFix | undefined {
  const suggestion = data?.suggestion;
  if (!suggestion || span.end <= span.start || text.slice(span.start, span.end) === suggestion)
    return undefined;
  return { title: `Write ${suggestion}`, edits: [{ span, newText: suggestion }], preferred: true };
}

// ---- the family's fixes ----------------------------------------------------------------------

/** The fixes of a finding of the model builder (none for other codes). */
export function modelFixes(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  let fix: TextFix | undefined;
  switch (req.code) {
    case "unit.missing":
      fix = missingUnitFix(tree, req.span, req.data);
      break;
    case "name.unknown":
    case "name.unknown-point":
    case "unit.unknown":
    case "unit.wrong-dimension":
    case "property.unknown":
    case "declaration.unknown":
      fix = unknownNameFix(text, req.span, req.data);
      break;
    case "value.impossible":
      fix = suggestedValueFix(text, req.span, req.data);
      break;
  }
  return fix ? [fix] : [];
}
