// Quick fixes as text edits (the core's fix producers), on the real parser: the balance fix writes
// the best-fit values in the user's own units, the unit fix the property's usual unit, the name fix
// the suggestion.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { parse } from "../../server/src/syntax/parser";
import { balanceFix } from "../../server/src/checks/balance-fixes";
import { fixesFor, type TextFix } from "../../server/src/fixes";
import {
  missingUnitFix,
  unknownNameFix,
  suggestionOf,
  suggestedValueFix,
} from "../../server/src/model/fixes";
import { analyse } from "../../server/src/analysis";
import { isCode } from "../../server/src/findings/finding";
import { PENDULUM_TEXT, K_BALANCED, spanOf } from "../view/pendulum-fixture";

function apply(text: string, fix: TextFix): string {
  let out = text;
  for (const e of [...fix.edits].sort((a, b) => b.span.start - a.span.start))
    out = out.slice(0, e.span.start) + e.newText + out.slice(e.span.end);
  return out;
}

describe("balance quick fix", () => {
  it("writes the best-fit rate in the unit the rate was written in, and names both hand forces", () => {
    const tree = parse(PENDULUM_TEXT);
    const fix = balanceFix(PENDULUM_TEXT, tree, {
      spring: "lift",
      best: { rate: K_BALANCED, initial_tension: 0 },
      worstHandForceBefore: 4.41,
      worstHandForceAfter: 0.02,
    })!;
    expect(fix).toBeDefined();
    const edited = apply(PENDULUM_TEXT, fix);
    // Exact unit definition: 1 N/mm = 1000 N/m (SI prefixes, SI Brochure 9th ed.).
    const written = Number(/rate ([\d.]+) N\/mm/.exec(edited)![1]);
    expect(written).toBeCloseTo(K_BALANCED / 1000, 3);
    expect(fix.title).toContain("4.41 N → 0.02 N");
    // A zero-length spring gets no initial tension line (only extension springs take one here).
    expect(edited).not.toContain("initial_tension");
  });

  it("adds an initial tension line to an extension spring that has none, indented like its rate", () => {
    const text = PENDULUM_TEXT.replace("zero_length", "extension").replace(
      "rate 0.55 N/mm",
      "rate 3.1 lbf/in\n    free_length 40 mm",
    );
    const fix = balanceFix(text, parse(text), {
      spring: "lift",
      best: { rate: 600, initial_tension: 22.2 },
      worstHandForceBefore: 3,
      worstHandForceAfter: 0.5,
    })!;
    const edited = apply(text, fix);
    // NIST SP 811: 1 lbf/in = 4.4482216152605 N / 0.0254 m = 175.1268 N/m.
    expect(Number(/rate ([\d.]+) lbf\/in/.exec(edited)![1])).toBeCloseTo(600 / (4.4482216152605 / 0.0254), 2);
    expect(edited).toContain("\n    rate ");
    expect(edited).toMatch(/\n    initial_tension 22\.2 N\n/);
  });

  it("writes a torsion spring's rate and its preload as a torque, even where the preload was an angle", () => {
    const text = readFileSync("samples/magnifier-arm.poise", "utf8");
    const fix = balanceFix(text, parse(text), {
      spring: "lens_return",
      best: { rate: 0.5, preload: 0.12 },
      worstHandForceBefore: 9,
      worstHandForceAfter: 0.5,
    })!;
    const edited = apply(text, fix);
    // 1 N*m/deg = 180/pi N*m/rad (definition of the degree, SI Brochure 9th ed., table 8).
    expect(Number(/rate ([\d.]+) N\*m\/deg/.exec(edited)![1])).toBeCloseTo((0.5 * Math.PI) / 180, 6);
    expect(edited).toContain("preload 0.12 N*m");
    expect(fix.title).toContain("preload to 0.12 N*m");
  });

  it("offers nothing without the finding's data", () => {
    expect(balanceFix(PENDULUM_TEXT, parse(PENDULUM_TEXT), undefined)).toBeUndefined();
  });
});

describe("unit and name quick fixes", () => {
  const mistakes = readFileSync("samples/mistakes.poise", "utf8");
  it("adds the usual unit of a length to `length 250`", () => {
    const at = spanOf(mistakes, "length 250");
    const number = { start: at.start + 7, end: at.end };
    const fix = missingUnitFix(parse(mistakes), number, undefined)!;
    expect(fix.title).toBe("Add the unit: 250 mm");
    expect(apply(mistakes, fix)).toContain("length 250 mm   ");
  });

  it("takes the suggestion from the finding's data, never from its message", () => {
    expect(suggestionOf({ suggestion: "pla" })).toBe("pla");
    expect(suggestionOf(undefined)).toBeUndefined();
    const span = spanOf(mistakes, "plaa");
    const found = analyse(mistakes, { modelOnly: true })
      .findings.filter(isCode("name.unknown"))
      .find((f) => f.span.start === span.start)!;
    expect(found.data.suggestion).toBe("pla");
    const fix = unknownNameFix(mistakes, span, found.data)!;
    expect(apply(mistakes, fix)).toContain("material pla   ");
  });

  it("writes a reversed range the right way round from the finding's suggestion", () => {
    const span = spanOf(mistakes, "60 deg .. 10 deg");
    const fix = suggestedValueFix(mistakes, span, { suggestion: "10 deg .. 60 deg" })!;
    expect(apply(mistakes, fix)).toContain("range 10 deg .. 60 deg");
  });

  it("replaces only the point of a dotted reference", () => {
    const span = spanOf(mistakes, "boom.tip");
    const fix = unknownNameFix(mistakes, span, { suggestion: "end" })!;
    expect(apply(mistakes, fix)).toContain("connects boom.end to forearm.start");
  });
});

describe("spelling fixes of keywords and property names", () => {
  it("a mistyped property and a mistyped declaration keyword are changed to the suggestion, and the finding goes", () => {
    const text =
      'arm "a" {\n  base b { point p (0 mm, 100 mm) }\n  lnk boom {\n    lenght 300 mm\n    mass 50 g\n  }\n}\n';
    let edited = text;
    for (const code of ["property.unknown", "declaration.unknown"]) {
      const f = analyse(edited, { modelOnly: true }).findings.find((x) => x.code === code)!;
      expect(f, code).toBeDefined();
      const [fix] = fixesFor(edited, parse(edited), f);
      expect(fix, code).toBeDefined();
      edited = apply(edited, fix!);
    }
    expect(edited).toContain("  link boom {\n    length 300 mm");
    const codes = analyse(edited, { modelOnly: true }).findings.map((f) => f.code);
    expect(codes).not.toContain("property.unknown");
    expect(codes).not.toContain("declaration.unknown");
  });
});
