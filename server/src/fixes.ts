// Every quick fix of the core, by finding: each family's fixes (the model builder's, balance,
// strength) as pure text edits, for the language server and the `poise` command alike. None is
// offered before recheck.ts has applied it to a copy and found the design no worse.
import { analyse } from "./analysis";
import type { SyntaxTree } from "./syntax/ast";
import type { FixRequest, TextFix } from "./findings/fix";
import { modelFixes } from "./model/fixes";
import { balanceFixes } from "./checks/balance-fixes";
import { strengthFixes, type Recheck } from "./checks/strength-fixes";

export type { FixRequest, TextFix };

/** The candidate fixes of one finding, from every family (each answers only its own codes). The
 * pin fix analyses edited texts itself, with `analyseText`. */
export function fixesFor(
  text: string,
  tree: SyntaxTree,
  req: FixRequest,
  analyseText: Recheck = analyse,
): TextFix[] {
  return [
    ...modelFixes(text, tree, req),
    ...balanceFixes(text, tree, req),
    ...strengthFixes(text, tree, req, analyseText),
  ];
}
