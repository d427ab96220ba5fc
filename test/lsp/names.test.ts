// The name index of a spec, read from its syntax tree: every occurrence of a name resolves as the
// model builder reads references (longest dotted prefix naming a body, then one point), so that
// definition, references and rename agree with the model.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { parse } from "../../server/src/syntax/parser";
import { buildModel } from "../../server/src/model/build";
import { BUILTIN_MATERIAL_IDS } from "../../server/src/model/materials";
import {
  buildNameIndex,
  mergeNameIndexes,
  nameIndexFromSymbols,
  occurrenceAt,
  occurrencesOf,
  type NameIndex,
} from "../../server/src/services/names";

const root = join(__dirname, "..", "..");
const samples = ["camera-arm", "engraver-arm", "magnifier-arm", "mistakes"].map((n) =>
  readFileSync(join(root, "samples", `${n}.poise`), "utf8"),
);
const MAGNIFIER = samples[2]!;

function textsOf(text: string, id: string): string[] {
  const index = buildNameIndex(parse(text), BUILTIN_MATERIAL_IDS);
  return occurrencesOf(index, id).map((o) => text.slice(o.span.start, o.span.end));
}

describe("name index", () => {
  it("counts a parallelogram's name in the prefixes of its bodies", () => {
    const index = buildNameIndex(parse(MAGNIFIER), BUILTIN_MATERIAL_IDS);
    const all = occurrencesOf(index, "stage");
    // `parallelogram stage`, `stage.lower(60 mm, 0 mm)`, `connects stage.head ...`.
    expect(all.map((o) => o.declaration)).toEqual([true, false, false]);
    expect(occurrencesOf(index, "stage.head").map((o) => MAGNIFIER.slice(o.span.start, o.span.end))).toEqual([
      "head",
    ]);
  });

  it("resolves named and built-in points", () => {
    expect(textsOf(MAGNIFIER, "clamp.hook")).toEqual(["hook", "hook"]);
    const index = buildNameIndex(parse(MAGNIFIER), BUILTIN_MATERIAL_IDS);
    const end = occurrenceAt(index, MAGNIFIER.indexOf("lens_arm.end") + "lens_arm.".length + 1);
    expect(end?.symbolId).toBe("lens_arm.end");
    expect(index.symbols.get("lens_arm.end")).toMatchObject({
      builtin: true,
      renameable: false,
      parent: "lens_arm",
    });
  });

  it("finds built-in materials in every material position", () => {
    // `bars rect 8 mm x 4 mm petg`, `material petg`, a fastening's `into petg` and a bearing's
    // `material petg`.
    expect(textsOf(MAGNIFIER, "petg")).toEqual(["petg", "petg", "petg", "petg"]);
    // `pins 3 mm stainless_304` and `pin 3 mm stainless_304`.
    expect(textsOf(MAGNIFIER, "stainless_304")).toEqual(["stainless_304", "stainless_304"]);
  });

  it("agrees with the model builder's own symbol table on every sample", () => {
    for (const text of samples) {
      const tree = parse(text);
      const built = buildModel(tree, text);
      const index = buildNameIndex(tree, BUILTIN_MATERIAL_IDS);
      const ours = index.occurrences
        .filter((o) => !o.declaration)
        .map((o) => `${o.span.start}:${o.symbolId}`)
        .sort();
      const theirs = built.symbols.references.map((r) => `${r.span.start}:${r.target.id}`).sort();
      // Every reference the model builder resolved, the index resolves to the same id.
      expect(ours).toEqual(expect.arrayContaining(theirs));
    }
  });

  it("reads the same from the model builder's table as from the tree alone", () => {
    const flat = (index: NameIndex) => ({
      occurrences: index.occurrences.map(
        (o) => `${o.span.start}-${o.span.end}:${o.symbolId}:${o.declaration}`,
      ),
      symbols: [...index.symbols.values()]
        .map((x) => `${x.id}:${x.kind}:${x.name}:${x.builtin}:${x.renameable}:${x.parent ?? ""}`)
        .sort(),
      bodies: [...index.bodies].sort(),
    });
    for (const text of samples.slice(0, 3)) {
      const tree = parse(text);
      const fromModel = nameIndexFromSymbols(buildModel(tree, text).symbols, BUILTIN_MATERIAL_IDS);
      expect(flat(fromModel)).toEqual(flat(buildNameIndex(tree, BUILTIN_MATERIAL_IDS)));
    }
  });

  it("completes the builder's table with what only the tree resolves", () => {
    const mistakes = samples[3]!;
    const tree = parse(mistakes);
    const merged = mergeNameIndexes(
      nameIndexFromSymbols(buildModel(tree, mistakes).symbols, BUILTIN_MATERIAL_IDS),
      buildNameIndex(tree, BUILTIN_MATERIAL_IDS),
    );
    // `connects boom.tip to ...`: `tip` is no point of boom, but `boom` is still boom.
    const inTip = occurrenceAt(merged, mistakes.indexOf("boom.tip") + 1);
    expect(inTip?.symbolId).toBe("boom");
  });
});
