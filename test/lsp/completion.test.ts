// Completion at the positions a designer types in, on the fast parse of the text as it stands
// (often half-written): what fits there and nothing that does not.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { TextDocument } from "vscode-languageserver-textdocument";
import { completionsAt } from "../../server/src/lsp/features/completion";
import { SyntaxViews } from "../../server/src/lsp/session/syntax-view";
import { BUILTIN_MATERIAL_IDS } from "../../server/src/model/materials";
import { UNITS_BY_DIMENSION } from "../../server/src/services/unit-words";

const root = join(__dirname, "..", "..");
const MAGNIFIER = readFileSync(join(root, "samples", "magnifier-arm.poise"), "utf8");

/** Completion labels where `|` stands in `text` (the bar itself is removed). */
function at(text: string): string[] {
  const offset = text.indexOf("|");
  const clean = text.slice(0, offset) + text.slice(offset + 1);
  const view = new SyntaxViews().view(
    TextDocument.create("file:///t.poise", "counterpoise", 1, clean),
    BUILTIN_MATERIAL_IDS,
  );
  return completionsAt(view, offset, true).map((i) => i.label);
}

/** The magnifier sample with `insert` typed on a new line inside the named declaration. */
function inside(decl: string, insert: string): string {
  const start = MAGNIFIER.indexOf(decl);
  const brace = MAGNIFIER.indexOf("{", start);
  return `${MAGNIFIER.slice(0, brace + 1)}\n    ${insert}\n${MAGNIFIER.slice(brace + 1)}`;
}

describe("completion", () => {
  it("offers `arm` outside any block", () => {
    expect(at("|")).toEqual(["arm"]);
  });

  it("offers the kind words first in a spring that has none yet", () => {
    const labels = at('arm "a" {\n  spring s {\n    |\n  }\n}\n');
    expect(labels.slice(0, 5).sort()).toEqual(["elastic", "extension", "gas", "torsion", "zero_length"]);
  });

  it("offers a torsion spring's properties only", () => {
    const labels = at(inside("spring lens_return", "|"));
    expect(labels).not.toContain("rate"); // already written
    expect(labels).not.toContain("between"); // not for torsion springs
    expect(labels).not.toContain("torsion"); // its kind is given
  });

  it("offers joints and parallelograms after a torsion spring's `at`", () => {
    expect(at(inside("spring lens_return", "at |")).sort()).toEqual(["lens_tilt", "stage"]);
  });

  it("offers payloads after `at` in require", () => {
    expect(at(inside("require", "deflection 1 mm at |"))).toEqual(["lens"]);
    expect(at(inside("require", "deflection 1 mm |"))).toEqual(["at"]);
  });

  it("offers every material after a pin's diameter, and after a section in bars", () => {
    const pin = at(inside("joint lens_tilt", "pin 3 mm |"));
    expect(pin.sort()).toEqual([...BUILTIN_MATERIAL_IDS].sort());
    expect(at(inside("parallelogram stage", "bars rect 8 mm x 4 mm |")).sort()).toEqual(
      [...BUILTIN_MATERIAL_IDS].sort(),
    );
    expect(at(inside("parallelogram stage", "bars rect 8 mm |"))).toEqual(["x"]);
    expect(at(inside("parallelogram stage", "bars |")).sort()).toEqual(["rect", "rod", "tube"]);
  });

  it("offers units of the property's dimension after a number, also glued to it", () => {
    expect(at(inside("link lens_arm", "length 90 |"))).toEqual([...UNITS_BY_DIMENSION.length]);
    expect(at(inside("spring lens_return", "max_angle 180 |"))).toEqual([...UNITS_BY_DIMENSION.angle]);
    expect(at(inside("spring lens_return", "preload 2|"))).toEqual([]);
    expect(at(inside("link lens_arm", "mass 12g|"))).toEqual([...UNITS_BY_DIMENSION.mass]);
    // A torsion spring's rate is angular.
    expect(at(inside("spring lens_return", "rate 0.004 |"))).toEqual([
      ...UNITS_BY_DIMENSION.angular_stiffness,
    ]);
  });

  it("offers lengths inside an inline point and `..` inside a range", () => {
    expect(at(inside("payload lens", "at lens_arm(10 |"))).toEqual([...UNITS_BY_DIMENSION.length]);
    expect(at(inside("joint lens_tilt", "range -80 deg |"))).toEqual([".."]);
    expect(at(inside("joint lens_tilt", "range -80 deg .. -20 |"))).toEqual([...UNITS_BY_DIMENSION.angle]);
  });

  it("offers bodies after `connects`, `to` after the first, and the parts of a parallelogram", () => {
    const bodies = at(inside("joint lens_tilt", "connects |"));
    expect(bodies).toEqual(
      expect.arrayContaining(["clamp", "lens_arm", "stage.lower", "stage.upper", "stage.head"]),
    );
    expect(at(inside("joint lens_tilt", "connects stage.head |"))).toEqual(["to"]);
    // the child of a joint is never the base (docs/language.md: the base is the fixed ground)
    const children = at(inside("joint lens_tilt", "connects stage.head to |"));
    expect(children).toContain("lens_arm");
    expect(children).not.toContain("clamp");
    expect(at(inside("joint lens_tilt", "connects stage.|")).sort()).toEqual(["head", "lower", "upper"]);
    expect(at(inside("joint lens_tilt", "connects clamp.|")).sort()).toEqual(["hook", "pivot"]);
    expect(at(inside("joint lens_tilt", "connects stage.lower.|")).sort()).toEqual(["end", "start"]);
  });

  it("offers what a `tune` line may free, then `..` and the property's units", () => {
    // docs/language.md, "Tuning": `tune anchor|hook REGION` or a numeric property of that kind within bounds
    const cord = at(inside("spring cord", "tune |"));
    expect(cord).toEqual(expect.arrayContaining(["anchor", "hook", "free_length", "strands"]));
    expect(cord).not.toContain("max_stretch"); // a limit the search keeps
    const torsion = at(inside("spring lens_return", "adjust |"));
    expect(torsion).toContain("preload");
    expect(torsion).not.toContain("anchor"); // a torsion spring acts at a joint: no ends to place
    expect(at(inside("spring cord", "tune free_length 80 |"))).toEqual([...UNITS_BY_DIMENSION.length]);
    expect(at(inside("spring cord", "tune free_length 80 mm |"))).toEqual([".."]);
  });

  it("stays quiet in comments and strings", () => {
    expect(at(inside("link lens_arm", "# length 90 |"))).toEqual([]);
    expect(at('arm "a |" {\n}')).toEqual([]);
  });
});
