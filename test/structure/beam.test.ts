// Internal loads of a straight body from its point loads and own weight (beam.ts) against Roark's
// beam cases, and the Jacobi eigen solver used by the frame's mode search on a hand case.
import { describe, expect, it } from "vitest";
import { symmetricEigen } from "../../server/src/mechanics/structure/dense";
import { beamStress } from "../../server/src/mechanics/structure/beam";
import { sectionProperties } from "../../server/src/model/section";

const tube = sectionProperties({ shape: "tube", outerDiameter: 0.02, wall: 0.002 });
const L = 0.4;
const P = 10;

describe("beam free body", () => {
  it("cantilever root stress from its reactions", () => {
    // reactions of the wall on the beam: up P and couple P L (CCW); load P down at the tip
    const r = beamStress(
      [
        { s: 0, offset: 0, fx: 0, fy: P, couple: P * L },
        { s: L, offset: 0, fx: 0, fy: -P, couple: 0 },
      ],
      { qx: 0, qy: 0 },
      L,
      tube,
    );
    // Roark 8th ed., table 8.1 case 1a: root moment W l; sigma = M c / I, worked 8.626 MPa
    expect(r.stress / 1e6).toBeCloseTo((P * L * 0.01) / tube.secondMoment / 1e6, 9);
    expect(r.stress / 1e6).toBeCloseTo(8.626, 3);
    expect(r.at.s).toBe(0);
  });
  it("simply supported beam under its own weight peaks at mid-span", () => {
    const w = 20; // N/m down
    const r = beamStress(
      [
        { s: 0, offset: 0, fx: 0, fy: (w * L) / 2, couple: 0 },
        { s: L, offset: 0, fx: 0, fy: (w * L) / 2, couple: 0 },
      ],
      { qx: 0, qy: -w },
      L,
      tube,
    );
    // Roark 8th ed., table 8.1 case 2e (uniform load, simple supports): M_max = w l^2 / 8 at mid-span
    expect(r.moment).toBeCloseTo((w * L * L) / 8, 12);
    expect(r.at.s).toBeCloseTo(L / 2, 12);
  });
  it("a point load at mid-span: the moment peaks under it, the shear changes side there", () => {
    const r = beamStress(
      [
        { s: 0, offset: 0, fx: 0, fy: P / 2, couple: 0 },
        { s: L / 2, offset: 0, fx: 0, fy: -P, couple: 0 },
        { s: L, offset: 0, fx: 0, fy: P / 2, couple: 0 },
      ],
      { qx: 0, qy: 0 },
      L,
      tube,
    );
    // Roark 8th ed., table 8.1 case 2a (simple supports, centre load): M_max = W l / 4 at mid-span
    expect(r.moment).toBeCloseTo((P * L) / 4, 12);
    expect(r.at.s).toBe(L / 2);
    // the section just before the load carries the shear of the left support (+W/2 upward
    // reaction: internal shear -W/2 by the sign convention of sectionLoadAt)
    expect(r.at.shear).toBeCloseTo(-P / 2, 12);
  });
  it("axial compression and an offset hook", () => {
    // a two-force member pushed end to end through hooks 10 mm off its axis
    const F = 100;
    const r = beamStress(
      [
        { s: 0, offset: 0.01, fx: F, fy: 0, couple: 0 },
        { s: L, offset: 0.01, fx: -F, fy: 0, couple: 0 },
      ],
      { qx: 0, qy: 0 },
      L,
      tube,
    );
    // statics: compression F, moment F e along the whole bar; sigma = F/A + F e c / I
    expect(r.compression).toBeCloseTo(F, 12);
    expect(r.stress).toBeCloseTo(F / tube.area + (F * 0.01 * 0.01) / tube.secondMoment, 6);
  });
});

describe("Jacobi eigenvalues", () => {
  it("Jacobi eigenvalues of a small symmetric matrix", () => {
    // [[2, 1], [1, 2]] has eigenvalues 1 and 3 (hand calculation: det = (2 - x)^2 - 1)
    const { values } = symmetricEigen(new Float64Array([2, 1, 1, 2]), 2);
    expect(values[0]).toBeCloseTo(1, 12);
    expect(values[1]).toBeCloseTo(3, 12);
  });

  it("tridiagonal (2, -1): eigenvalues 2 - 2 cos(k pi / (n + 1))", () => {
    const n = 30;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      a[i * n + i] = 2;
      if (i > 0) a[i * n + i - 1] = a[(i - 1) * n + i] = -1;
    }
    const { values } = symmetricEigen(a, n);
    // the standard closed form of the second-difference matrix (e.g. Golub and Van Loan, 4th ed.)
    for (let k = 1; k <= 3; k++)
      expect(values[k - 1]).toBeCloseTo(2 - 2 * Math.cos((k * Math.PI) / (n + 1)), 10);
  });
});
