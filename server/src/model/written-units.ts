// The unit system a spec is written in: the one most of its units belong to (deg, Hz and the
// like count for neither). Messages are written in it unless a reader asks for the other
// (analysis.ts), and a number written without a unit is offered the unit of it.
import type { SyntaxTree } from "../syntax/ast";
import { UNIT_SYMBOLS, type UnitSystem } from "../units/unit-table";
import { quantitiesIn } from "./fix-words";

/** The system of a unit as written, from its symbols: "us" if any is US customary, "si" if any is
 * SI, undefined when all belong to both (deg, s, Hz) or one cannot be read. */
function systemOfUnit(text: string): UnitSystem | undefined {
  let found: UnitSystem | undefined;
  for (const word of text.split(/[*/^0-9()-]+/)) {
    if (!word) continue;
    const u = UNIT_SYMBOLS.get(word);
    if (!u) return undefined;
    if (u.system === "us") return "us";
    if (u.system === "si") found = "si";
  }
  return found;
}

/** "us" when more of the spec's units are US customary than SI; "si" otherwise (a tie, or none). */
export function writtenUnitSystem(tree: SyntaxTree): UnitSystem {
  let si = 0;
  let us = 0;
  for (const arm of tree.arms)
    for (const props of [arm.properties, ...arm.declarations.map((d) => d.properties)])
      for (const p of props)
        for (const v of p.values)
          for (const q of quantitiesIn(v)) {
            if (!q.unit) continue;
            const system = systemOfUnit(q.unit.text);
            if (system === "us") us++;
            else if (system === "si") si++;
          }
  return us > si ? "us" : "si";
}
