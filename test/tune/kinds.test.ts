// The search's fixes for every spring kind (issue 13): with no `tune` line, each spring changes
// what it is given by (cli.md: "every spring's rate and tension"): a coil-defined spring its wire
// and coils, a cord cut from a tube its cut length and strands, a gas strut its force, a torsion
// spring's coil and preload. Every value it writes is one the language takes, and the re-checked
// design is better than the present one.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { tuneDesign } from "../../server/src/tune/index";
import { applyEdits } from "../../server/src/tune/write";
import { arm } from "./lamp-boom";

const KINDS: { kind: string; spring: string; writes: string[] }[] = [
  {
    kind: "extension spring given by its coil",
    spring: `    extension
    between post.anchor and boom(100 mm, 0 mm)
    free_length 60 mm
    wire 1 mm
    coil 9 mm
    coils 40
    material music_wire
    initial_tension 2 N`,
    writes: ["wire", "coils", "initial_tension"],
  },
  {
    kind: "rubber cord cut from a tube",
    spring: `    elastic
    between post.anchor and boom(100 mm, 0 mm)
    free_length 90 mm
    tube 6 mm x 1.5 mm
    material natural_latex`,
    writes: ["free_length", "strands"],
  },
  {
    kind: "gas strut",
    spring: `    gas
    between post.low and boom(100 mm, 0 mm)
    force 20 N
    progression 1.2
    stroke 85 mm
    extended_length 180 mm`,
    writes: ["force"],
  },
  {
    kind: "torsion spring given by its coil",
    spring: `    torsion
    at shoulder
    wire 2 mm
    coil 20 mm
    coils 5
    material music_wire
    preload 0.5 N*m`,
    writes: ["wire", "coils", "preload"],
  },
];

describe("the search changes what each kind of spring is given by", () => {
  for (const k of KINDS) {
    it(k.kind, () => {
      const text = arm(k.spring);
      const before = analyse(text);
      const r = tuneDesign(text, { analyse, before });
      expect(r.improved, r.reason).toBe(true);
      expect(r.variables.map((v) => v.what).sort()).toEqual([...k.writes].sort());
      const tuned = applyEdits(text, r.edits);
      // Every value written is one the language takes: the tuned text has no model finding
      const after = analyse(tuned, { modelOnly: true });
      expect(after.findings.filter((f) => f.severity === "error")).toEqual([]);
      // Only the spring's own lines changed, and only those it is given by
      const was = new Set(text.split("\n"));
      const changed = tuned
        .split("\n")
        .filter((line) => !was.has(line))
        .map((line) => line.trim().split(" ")[0]);
      expect(changed.length).toBeGreaterThan(0);
      for (const key of changed) expect(k.writes).toContain(key);
      expect(r.worstAfter!).toBeLessThan(r.worstBefore!);
    });
  }
});
