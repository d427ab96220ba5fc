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

  it("the stiff aluminium camera and engraver arms raise none of these", () => {
    for (const sample of ["camera-arm.poise", "engraver-arm.poise"]) {
      const codes = codesOf(sample);
      expect(codes.filter((c) => STRUCTURAL.includes(c) || c.startsWith("strength."))).toEqual([]);
    }
  });

  it("the camera arm's clamp does not tip (tipping is for the magnifier's light clamp)", () => {
    expect(codesOf("camera-arm.poise")).not.toContain("geometry.tipping");
  });
});
