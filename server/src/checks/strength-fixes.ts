// The pin quick fix, as pure text edits: widen a pin that fails `require safety` to the smallest
// size of the standard series whose re-analysis passes. The re-analysis is passed in (`recheck`,
// the core's `analyse`), as the checks sit below the analysis that runs them.
import type { DeclarationNode, PropertyNode, QuantityNode, SyntaxTree } from "../syntax/ast";
import type { Finding } from "../findings/finding";
import type { OverstressData } from "../findings/data";
import type { FixRequest, TextFix } from "../findings/fix";
import { fromSI } from "../units/quantity";
import { formatNumber } from "../units/format";
import { declarationOf, finiteNumber as num, propertyOf } from "../model/fix-words";

/** Analyses an edited text within a budget: `analyse` fits. */
export type Recheck = (
  text: string,
  options: { budgetMs: number },
) => { sweep?: unknown; findings: readonly Finding[] };

/** Standard metric pin diameters, m: ISO 2338-style preferred sizes as commonly stocked (common
 * practice, no source). */
export const STANDARD_PIN_DIAMETERS_M = [2, 2.5, 3, 4, 5, 6, 8, 10, 12, 16, 20].map((mm) => mm / 1000);
/** Sizes tried beyond the first candidate before giving up: each try is a whole analysis. */
const PIN_TRIES = 4;
/** All the tries of one pin fix together may take this long: they run on the server's request
 * path, and a lightbulb that keeps the server busy longer than a pause in typing is worse than no
 * fix (common practice, no source). */
const PIN_FIX_BUDGET_MS = 3000;

/** The joint's declaration and its pin property, when the strength finding is about a pin. */
function pinOf(
  tree: SyntaxTree,
  data: OverstressData | undefined,
): { decl: DeclarationNode; prop: PropertyNode; diameter: QuantityNode } | undefined {
  if (data?.check !== "pin") return undefined;
  const decl = declarationOf(tree, data.subject);
  if (!decl) return undefined;
  const prop = propertyOf(decl, "pin") ?? propertyOf(decl, "pins");
  const diameter = prop?.values[0];
  if (!prop || diameter?.kind !== "quantity" || !diameter.unit) return undefined;
  return { decl, prop, diameter };
}

function pinStillFails(analysis: { findings: readonly Finding[] }, jointId: string): boolean {
  return analysis.findings.some(
    (f) => f.code === "strength.overstress" && f.data.check === "pin" && f.data.subject === jointId,
  );
}

/**
 * The smallest standard pin that meets `require safety`, confirmed by analysing the edited text.
 * Shear stress goes as 1/d^2 and bearing as 1/d (docs/checks.md, Pins and holes), so the shear-governed
 * size d sqrt(S_req / S) is a lower bound and the search starts at the first standard size above it.
 */
export function widenPinFix(
  text: string,
  tree: SyntaxTree,
  data: OverstressData | undefined,
  recheck: Recheck,
  budgetMs = PIN_FIX_BUDGET_MS,
): TextFix | undefined {
  const deadline = performance.now() + budgetMs;
  const pin = pinOf(tree, data);
  if (!pin || !data) return undefined;
  const unit = pin.diameter.unit!.text;
  const d = fromSI(1, unit);
  if (d === undefined) return undefined;
  const current = pin.diameter.value / d; // SI
  const safety = num(data.safety);
  const required = num(data.required);
  const lowest = safety && required && safety > 0 ? current * Math.sqrt(required / safety) : current;
  const candidates = STANDARD_PIN_DIAMETERS_M.filter(
    (c) => c > current * (1 + 1e-9) && c >= lowest * (1 - 1e-9),
  ).slice(0, PIN_TRIES);
  for (const c of candidates) {
    const newText = `${formatNumber(fromSI(c, unit)!)} ${unit}`;
    const edited = text.slice(0, pin.diameter.span.start) + newText + text.slice(pin.diameter.span.end);
    const left = deadline - performance.now();
    if (left <= 0) return undefined;
    const analysis = recheck(edited, { budgetMs: left });
    if (
      !analysis.sweep ||
      analysis.findings.some((f) => f.code === "analysis.budget" || f.code === "analysis.internal")
    )
      return undefined;
    if (!pinStillFails(analysis, data.subject)) {
      const name = pin.decl.name?.text ?? "the joint";
      return {
        title: `Widen ${name}'s pin to ${newText}, the smallest standard size that meets the required safety (checked)`,
        edits: [{ span: pin.diameter.span, newText }],
        preferred: true,
      };
    }
  }
  return undefined;
}

/** The fixes of a strength finding (none for other codes). */
export function strengthFixes(text: string, tree: SyntaxTree, req: FixRequest, recheck: Recheck): TextFix[] {
  if (req.code !== "strength.overstress") return [];
  const fix = widenPinFix(text, tree, req.data, recheck);
  return fix ? [fix] : [];
}
