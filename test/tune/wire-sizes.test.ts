// A tuned coil spring's wire is a stock size (docs/tuning.md, "Wire sizes"): the search measures
// each candidate with its wire rounded to the nearest preferred diameter within the bounds, and
// the design it offers, with that size written, passes its re-check.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { tuneDesign } from "../../server/src/tune/index";
import { applyEdits } from "../../server/src/tune/write";
import { arm } from "./lamp-boom";

/** Nominal diameters of spring-steel wire from 0.5 mm to 3 mm, mm: the series of EN 10270-1
 * (patented cold-drawn unalloyed spring steel wire), from memory. */
const EN_10270_MM = [
  0.5, 0.53, 0.56, 0.6, 0.63, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9, 0.95, 1.0, 1.05, 1.1, 1.2, 1.25, 1.3, 1.4, 1.5,
  1.6, 1.7, 1.8, 1.9, 2.0, 2.1, 2.25, 2.4, 2.5, 2.6, 2.8, 3.0,
];

/** The wire diameter the tuned text gives, mm. */
function wireOf(text: string): number {
  const m = /^\s*wire ([\d.]+) mm$/m.exec(text);
  if (!m) throw new Error("no wire line");
  return Number(m[1]);
}

const CASES = [
  {
    kind: "an extension spring, no tune line",
    spring: `    extension
    between post.anchor and boom(100 mm, 0 mm)
    free_length 60 mm
    wire 1.03 mm
    coil 9 mm
    coils 40
    material music_wire
    initial_tension 2 N`,
  },
  {
    kind: "an extension spring whose wire a tune line frees",
    spring: `    extension
    between post.anchor and boom(100 mm, 0 mm)
    free_length 60 mm
    wire 1 mm
    coil 9 mm
    coils 40
    material music_wire
    initial_tension 2 N
    tune wire 0.6 mm .. 1.5 mm
    tune initial_tension 0 N .. 20 N`,
  },
  {
    kind: "a torsion spring, no tune line",
    spring: `    torsion
    at shoulder
    wire 2 mm
    coil 20 mm
    coils 5
    material music_wire
    preload 0.5 N*m`,
  },
];

describe("tuned wire is a stock size", () => {
  for (const c of CASES)
    it(c.kind, () => {
      const text = arm(c.spring);
      const before = analyse(text);
      const r = tuneDesign(text, { analyse, before });
      expect(r.improved, r.reason).toBe(true);
      const tuned = applyEdits(text, r.edits);
      const d = wireOf(tuned);
      // EN 10270-1 nominal diameters (from memory)
      expect(EN_10270_MM).toContain(d);
      const wire = r.springs[0]!.values.find((v) => v.what === "wire")!;
      expect(wire.after * 1000).toBeCloseTo(d, 9);
      // Re-checked with that size: no error the present design has not, a lower worst hand force
      const after = analyse(tuned);
      const errors = (a: typeof after) => a.findings.filter((f) => f.severity === "error").map((f) => f.code);
      for (const code of errors(after)) expect(errors(before)).toContain(code);
      expect(r.worstAfter!).toBeLessThan(r.worstBefore!);
    });
});
