// Every quick fix of the core, by finding: each family's fixes (the model builder's, balance,
// strength) as pure text edits, for the language server and the `poise` command alike. The pin
// fix re-analyses the edited text, so its answers are remembered per text and finding.
import { analyse } from "./analysis";
import type { SyntaxTree } from "./syntax/ast";
import type { FixRequest, TextFix } from "./findings/fix";
import { modelFixes } from "./model/fixes";
import { balanceFixes } from "./checks/balance-fixes";
import { strengthFixes } from "./checks/strength-fixes";

export type { FixRequest, TextFix };

/** The fixes of one finding, from every family (each answers only its own codes). */
export function fixesFor(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  return [
    ...modelFixes(text, tree, req),
    ...balanceFixes(text, tree, req),
    ...strengthFixes(text, tree, req, analyse),
  ];
}

/** Pin fixes analyse the text again; remember the answer per text and diagnostic. */
const PIN_CACHE_SIZE = 32;
const pinCache = new Map<string, TextFix[]>();

/** `fixesFor`, remembering the fixes that re-analyse (the pin's). */
export function cachedFixes(text: string, tree: SyntaxTree, req: FixRequest): TextFix[] {
  if (req.code !== "strength.overstress") return fixesFor(text, tree, req);
  const key = `${text.length}:${hash(text)}:${req.span.start}:${JSON.stringify(req.data)}`;
  const hit = pinCache.get(key);
  if (hit) return hit;
  const fixes = fixesFor(text, tree, req);
  if (pinCache.size >= PIN_CACHE_SIZE) pinCache.delete(pinCache.keys().next().value!);
  pinCache.set(key, fixes);
  return fixes;
}

function hash(s: string): number {
  let h = 2166136261;
  for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 16777619);
  return h >>> 0;
}
