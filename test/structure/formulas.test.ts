// Closed-form strength formulas checked against the published formulas and worked values
// (docs/formulas.md): sections, pins, columns, extension-spring bodies.
import { describe, expect, it } from "vitest";
import { sectionProperties } from "../../server/src/model/section";
import {
  bearingStress,
  bearingStressWithMoment,
  doubleShearStressWithCouple,
  pinBendingStress,
  pinShearStress,
  shearYieldStrength,
  tubeBearingStressWithMoment,
} from "../../server/src/mechanics/structure/pin";
import {
  columnCriticalLoad,
  eulerCriticalLoad,
  johnsonCriticalLoad,
  transitionSlenderness,
} from "../../server/src/mechanics/structure/column";
import {
  bergstraesserFactor,
  coilBodyShearStress,
  EXTENSION_BODY_ALLOWABLE_RATIO,
  minimumTensileStrength,
  MUSIC_WIRE_STRENGTH,
  springIndex,
  wahlFactor,
} from "../../server/src/mechanics/structure/spring-stress";

describe("section properties", () => {
  it("tube 20 x 2 mm wall", () => {
    const p = sectionProperties({ shape: "tube", outerDiameter: 0.02, wall: 0.002 });
    // Roark 8th ed., table of section properties: hollow circle I = pi (D^4 - d^4) / 64
    expect(p.secondMoment).toBeCloseTo((Math.PI * (0.02 ** 4 - 0.016 ** 4)) / 64, 15);
    // docs/formulas.md worked value (same formula): I = 4.637e-9 m^4
    expect(p.secondMoment).toBeCloseTo(4.637e-9, 11);
    // Roark 8th ed.: area of a hollow circle pi (D^2 - d^2) / 4
    expect(p.area).toBeCloseTo((Math.PI * (0.02 ** 2 - 0.016 ** 2)) / 4, 12);
  });
  it("rectangle and rod", () => {
    const r = sectionProperties({ shape: "rect", depth: 0.008, width: 0.004 });
    // Roark 8th ed., table of section properties: rectangle I = b h^3 / 12 about the width axis
    expect(r.secondMoment).toBeCloseTo((0.004 * 0.008 ** 3) / 12, 16);
    const d = sectionProperties({ shape: "rod", diameter: 0.01 });
    // Roark 8th ed.: solid circle I = pi d^4 / 64
    expect(d.secondMoment).toBeCloseTo((Math.PI * 0.01 ** 4) / 64, 16);
  });
});

describe("pins and holes", () => {
  const F = 500;
  const d = 0.004;
  it("shear in single and double shear", () => {
    // Shigley ch. 5 / docs/formulas.md: tau = F / (n pi d^2 / 4); worked 39.79 and 19.89 MPa
    expect(pinShearStress(F, d, 1) / 1e6).toBeCloseTo(F / ((Math.PI * 0.004 ** 2) / 4) / 1e6, 9);
    expect(pinShearStress(F, d, 1) / 1e6).toBeCloseTo(39.79, 2);
    expect(pinShearStress(F, d, 2) / 1e6).toBeCloseTo(19.89, 2);
  });
  it("bearing in a 3 mm plate", () => {
    // bearing stress F / (d t); docs/formulas.md worked 41.67 MPa
    expect(bearingStress(F, d, 0.003) / 1e6).toBeCloseTo(41.67, 2);
  });
  it("a moment across the pin, carried as a couple (docs/formulas.md worked values)", () => {
    const f = 20;
    const M = 0.5;
    const pin = 0.005;
    const t = 0.003;
    const A = (Math.PI * pin * pin) / 4;
    // double shear: (F / 2 + M / s) / A, s the wall between the planes; worked 8.998 MPa
    expect(doubleShearStressWithCouple(f, M, pin, t)).toBeCloseTo((f / 2 + M / t) / A, 6);
    expect(doubleShearStressWithCouple(f, M, pin, t) / 1e6).toBeCloseTo(8.998, 3);
    // linear pressure along a rigid pin: F / (d t) + 6 M / (d t^2); worked 68.00 MPa
    expect(bearingStressWithMoment(f, M, pin, t) / 1e6).toBeCloseTo(68.0, 2);
    // Shigley table A-18: a solid round's section modulus pi d^3 / 32
    expect(pinBendingStress(M, pin)).toBeCloseTo(M / ((Math.PI * pin ** 3) / 32), 6);
    // a tube's two walls 2 mm thick, 23 mm apart: F / (2 d w) + M / (spacing d w)
    expect(tubeBearingStressWithMoment(f, M, pin, 0.002, 0.023)).toBeCloseTo(
      f / (2 * pin * 0.002) + M / 0.023 / (pin * 0.002),
      6,
    );
    // no moment: the planar figures exactly
    expect(doubleShearStressWithCouple(f, 0, pin, t)).toBe(pinShearStress(f, pin, 2));
    expect(bearingStressWithMoment(f, 0, pin, t)).toBe(bearingStress(f, pin, t));
  });
  it("distortion-energy shear strength", () => {
    // Shigley ch. 5: S_sy = 0.577 S_y (1018 CD, S_y = 370 MPa, Shigley table A-20)
    expect(shearYieldStrength(370e6)).toBeCloseTo(0.577 * 370e6, 3);
    // von Mises: the ratio is 1/sqrt(3) to three figures
    expect(shearYieldStrength(1)).toBeCloseTo(1 / Math.sqrt(3), 3);
  });
});

describe("columns", () => {
  // 6061-T6 rod 6 mm, 300 mm, pinned ends: slender (Euler)
  const E = 68.9e9;
  const Sy = 276e6;
  it("Euler load of a slender pinned column", () => {
    const rod = sectionProperties({ shape: "rod", diameter: 0.006 });
    const r = columnCriticalLoad(E, rod.area, rod.secondMoment, Sy, 0.3);
    // Shigley ch. 4, eq. 4-43: P_cr = pi^2 E I / L^2 for pinned ends (C = 1)
    expect(r.criticalLoad).toBeCloseTo((Math.PI ** 2 * E * ((Math.PI * 0.006 ** 4) / 64)) / 0.3 ** 2, 6);
    expect(r.method).toBe("Euler");
  });
  it("Johnson parabola for a stocky column, meeting Euler at the transition", () => {
    const rod = sectionProperties({ shape: "rod", diameter: 0.012 });
    const k = Math.sqrt(rod.secondMoment / rod.area); // radius of gyration d/4
    const L = 0.1;
    const r = columnCriticalLoad(E, rod.area, rod.secondMoment, Sy, L);
    // Shigley ch. 4, eq. 4-48: P_cr / A = S_y - (S_y l / (2 pi k))^2 / E, valid below (l/k)_1 = sqrt(2 pi^2 E / S_y) (eq. 4-45)
    expect(L / k).toBeLessThan(Math.sqrt((2 * Math.PI ** 2 * E) / Sy));
    expect(r.method).toBe("Johnson");
    expect(r.criticalLoad).toBeCloseTo(rod.area * (Sy - ((Sy * (L / k)) / (2 * Math.PI)) ** 2 / E), 3);
    // Shigley ch. 4: at the transition slenderness both give P_cr / A = S_y / 2
    const t = transitionSlenderness(E, Sy);
    const Lt = t * k;
    expect(johnsonCriticalLoad(rod.area, Sy, E, t) / rod.area).toBeCloseTo(Sy / 2, 0);
    expect(eulerCriticalLoad(E, rod.secondMoment, Lt) / rod.area).toBeCloseTo(Sy / 2, 0);
  });
});

describe("extension spring body", () => {
  // docs/formulas.md worked (SI): music wire d = 1.2 mm, D = 9.6 mm, 30 N
  const d = 0.0012;
  const D = 0.0096;
  it("curvature factors and body stress", () => {
    const C = springIndex(D, d);
    // Shigley eq. 10-1: C = D / d
    expect(C).toBeCloseTo(8, 12);
    // Shigley eq. 10-5: K_B = (4C + 2) / (4C - 3); worked 1.172
    expect(bergstraesserFactor(C)).toBeCloseTo((4 * 8 + 2) / (4 * 8 - 3), 12);
    expect(bergstraesserFactor(C)).toBeCloseTo(1.172, 3);
    // Wahl factor (4C - 1)/(4C - 4) + 0.615/C; worked 1.184
    expect(wahlFactor(C)).toBeCloseTo(1.184, 3);
    // Shigley eq. 10-7: tau = K_B 8 F D / (pi d^3); worked 497.6 MPa
    const tau = coilBodyShearStress(30, D, d);
    expect(tau / 1e6).toBeCloseTo(
      (bergstraesserFactor(8) * 8 * 30 * 0.0096) / (Math.PI * 0.0012 ** 3) / 1e6,
      6,
    );
    expect(tau / 1e6).toBeCloseTo(497.6, 1);
  });
  it("music wire strength and the extension-body allowable", () => {
    const Sut = minimumTensileStrength(MUSIC_WIRE_STRENGTH.aMpaMm, MUSIC_WIRE_STRENGTH.m, d);
    // Shigley eq. 10-14 with Table 10-4 (A228: A = 2211 MPa mm^m, m = 0.145); worked 2153 MPa
    expect(Sut / 1e6).toBeCloseTo(2211 / 1.2 ** 0.145, 6);
    expect(Sut / 1e6).toBeCloseTo(2153, 0);
    // Shigley Table 10-7 (from memory): extension body 45 % of S_ut; worked 969.0 MPa
    expect((EXTENSION_BODY_ALLOWABLE_RATIO * Sut) / 1e6).toBeCloseTo(969.0, 0);
  });
});
