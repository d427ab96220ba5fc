// Helical spring formulas against the worked examples of Shigley's Mechanical Engineering Design
// (Budynas and Nisbett, 9th-11th ed., chapter 10), as quoted in docs/formulas.md.
import { describe, expect, test } from "vitest";
import {
  bergstraesserFactor,
  coilShearStress,
  extensionActiveCoils,
  extensionSpringRate,
  helicalSpringRate,
  springIndex,
  torsionSpringRatePerRad,
  wahlFactor,
} from "../../server/src/model/coil";

const INCH = 0.0254;
const LBF = 0.45359237 * 9.80665;
const PSI = LBF / (INCH * INCH);

describe("extension spring from its coil", () => {
  test("SI worked example: music wire d = 1.2 mm, D = 9.6 mm, Nb = 20 (docs/formulas.md)", () => {
    const d = 1.2e-3,
      D = 9.6e-3,
      G = 81.7e9,
      E = 200e9,
      Nb = 20;
    // Shigley eq. 10-39: Na = Nb + G/E; worked value 20.41
    expect(extensionActiveCoils(Nb, G, E)).toBeCloseTo(Nb + G / E, 12);
    expect(extensionActiveCoils(Nb, G, E)).toBeCloseTo(20.41, 2);
    // Shigley eq. 10-9: k = G d^4 / (8 D^3 Na); worked value 1173 N/m
    const k = extensionSpringRate(d, D, Nb, G, E);
    expect(k).toBeCloseTo((G * d ** 4) / (8 * D ** 3 * (Nb + G / E)), 9);
    expect(k).toBeCloseTo(1173, 0);
    // Spring index C = 8; K_B = 1.172, K_W = 1.184 (Shigley eqs. 10-5, 10-4)
    const C = springIndex(D, d);
    expect(C).toBeCloseTo(8, 12);
    expect(bergstraesserFactor(C)).toBeCloseTo((4 * C + 2) / (4 * C - 3), 12);
    expect(bergstraesserFactor(C)).toBeCloseTo(1.172, 3);
    expect(wahlFactor(C)).toBeCloseTo(1.184, 3);
    // Shigley eq. 10-7 with K_B: at 30 N, tau = 497.6 MPa
    expect(coilShearStress(30, D, d, bergstraesserFactor(C)) / 1e6).toBeCloseTo(497.6, 1);
  });

  test("Shigley 9th ed. example 10-6 (hard-drawn wire, inputs from memory)", () => {
    const d = 0.035 * INCH,
      D = 0.213 * INCH,
      Nb = 12.17,
      G = 11.6e6 * PSI,
      E = 28.7e6 * PSI;
    // Na = 12.57, C = 6.086, K_B = 1.234, k = 17.91 lbf/in
    expect(extensionActiveCoils(Nb, G, E)).toBeCloseTo(12.57, 2);
    expect(springIndex(D, d)).toBeCloseTo(6.086, 3);
    expect(bergstraesserFactor(springIndex(D, d))).toBeCloseTo(1.234, 3);
    expect(extensionSpringRate(d, D, Nb, G, E) / (LBF / INCH)).toBeCloseTo(17.91, 1);
    expect(helicalSpringRate(d, D, 12.57, G) / (LBF / INCH)).toBeCloseTo(17.91, 1);
  });
});

describe("torsion spring", () => {
  test("Shigley section 10-12 worked: d = 2 mm, D = 20 mm, Na = 5, E = 196.5 GPa", () => {
    // k' = d^4 E / (10.8 D Na) = 2.911 N m/turn = 0.4633 N m/rad
    const k = torsionSpringRatePerRad(2e-3, 20e-3, 5, 196.5e9);
    expect(k * 2 * Math.PI).toBeCloseTo(2.911, 3);
    expect(k).toBeCloseTo(0.4633, 4);
  });
});
