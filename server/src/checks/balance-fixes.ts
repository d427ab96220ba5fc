// The balance quick fix, as pure text edits: write the best-fit settings a `balance.unbalanced`
// finding carries into its spring, in the units the text already uses, and say the worst hand
// force before and after in the title.
import type { DeclarationNode, PropertyNode, SyntaxTree } from "../syntax/ast";
import type { UnbalancedData } from "../findings/data";
import type { FixRequest, TextFix } from "../findings/fix";
import type { DimensionName } from "../units/dimension";
import { formatNumber } from "../units/format";
import {
  declarationNamed,
  finiteNumber as num,
  lineAfter,
  propertyOf,
  writeInDimension,
} from "../model/fix-words";

/** What the balance fix reads of a `balance.unbalanced` finding. */
export type BalanceFixData = Pick<
  UnbalancedData,
  "spring" | "best" | "worstHandForceBefore" | "worstHandForceAfter"
>;

/** Hand forces in a title to the hundredth of a newton: finer than anyone feels at the hand, and
 * a near-perfect fit then reads 0.00 N rather than 4.56e-10 N. */
function handForceText(n: number): string {
  return Math.abs(n) < 1000 ? `${n.toFixed(2)} N` : `${formatNumber(n)} N`;
}

/** What the balance fit may write, by spring kind: property (the key of the finding's `best`),
 * dimension, and whether the property must already be written (else the fix adds it). */
const FIT_SETTINGS: Record<
  string,
  { key: string; dimension: DimensionName; words: string; mustExist: boolean }[]
> = {
  extension: [
    { key: "rate", dimension: "stiffness", words: "rate", mustExist: true },
    { key: "initial_tension", dimension: "force", words: "initial tension", mustExist: false },
  ],
  zero_length: [
    { key: "rate", dimension: "stiffness", words: "rate", mustExist: true },
    { key: "initial_tension", dimension: "force", words: "initial tension", mustExist: false },
  ],
  torsion: [
    { key: "rate", dimension: "angular_stiffness", words: "rate", mustExist: true },
    { key: "preload", dimension: "torque", words: "preload", mustExist: false },
  ],
  gas: [{ key: "force", dimension: "force", words: "force", mustExist: true }],
  elastic: [{ key: "area", dimension: "area", words: "cross-section", mustExist: true }],
};
/** An initial tension below this is not worth writing into a zero-length spring: hundredths of a
 * newton are below what a spring maker can set (common practice, no source). */
const NEGLIGIBLE_TENSION_N = 0.01;

function springKindOf(decl: DeclarationNode): string | undefined {
  return ["extension", "zero_length", "elastic", "gas", "torsion"].find((k) => propertyOf(decl, k));
}

export function balanceFix(
  text: string,
  tree: SyntaxTree,
  data: BalanceFixData | undefined,
): TextFix | undefined {
  const springId = data?.spring;
  const decl = springId ? declarationNamed(tree, "spring", springId) : undefined;
  const kind = decl && springKindOf(decl);
  const settings = kind ? FIT_SETTINGS[kind] : undefined;
  if (!decl || !settings) return undefined;
  const edits: TextFix["edits"] = [];
  const words: string[] = [];
  let anchor: PropertyNode | undefined;
  for (const setting of settings) {
    const value = num(data?.best?.[setting.key]);
    const prop = propertyOf(decl, setting.key);
    if (
      value === undefined ||
      (setting.dimension !== "torque" && setting.dimension !== "force" && value <= 0)
    ) {
      if (setting.mustExist) return undefined;
      continue;
    }
    if (setting.mustExist && !prop) return undefined;
    if (
      kind === "zero_length" &&
      setting.key === "initial_tension" &&
      !prop &&
      Math.abs(value) < NEGLIGIBLE_TENSION_N
    )
      continue;
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
  const before = num(data?.worstHandForceBefore);
  const after = num(data?.worstHandForceAfter);
  const forces =
    before !== undefined && after !== undefined
      ? ` (worst hand force ${handForceText(before)} → ${handForceText(after)} over every payload)`
      : "";
  return { title: `Set ${springId}'s ${words.join(" and ")}${forces}`, edits, preferred: true };
}

/** The fixes of a balance finding (none for other codes). */
export function balanceFixes(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  if (req.code !== "balance.unbalanced") return [];
  const fix = balanceFix(text, tree, req.data);
  return fix ? [fix] : [];
}
