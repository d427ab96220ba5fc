// The samples through the whole analysis: the structural and geometric diagnostics appear where
// a designer would expect them and nowhere else.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";

function codesOf(sample: string): string[] {
  const text = readFileSync(new URL(`../../samples/${sample}`, import.meta.url), "utf8");
  return analyse(text).findings.map((f) => f.code);
}

const STRUCTURAL = [
  "geometry.spring-toggle",
  "geometry.tilt",
  "stiffness.tilt",
  "stiffness.low-frequency",
  "stiffness.deflection",
];

describe("samples", () => {
  it("the slender printed magnifier stage bounces and tilts", () => {
    const codes = codesOf("magnifier-arm.poise");
    expect(codes).toContain("stiffness.low-frequency");
    expect(codes).toContain("stiffness.tilt");
    // its bars differ by 2 mm (upper_length) against a 1 deg tilt limit
    expect(codes).toContain("geometry.tilt");
  });

  it("the lamp's over-centre spring toggles", () => {
    const codes = codesOf("lamp-arm.poise");
    expect(codes).toContain("geometry.spring-toggle");
    expect(codes.filter((c) => c.startsWith("stiffness."))).toEqual([]);
  });

  it("the stiff aluminium camera arm raises none of these", () => {
    const codes = codesOf("camera-arm.poise");
    expect(codes.filter((c) => STRUCTURAL.includes(c) || c.startsWith("strength."))).toEqual([]);
  });

  it("the engraver's flat bars are strong and stiff in the plane but sway sideways", () => {
    const text = readFileSync(new URL("../../samples/engraver-arm.poise", import.meta.url), "utf8");
    const findings = analyse(text).findings;
    const codes = findings.map((f) => f.code);
    expect(codes.filter((c) => c.startsWith("strength.") || c === "stiffness.deflection")).toEqual([]);
    const low = findings.find((f) => f.code === "stiffness.low-frequency");
    expect(low?.message).toContain("sway sideways");
  });

  it("a spring hook a few mm off a bar's axis leaves every stiffness figure in place (issue 10 item 1)", () => {
    const text = readFileSync(new URL("../../samples/engraver-arm.poise", import.meta.url), "utf8");
    for (const offsetMm of [0.5, 1, 3, 6, 10]) {
      const moved = text.replace("outer.lower(100 mm, 0 mm)", `outer.lower(110 mm, ${offsetMm} mm)`);
      expect(moved).not.toEqual(text);
      const a = analyse(moved);
      expect(a.findings.filter((f) => f.code === "stiffness.not-computed")).toEqual([]);
      const labels = a.readouts["engraver"]!.figures.map((f) => f.label);
      expect(labels).toEqual(
        expect.arrayContaining([
          "deflection under load",
          "elastic tilt",
          "lowest natural frequency of the arm",
        ]),
      );
    }
  });

  it("the camera arm's clamp does not tip (tipping is for the magnifier's light clamp)", () => {
    expect(codesOf("camera-arm.poise")).not.toContain("geometry.tipping");
  });

  it("the two-stage arm's thin first-stage flats let the tool lean with the barrel turned; tubes fix it", () => {
    const text = readFileSync(new URL("../../samples/two-stage-arm.poise", import.meta.url), "utf8");
    const a = analyse(text);
    const lean = a.findings.find((f) => f.code === "stiffness.lean");
    // the lean appears only with the outer stage turned, and the first stage's bars give it
    expect(lean?.message).toMatch(/barrel turned -?\d+ deg/);
    expect(lean?.data.subject).toMatch(/^first\./);
    const fixed = readFileSync(new URL("../../samples/two-stage-arm-fixed.poise", import.meta.url), "utf8");
    const b = analyse(fixed);
    expect(b.findings.filter((f) => f.severity !== "information")).toEqual([]);
    // the fix leans far less: the tubes hold in twist and sideways
    const leanOf = (x: typeof a) =>
      x.readouts["tool"]!.figures.find((f) => f.label.startsWith("elastic lean"))!.value;
    expect(leanOf(b)).toBeLessThan(leanOf(a) / 10);
  });
});
