// Spring ends against Shigley's Mechanical Engineering Design (Budynas and Nisbett): the hook
// stresses, free length and initial-tension range of Example 10-6 (9th ed.; the same example in
// the 10th), and the torsion-spring wire stress of docs/formulas.md's worked case (section 10-12).
import { describe, expect, it } from "vitest";
import {
  bodySolidLength,
  defaultHook,
  fullLoopHookLength,
  hookBendingStress,
  hookTorsionStress,
  initialStressRange,
  initialTensionForStress,
  initialTensionStress,
  innerFibreBendingFactor,
  shortestFreeLength,
  torsionSpringWireStress,
} from "../../../server/src/mechanics/hardware/spring-ends";

const IN = 0.0254;
const LBF = 0.45359237 * 9.80665;
/** 1 kpsi in Pa (NIST SP 811: lbf and in exact). */
const KPSI = (1000 * LBF) / (IN * IN);

// Shigley 9th ed., Example 10-6 (inputs from memory): hard-drawn wire d = 0.035 in, OD = 0.248 in,
// hook radii r1 = 0.106 in, r2 = 0.089 in, initial tension 1.19 lbf, Nb = 12.17, load 5.25 lbf
const d = 0.035;
const D = 0.248 - d;
const r1 = 0.106;
const r2 = 0.089;
const F = 5.25;

describe("extension-spring hooks (Shigley 10th ed. eqs. 10-34, 10-35)", () => {
  it("bending at A and torsion at B of Example 10-6, computed in inches from the book's formulas", () => {
    const C1 = (2 * r1) / d;
    const KA = (4 * C1 * C1 - C1 - 1) / (4 * C1 * (C1 - 1));
    // eq. 10-34: sigma_A = F [(K)_A 16 D / (pi d^3) + 4 / (pi d^2)], psi
    const sigmaA = F * ((KA * 16 * D) / (Math.PI * d ** 3) + 4 / (Math.PI * d * d));
    const C2 = (2 * r2) / d;
    const KB = (4 * C2 - 1) / (4 * C2 - 4);
    // eq. 10-35: tau_B = (K)_B 8 F D / (pi d^3), psi
    const tauB = (KB * 8 * F * D) / (Math.PI * d ** 3);
    const hook = { loopRadius: r1 * IN, bendRadius: r2 * IN };
    const sA = hookBendingStress(F * LBF, D * IN, d * IN, hook);
    const tB = hookTorsionStress(F * LBF, D * IN, d * IN, hook);
    expect(sA / (sigmaA / 1000) / KPSI).toBeCloseTo(1, 9);
    expect(tB / (tauB / 1000) / KPSI).toBeCloseTo(1, 9);
    // the book's rounded results: sigma_A = 156.9 kpsi, tau_B = 78.4 kpsi (with K_B rounded to
    // 1.18; from memory)
    expect(sA / KPSI).toBeCloseTo(156.9, 0);
    expect(Math.abs(tB / KPSI - 78.4)).toBeLessThan(0.5);
    // and its safety factors on S_ut = 140 / d^0.190 kpsi (table 10-4): hook bending against
    // 0.75 S_ut, torsion against 0.40 S_ut (table 10-7): 1.27 and 1.35
    const Sut = 140 / d ** 0.19;
    expect((0.75 * Sut) / (sA / KPSI)).toBeCloseTo(1.27, 2);
    expect((0.4 * Sut) / (tB / KPSI)).toBeCloseTo(1.35, 1);
  });

  it("the default hook is a full loop on the coil's radius, bent out on 2 d (common practice)", () => {
    expect(defaultHook(0.01, 0.001)).toEqual({ loopRadius: 0.005, bendRadius: 0.002 });
    // with r1 = D / 2 the loop's index C1 is the spring index C
    const C = 8;
    expect(innerFibreBendingFactor((2 * (C / 2)) / 1)).toBeCloseTo(innerFibreBendingFactor(C), 15);
  });
});

describe("free length and solid body", () => {
  it("L0 = 2 (D - d) + (Nb + 1) d for full-loop hooks, on Example 10-6's coil", () => {
    const Nb = 12.17;
    // Shigley section 10-11, free length of a spring with two full-loop hooks
    const L0 = 2 * (D - d) + (Nb + 1) * d;
    expect(shortestFreeLength(Nb, D * IN, d * IN) / IN).toBeCloseTo(L0, 12);
    expect(bodySolidLength(Nb, d * IN) / IN).toBeCloseTo((Nb + 1) * d, 12);
    expect(fullLoopHookLength(D * IN, d * IN) / IN).toBeCloseTo(D - d, 12);
  });
});

describe("initial tension", () => {
  it("Example 10-6 (b): 18.58 kpsi lies in the preferred range 14.2 to 21.2 kpsi", () => {
    const C = D / d;
    // Shigley section 10-11: tau_i = 33 500 / exp(0.105 C) -/+ 1000 (4 - (C - 3) / 6.5) psi
    const mid = 33500 / Math.exp(0.105 * C);
    const half = 1000 * (4 - (C - 3) / 6.5);
    const range = initialStressRange(C);
    expect(range.low / ((mid - half) / 1000) / KPSI).toBeCloseTo(1, 9);
    expect(range.high / ((mid + half) / 1000) / KPSI).toBeCloseTo(1, 9);
    expect(range.low / KPSI).toBeCloseTo(14.2, 1);
    expect(range.high / KPSI).toBeCloseTo(21.2, 1);
    // tau_i = K_B 8 Fi D / (pi d^3), K_B = (4C + 2) / (4C - 3) (eq. 10-5): docs/formulas.md 18.58 kpsi
    const KB = (4 * C + 2) / (4 * C - 3);
    const tauI = initialTensionStress(1.19 * LBF, D * IN, d * IN);
    expect(tauI / ((KB * 8 * 1.19 * D) / (Math.PI * d ** 3) / 1000) / KPSI).toBeCloseTo(1, 9);
    expect(tauI / KPSI).toBeCloseTo(18.58, 1);
    expect(tauI).toBeGreaterThan(range.low);
    expect(tauI).toBeLessThan(range.high);
    // and back: the tension that gives a stress
    expect(initialTensionForStress(tauI, D * IN, d * IN)).toBeCloseTo(1.19 * LBF, 9);
  });
});

describe("torsion springs (Shigley section 10-12)", () => {
  it("sigma = K_i 32 M / (pi d^3), K_i = (4C^2 - C - 1) / (4C (C - 1)): docs/formulas.md's worked case", () => {
    // d = 2 mm, D = 20 mm, M = 0.5 N m: C = 10, K_i = 1.081, sigma = 687.9 MPa
    const C = 10;
    const Ki = (4 * C * C - C - 1) / (4 * C * (C - 1));
    const sigma = (Ki * 32 * 0.5) / (Math.PI * 0.002 ** 3);
    expect(torsionSpringWireStress(0.5, 0.02, 0.002)).toBeCloseTo(sigma, 0);
    expect(Ki).toBeCloseTo(1.081, 3);
    expect(sigma / 1e6).toBeCloseTo(687.9, 1);
  });
});
