// The symbol table: every declaration and every reference, with the span of the referring name.
import { expect, test } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";

const text = readFileSync(join(__dirname, "..", "..", "samples", "camera-arm.poise"), "utf8");
const { symbols } = analyse(text, { modelOnly: true });
const word = (s: { start: number; end: number }) => text.slice(s.start, s.end);

test("declarations: names, kinds, points with their container, implicit bodies", () => {
  const decl = (id: string) => symbols!.declarations.find((d) => d.id === id);
  expect(decl("bench_clamp")).toMatchObject({ kind: "base", name: "bench_clamp" });
  expect(word(decl("bench_clamp")!.nameSpan)).toBe("bench_clamp");
  expect(decl("bench_clamp.anchor")).toMatchObject({
    kind: "point",
    name: "anchor",
    container: "bench_clamp",
  });
  expect(word(decl("bench_clamp.anchor")!.nameSpan)).toBe("anchor");
  expect(decl("reach")).toMatchObject({ kind: "parallelogram" });
  expect(decl("reach.lower")).toMatchObject({ kind: "body", container: "reach", implicit: true });
  expect(decl("lift")).toMatchObject({ kind: "spring" });
  expect(decl("camera")).toMatchObject({ kind: "payload" });
  expect(decl("require")).toMatchObject({ kind: "require" });
});

test("references: bodies, points, parallelograms, materials and payloads at their words", () => {
  const refs = symbols!.references.map((r) => `${word(r.span)} -> ${r.target.kind} ${r.target.id}`);
  expect(refs).toEqual(
    expect.arrayContaining([
      "bench_clamp -> base bench_clamp",
      "pivot -> point bench_clamp.pivot",
      "anchor -> point bench_clamp.anchor",
      "reach -> parallelogram reach",
      "lower -> body reach.lower",
      "head -> body reach.head",
      "aluminium_6061_t6 -> material aluminium_6061_t6",
      "steel_1018 -> material steel_1018",
      "camera -> payload camera",
    ]),
  );
  // Every `reach` written in a reference is found (for rename): in `reach.lower(...)` and `reach.head(...)`.
  const reachRefs = symbols!.references.filter(
    (r) => r.target.kind === "parallelogram" && r.target.id === "reach",
  );
  expect(reachRefs).toHaveLength(2);
});
