// Fastenings against published formulas: screw groups in shear and a moment and bolts tension
// from a tipping moment (Shigley ch. 8), metric thread dimensions and stress areas (ISO 68-1,
// ISO 724, ISO 898-1), thread stripping areas (FED-STD-H28/2 appendix A), glued joints.
import { describe, expect, it } from "vitest";
import {
  groupCentroid,
  groupShear,
  rowOfFasteners,
  tensionFromMoment,
} from "../../../server/src/mechanics/hardware/fastener-group";
import {
  basicPitchDiameter,
  boltShearStress,
  boltTensileStress,
  coarsePitch,
  externalMinorDiameter,
  externalThreadShearArea,
  FORMED_THREAD_ENGAGEMENT_SHARE,
  internalMinorDiameter,
  internalThreadShearArea,
  strippingForce,
  tensileStressArea,
  threadShearStrength,
  vonMisesStress,
} from "../../../server/src/mechanics/hardware/threads";
import {
  bondCombinedShearStress,
  bondShearStress,
  bondTorsionShearStress,
  PEEL_CAUTION,
} from "../../../server/src/mechanics/hardware/bond";
import { builtinMaterials } from "../../../server/src/model/materials";

const mm = 1e-3;

describe("screw groups (Shigley ch. 8, shear joints)", () => {
  it("two screws carry a moment as a couple: F = M / s", () => {
    const M = 3; // N m
    const s = 12 * mm;
    const g = groupShear(rowOfFasteners(2, s), { x: 0, y: 0 }, M);
    // secondary shear M r / sum r^2 with r = s/2 on each: M / s
    expect(g.largest).toBeCloseTo(M / s, 9);
    expect(g.forces[0]!.y).toBeCloseTo(-M / s, 9);
    expect(g.forces[1]!.y).toBeCloseTo(M / s, 9);
  });

  it("four screws on a square under an eccentric load: primary V/4 plus secondary M r / sum r^2", () => {
    // Shigley ch. 8: a bracket with four bolts at the corners of a square of side s, load V down
    // at distance e from the group's centroid; each bolt r = s / sqrt 2
    const s = 40 * mm;
    const V = 2000;
    const e = 100 * mm;
    const pts = [
      { x: -s / 2, y: -s / 2 },
      { x: s / 2, y: -s / 2 },
      { x: s / 2, y: s / 2 },
      { x: -s / 2, y: s / 2 },
    ];
    expect(groupCentroid(pts)).toEqual({ x: 0, y: 0 });
    // V downward at x = e: moment about the centroid M = -V e (clockwise)
    const g = groupShear(pts, { x: 0, y: -V }, -V * e);
    const r = s / Math.SQRT2;
    const primary = V / 4;
    const secondary = (V * e * r) / (4 * r * r);
    // the worst bolts are the two on the load's side, where the secondary shear (at 45 deg) adds
    // to the primary: |(0, -primary) + secondary (cos, sin) at 45 deg|
    const worst = Math.hypot(secondary * Math.SQRT1_2, primary + secondary * Math.SQRT1_2);
    expect(g.largest).toBeCloseTo(worst, 6);
    expect([1, 2]).toContain(g.index);
  });

  it("a single screw cannot carry a moment", () => {
    expect(groupShear(rowOfFasteners(1, 0), { x: 10, y: 0 }, 0).largest).toBeCloseTo(10, 12);
    expect(groupShear(rowOfFasteners(1, 0), { x: 0, y: 0 }, 1).largest).toBe(Infinity);
  });

  it("tension from a moment about a stated pivot edge: F_i = M c_i / sum c^2 (+ P / n)", () => {
    // Shigley ch. 8: bracket tipping about its lower edge, bolts 25 and 75 mm above it
    const c = [25 * mm, 75 * mm];
    const M = 60;
    const P = 100;
    const sum = c[0]! ** 2 + c[1]! ** 2;
    const t = tensionFromMoment(c, M, P);
    expect(t[1]).toBeCloseTo(P / 2 + (M * c[1]!) / sum, 9);
    expect(t[0]).toBeCloseTo(P / 2 + (M * c[0]!) / sum, 9);
    // the moment is carried: sum of F_i c_i equals M (with no pull)
    const m = tensionFromMoment(c, M);
    expect(m[0]! * c[0]! + m[1]! * c[1]!).toBeCloseTo(M, 9);
  });
});

describe("metric threads", () => {
  it("coarse pitches of ISO 261", () => {
    expect(coarsePitch(3 * mm)).toBeCloseTo(0.5 * mm, 12);
    expect(coarsePitch(6 * mm)).toBeCloseTo(1 * mm, 12);
    expect(coarsePitch(8 * mm)).toBeCloseTo(1.25 * mm, 12);
    expect(coarsePitch(7 * mm)).toBeUndefined();
  });

  it("basic diameters: d2 = d - 0.649519 P, D1 = d - 1.082532 P, d3 = d - 1.226869 P (ISO 68-1, ISO 724)", () => {
    // ISO 724, M6 x 1: d2 = 5.350, D1 = 4.917, d3 = 4.773 mm
    expect(basicPitchDiameter(6 * mm, 1 * mm) / mm).toBeCloseTo(5.35, 3);
    expect(internalMinorDiameter(6 * mm, 1 * mm) / mm).toBeCloseTo(4.917, 3);
    expect(externalMinorDiameter(6 * mm, 1 * mm) / mm).toBeCloseTo(4.773, 3);
  });

  it("stress areas of ISO 898-1: M3 5.03, M4 8.78, M5 14.2, M6 20.1, M8 36.6, M10 58.0 mm^2", () => {
    // ISO 898-1 table of nominal stress areas (from memory); As = (pi/4) ((d2 + d3) / 2)^2
    const table: [number, number][] = [
      [3, 5.03],
      [4, 8.78],
      [5, 14.2],
      [6, 20.1],
      [8, 36.6],
      [10, 58.0],
    ];
    for (const [d, As] of table) {
      const area = tensileStressArea(d * mm, coarsePitch(d * mm)!) / (mm * mm);
      expect(Math.abs(area / As - 1), `M${d}`).toBeLessThan(0.003);
    }
  });

  it("thread shear areas by FED-STD-H28/2 appendix A", () => {
    const d = 3 * mm;
    const P = 0.5 * mm;
    const Le = 6 * mm;
    const n = 1 / P;
    const d2 = d - 0.649519 * P;
    const D1 = d - 1.082532 * P;
    // internal thread: A_n = pi n Le d_s [1/(2n) + 0.57735 (d_s - E_n)], basic d_s = d, E_n = d2
    const An = Math.PI * n * Le * d * (1 / (2 * n) + 0.57735 * (d - d2));
    expect(internalThreadShearArea(Le, P, d) / An).toBeCloseTo(1, 6);
    // with basic dimensions that is 0.875 pi d Le
    expect(An / (Math.PI * d * Le)).toBeCloseTo(0.875, 4);
    // external thread: A_s = pi n Le D_n [1/(2n) + 0.57735 (E_s - D_n)], basic D_n = D1, E_s = d2
    const As = Math.PI * n * Le * D1 * (1 / (2 * n) + 0.57735 * (d2 - D1));
    expect(externalThreadShearArea(Le, P, d) / As).toBeCloseTo(1, 6);
    expect(As / (Math.PI * D1 * Le)).toBeCloseTo(0.75, 4);
    // a looser internal thread (larger pitch diameter) has less to shear
    expect(internalThreadShearArea(Le, P, d, d2 + 0.05 * mm)).toBeLessThan(An);
  });

  it("an M3 screw in printed PLA strips across its layers; a formed thread at 60 % (common practice)", () => {
    const pla = builtinMaterials().pla!;
    // distortion energy (Shigley ch. 5) on the layer strength: 0.577 x 0.5 x 56.6 MPa
    const Ss = threadShearStrength(pla);
    expect(Ss).toBeCloseTo(0.577 * pla.layerStrength!, 0);
    const area = internalThreadShearArea(6 * mm, 0.5 * mm, 3 * mm);
    const F = strippingForce(area, Ss);
    expect(F).toBeCloseTo(0.875 * Math.PI * 3 * mm * 6 * mm * 0.577 * 0.5 * 56.6e6, 0);
    expect(strippingForce(FORMED_THREAD_ENGAGEMENT_SHARE * area, Ss)).toBeCloseTo(0.6 * F, 9);
    // aluminium offers 0.577 of its yield
    expect(threadShearStrength(builtinMaterials().aluminium_6061_t6!)).toBeCloseTo(0.577 * 276e6, 0);
  });

  it("bolt stresses: tension on the stress area, shear on the root area, von Mises", () => {
    const d = 6 * mm;
    const P = 1 * mm;
    expect(boltTensileStress(2000, d, P)).toBeCloseTo(2000 / tensileStressArea(d, P), 3);
    const d3 = externalMinorDiameter(d, P);
    // double shear across the thread
    expect(boltShearStress(2000, d, P, 2)).toBeCloseTo(2000 / (2 * ((Math.PI / 4) * d3 * d3)), 3);
    // Shigley ch. 5: sigma' = sqrt(sigma^2 + 3 tau^2)
    expect(vonMisesStress(300e6, 100e6)).toBeCloseTo(Math.sqrt(300e6 ** 2 + 3 * 100e6 ** 2), 0);
  });
});

describe("glued joints", () => {
  it("mean lap shear F / A, a twist on a square patch, and the peel caution", () => {
    expect(bondShearStress(300, 200 * mm * mm)).toBeCloseTo(1.5e6, 3);
    // square patch of side a: J = A a^2 / 6, r = a / sqrt 2 (polar-moment method)
    const A = 400 * mm * mm;
    const a = 20 * mm;
    expect(bondTorsionShearStress(2, A)).toBeCloseTo((2 * (a / Math.SQRT2)) / ((A * a * a) / 6), 3);
    expect(bondCombinedShearStress(300, 2, A)).toBeCloseTo(
      bondShearStress(300, A) + bondTorsionShearStress(2, A),
      6,
    );
    expect(PEEL_CAUTION).toMatch(/peel/);
  });
});
