// The samples build as their comments promise: the three designs without syntax or model errors,
// and each commented mistake of samples/mistakes.poise with its finding on its line.
import { describe, expect, test } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { LineIndex } from "../../server/src/syntax/span";
import type { Code } from "../../server/src/findings/codes";

const sample = (name: string) => readFileSync(join(__dirname, "..", "..", "samples", name), "utf8");

describe("design samples", () => {
  const designs = readdirSync(join(__dirname, "..", "..", "samples")).filter(
    (f) => f.endsWith(".poise") && f !== "mistakes.poise",
  );
  test("the design samples are there", () => expect(designs.length).toBeGreaterThanOrEqual(3));
  for (const name of designs) {
    test(`${name} has no syntax or model findings`, () => {
      const a = analyse(sample(name), { modelOnly: true });
      expect(a.findings.map((f) => `${f.code}: ${f.message}`)).toEqual([]);
      expect(a.model).toBeDefined();
      expect(a.model!.payloads.length).toBeGreaterThan(0);
    });
  }
});

/** What the comments of mistakes.poise say, mapped to the code that says it. */
const PROMISES: [RegExp, Code][] = [
  [/impossible value/, "value.impossible"],
  [/unknown name/, "name.unknown"],
  [/missing unit/, "unit.missing"],
  [/wrong dimension/, "unit.wrong-dimension"],
  [/reversed range/, "value.impossible"],
  [/unknown point/, "name.unknown-point"],
  [/unknown property/, "property.unknown"],
  [/duplicate name/, "name.duplicate"],
  [/no loop holds it/, "joint.unheld"],
];

test("samples/mistakes.poise: each commented mistake yields its finding, and nothing else", () => {
  const text = sample("mistakes.poise");
  const index = new LineIndex(text);
  const lines = text.split("\n");
  const promised: { line: number; code: Code }[] = [];
  for (const [i, line] of lines.entries()) {
    const hash = line.indexOf("#");
    if (hash <= 0 || line.slice(0, hash).trim() === "") continue; // comment lines, not trailing ones
    const comment = line.slice(hash);
    const match = PROMISES.find(([re]) => re.test(comment));
    expect(match, `no code for the comment on line ${i + 1}: ${comment}`).toBeDefined();
    promised.push({ line: i, code: match![1] });
  }
  expect(promised.length).toBeGreaterThanOrEqual(8);
  const a = analyse(text, { modelOnly: true });
  const got = a.findings.map((f) => ({ line: index.position(f.span.start).line, code: f.code }));
  expect(got).toEqual(promised);
});
