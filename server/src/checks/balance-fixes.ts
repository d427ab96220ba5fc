// The balance quick fix, as pure text edits: write the best-fit settings a `balance.unbalanced`
// finding carries into its spring, in the units the text already uses, and say the worst hand
// force before and after in the title.
import type { DeclarationNode, PropertyNode, SyntaxTree } from "../syntax/ast";
import type { UnbalancedData } from "../findings/data";
import type { FixRequest, TextFix } from "../findings/fix";
import { formatNumber, tableUnit, toTableUnit } from "../units/format";
import type { UnitSystem } from "../units/unit-table";
import { writtenUnitSystem } from "../model/written-units";
import {
  declarationNamed,
  finiteNumber as num,
  lineAfter,
  propertyOf,
  writeInDimension,
} from "../model/fix-words";
import { SPRING_KIND_TABLE, SPRING_KIND_WORDS } from "../model/spring-kinds";
import type { SpringKind } from "../model/types";

/** What the balance fix reads of a `balance.unbalanced` finding. */
export type BalanceFixData = Pick<
  UnbalancedData,
  "spring" | "best" | "worstHandForceBefore" | "worstHandForceAfter"
>;

/** Hand forces in a title to the hundredth of a newton: finer than anyone feels at the hand, and
 * a near-perfect fit then reads 0.00 N rather than 4.56e-10 N. */
function handForceText(n: number, system: UnitSystem): string {
  const v = toTableUnit(n, "force", system);
  const unit = tableUnit("force", system);
  return Math.abs(v) < 1000 ? `${v.toFixed(2)} ${unit}` : `${formatNumber(v)} ${unit}`;
}

/** The kind word a spring declaration carries (the first, as the model builder reads it). */
function springKindOf(decl: DeclarationNode): SpringKind | undefined {
  return SPRING_KIND_WORDS.find((k) => propertyOf(decl, k));
}

export function balanceFix(
  text: string,
  tree: SyntaxTree,
  data: BalanceFixData | undefined,
): TextFix | undefined {
  const springId = data?.spring;
  const decl = springId ? declarationNamed(tree, "spring", springId) : undefined;
  const kind = decl && springKindOf(decl);
  // What the best fit may write: the kind's fit settings (model/spring-kinds.ts).
  const settings = kind ? SPRING_KIND_TABLE[kind].fit : undefined;
  if (!decl || !settings) return undefined;
  const edits: TextFix["edits"] = [];
  const words: string[] = [];
  let anchor: PropertyNode | undefined;
  for (const setting of settings) {
    const value = num(data?.best?.[setting.key]);
    const prop = propertyOf(decl, setting.key);
    if (value === undefined || (setting.positive && value <= 0)) {
      if (setting.mustExist) return undefined;
      continue;
    }
    if (setting.mustExist && !prop) return undefined;
    // A negligible value the kind says to leave out gets no new line.
    if (setting.omitNegligible && !prop && Math.abs(value) < (setting.negligible ?? 0)) continue;
    const written = writeInDimension(value, prop?.values[0], setting.dimension);
    if (!written) return undefined;
    const v = prop?.values[0];
    if (prop && v) edits.push({ span: v.span, newText: written });
    else if (anchor) edits.push(lineAfter(text, anchor, `${setting.key} ${written}`));
    else return undefined;
    anchor ??= prop;
    words.push(`${setting.words} to ${written}`);
  }
  if (edits.length === 0) return undefined;
  // Hand forces in the system the spec is written in, as its messages are.
  const system = writtenUnitSystem(tree);
  const before = num(data?.worstHandForceBefore);
  const after = num(data?.worstHandForceAfter);
  const forces =
    before !== undefined && after !== undefined
      ? ` (worst hand force ${handForceText(before, system)} → ${handForceText(after, system)} over every payload)`
      : "";
  return { title: `Set ${springId}'s ${words.join(" and ")}${forces}`, edits, preferred: true };
}

/** The fixes of a balance finding (none for other codes). */
export function balanceFixes(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  if (req.code !== "balance.unbalanced") return [];
  const fix = balanceFix(text, tree, req.data);
  return fix ? [fix] : [];
}
