// Section properties for a space frame: second moments about both bending axes, torsion constant
// and torsional shear of rectangles, tubes and rods, against Roark's torsion table and the exact
// series of the rectangle (Prandtl's stress function).
import { describe, expect, it } from "vitest";
import { rectangleTorsion, sectionProperties } from "../../server/src/model/section";

/** Exact torsion of a solid rectangle a x b (a >= b) by Prandtl's stress function, summed to
 * convergence (Timoshenko and Goodier, Theory of Elasticity, 3rd ed., section 109, the series
 * solution of the rectangle): phi = G theta [(b^2/4 - y^2) - (8 b^2 / pi^3) sum_{n odd}
 * (-1)^((n-1)/2) / n^3 cosh(n pi x / b) / cosh(n pi a / 2b) cos(n pi y / b)], whence
 * K = (a b^3 / 3) [1 - (192 / pi^5) (b / a) sum tanh(n pi a / 2b) / n^5] and, at the middle of
 * the long sides, tau_max = G theta b [1 - (8 / pi^2) sum 1 / (n^2 cosh(n pi a / 2b))]. */
function exactRectangle(a: number, b: number): { K: number; Q: number } {
  let sumK = 0;
  let sumTau = 0;
  for (let n = 1; n < 200; n += 2) {
    const x = (n * Math.PI * a) / (2 * b);
    sumK += Math.tanh(x) / n ** 5;
    sumTau += x > 700 ? 0 : 1 / (n * n * Math.cosh(x));
  }
  const K = ((a * b ** 3) / 3) * (1 - (192 / Math.PI ** 5) * (b / a) * sumK);
  // tau_max = (T / (G K)) G b (1 - ...) = T / Q
  const Q = K / (b * (1 - (8 / Math.PI ** 2) * sumTau));
  return { K, Q };
}

describe("torsion of sections", () => {
  it("rectangle: Roark's K, and both K and tau_max against the exact series", () => {
    for (const ratio of [1, 1.5, 2, 4, 10]) {
      const b = 0.004;
      const a = ratio * b;
      const t = rectangleTorsion(a, b);
      const r = b / a;
      // Roark's Formulas for Stress and Strain, 7th ed., table 10.7, case 4 (docs/formulas.md):
      // K = a b^3 [1/3 - 0.21 (b/a)(1 - b^4 / (12 a^4))]
      expect(t.constant).toBeCloseTo(a * b ** 3 * (1 / 3 - 0.21 * r * (1 - b ** 4 / (12 * a ** 4))), 20);
      const exact = exactRectangle(a, b);
      // Timoshenko and Goodier, 3rd ed., section 109 (series above): Roark's K within 0.5 %
      expect(Math.abs(t.constant - exact.K) / exact.K).toBeLessThan(0.005);
      // same series: tau_max = T / Q within 0.5 %, and never low by more than 0.2 %
      expect(Math.abs(t.modulus - exact.Q) / exact.Q).toBeLessThan(0.005);
      expect(t.modulus).toBeLessThan(exact.Q * 1.002);
    }
    // the same section whichever side is written first (depth x width or width x depth)
    expect(rectangleTorsion(0.004, 0.012)).toEqual(rectangleTorsion(0.012, 0.004));
  });

  it("square: the classical coefficients K = 0.1406 a^4 and tau_max = T / (0.208 a^3)", () => {
    const a = 0.01;
    const p = sectionProperties({ shape: "rect", depth: a, width: a });
    // Timoshenko and Goodier, 3rd ed., section 109, table of k1 and k2 for a / b = 1 (from memory,
    // three figures): k1 = 0.141, k2 = 0.208
    expect(p.torsionConstant / a ** 4).toBeCloseTo(0.141, 3);
    expect(p.torsionModulus / a ** 3).toBeCloseTo(0.208, 3);
  });

  it("tube and rod: J = pi (D^4 - d^4) / 32 and tau = T (D/2) / J, exact", () => {
    const tube = sectionProperties({ shape: "tube", outerDiameter: 0.02, wall: 0.002 });
    const J = (Math.PI * (0.02 ** 4 - 0.016 ** 4)) / 32;
    // Roark 7th ed., table 10.7, case 10 (hollow concentric circle; docs/formulas.md): K = J
    expect(tube.torsionConstant).toBeCloseTo(J, 20);
    // same case: tau_max = 16 T D / (pi (D^4 - d^4)) at the outer surface (per unit torque)
    expect(tube.torsionModulus * ((16 * 0.02) / (Math.PI * (0.02 ** 4 - 0.016 ** 4)))).toBeCloseTo(1, 12);
    // a round section's polar moment is twice its diametral one (perpendicular-axis theorem)
    expect(tube.torsionConstant).toBeCloseTo(2 * tube.secondMoment, 20);
    const rod = sectionProperties({ shape: "rod", diameter: 0.01 });
    // Roark 7th ed., table 10.7, case 1 (solid circle): K = pi d^4 / 32, tau_max = 16 T / (pi d^3)
    expect(rod.torsionConstant).toBeCloseTo((Math.PI * 0.01 ** 4) / 32, 20);
    expect(rod.torsionModulus * (16 / (Math.PI * 0.01 ** 3))).toBeCloseTo(1, 12);
  });
});

describe("bending about both axes", () => {
  it("rectangle depth x width: in the plane b h^3 / 12, across it h b^3 / 12", () => {
    const p = sectionProperties({ shape: "rect", depth: 0.02, width: 0.006 });
    // Roark 8th ed., table of section properties: rectangle I = b h^3 / 12 about each centroidal axis
    expect(p.secondMoment).toBeCloseTo((0.006 * 0.02 ** 3) / 12, 20);
    expect(p.secondMomentAcross).toBeCloseTo((0.02 * 0.006 ** 3) / 12, 20);
    expect(p.extremeFibreAcross).toBe(0.003);
    // perpendicular-axis theorem: polar moment = sum of the two
    expect(p.polarMoment).toBeCloseTo(p.secondMoment + p.secondMomentAcross, 20);
  });
  it("round sections are the same about every axis", () => {
    for (const s of [
      { shape: "rod" as const, diameter: 0.012 },
      { shape: "tube" as const, outerDiameter: 0.012, wall: 0.0015 },
    ]) {
      const p = sectionProperties(s);
      // Roark 8th ed., table of section properties: circle and hollow circle, any diameter
      expect(p.secondMomentAcross).toBe(p.secondMoment);
      expect(p.extremeFibreAcross).toBe(p.extremeFibre);
    }
  });
});
