// Bearings against published formulas: elliptic integrals (Abramowitz and Stegun), Hertz contact
// of a ball on a flat and in a groove (Johnson, Contact Mechanics; Hamrock and Brewe's fit as an
// independent cross-check), Stribeck's most loaded ball, a thrust ring under a moment (rigid rings,
// Hertz law), ISO 76 static safety, plain-bearing pressure.
import { describe, expect, it } from "vitest";
import { ellipticIntegrals } from "../../../server/src/mechanics/hardware/elliptic";
import {
  ballInRace,
  contactModulus,
  curvatureRatioOfEllipse,
  sphereOnFlat,
} from "../../../server/src/mechanics/hardware/hertz";
import {
  ISO76_RADIAL_BALL,
  plainBearingPressure,
  radialBallLoad,
  staticEquivalentLoad,
  staticSafety,
  STRIBECK_FACTOR,
  thrustBallLoad,
  thrustRingLoad,
} from "../../../server/src/mechanics/hardware/ball-load";
import { bearingSafety, contactAllowable } from "../../../server/src/mechanics/hardware/bearing-safety";
import { builtinMaterials } from "../../../server/src/model/materials";

/** The definitions of K(m) and E(m), integrated by Simpson's rule on 2000 panels: an independent
 * way to the same numbers. */
function quadrature(m: number): { K: number; E: number } {
  const n = 2000;
  const h = Math.PI / 2 / n;
  let K = 0;
  let E = 0;
  for (let i = 0; i <= n; i++) {
    const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
    const s = Math.sin(i * h) ** 2;
    K += w / Math.sqrt(1 - m * s);
    E += w * Math.sqrt(1 - m * s);
  }
  return { K: (K * h) / 3, E: (E * h) / 3 };
}

describe("complete elliptic integrals", () => {
  it("K(1/2) and E(1/2) of Abramowitz and Stegun table 17.5", () => {
    const { K, E } = ellipticIntegrals(0.5);
    // A&S table 17.5, m = 0.5 (alpha = 45 deg)
    expect(K).toBeCloseTo(1.854074677301372, 12);
    expect(E).toBeCloseTo(1.350643881047675, 12);
  });
  it("agree with the defining integrals from m = 0 to 0.999", () => {
    for (const m of [0, 0.1, 0.5, 0.9, 0.99, 0.999]) {
      const q = quadrature(m);
      const r = ellipticIntegrals(m);
      // definitions: K = int (1 - m sin^2)^-1/2, E = int (1 - m sin^2)^1/2 over 0..pi/2
      expect(r.K / q.K, `K(${m})`).toBeCloseTo(1, 6);
      expect(r.E / q.E, `E(${m})`).toBeCloseTo(1, 9);
    }
    // K(0) = E(0) = pi / 2
    expect(ellipticIntegrals(0).K).toBeCloseTo(Math.PI / 2, 14);
  });
});

const steel = { E: 208e9, nu: 0.3 };

describe("Hertz contact", () => {
  it("sphere on a flat: a = (3 F R / 4 E*)^(1/3), p0 = 3 F / (2 pi a^2) (Johnson ch. 4)", () => {
    const F = 100;
    const R = 0.003;
    const Es = contactModulus(steel.E, steel.nu, steel.E, steel.nu);
    // Johnson ch. 4: 1/E* = (1 - nu1^2)/E1 + (1 - nu2^2)/E2
    expect(Es).toBeCloseTo(1 / (2 * ((1 - 0.09) / 208e9)), 0);
    const a = Math.cbrt((3 * F * R) / (4 * Es));
    const c = sphereOnFlat(F, R, Es);
    expect(c.a).toBeCloseTo(a, 12);
    expect(c.peakPressure).toBeCloseTo((3 * F) / (2 * Math.PI * a * a), 0);
    expect(c.approach).toBeCloseTo((a * a) / R, 15);
    // a 6 mm bearing ball on a bearing-steel flat at 100 N: about 3 GPa
    expect(c.peakPressure / 1e9).toBeCloseTo(3.03, 1);
  });

  it("a ball on a flat race is the sphere on a flat", () => {
    const Es = contactModulus(steel.E, steel.nu, steel.E, steel.nu);
    const flat = ballInRace(100, { ballDiameter: 0.006, grooveRadius: Infinity, raceRadius: Infinity }, Es);
    const sphere = sphereOnFlat(100, 0.003, Es);
    expect(flat.peakPressure).toBeCloseTo(sphere.peakPressure, 0);
    expect(flat.a).toBeCloseTo(sphere.a, 12);
  });

  it("a ball in a groove: the ellipse satisfies Johnson's relations with quadrature integrals", () => {
    const Es = contactModulus(steel.E, steel.nu, steel.E, steel.nu);
    const D = 0.006;
    const rg = 0.52 * D; // conformity 0.52
    const F = 200;
    const c = ballInRace(F, { ballDiameter: D, grooveRadius: rg, raceRadius: Infinity }, Es);
    // half relative curvatures: rolling 1/D (ball on a flat plate), across (2/D - 1/rg) / 2
    const A = (2 / D - 1 / rg) / 2;
    const B = 2 / D / 2;
    expect(c.a).toBeGreaterThan(c.b);
    const m = 1 - (c.b / c.a) ** 2;
    const { K, E } = quadrature(m);
    // Johnson section 4.2(b): A = p0 b (K - E) / (E* e^2 a^2), B = p0 b ((a/b)^2 E - K) / (E* e^2 a^2)
    const scale = (c.peakPressure * c.b) / (Es * m * c.a * c.a);
    expect((scale * (K - E)) / A).toBeCloseTo(1, 5);
    expect((scale * ((c.a / c.b) ** 2 * E - K)) / B).toBeCloseTo(1, 5);
    // F = (2/3) pi a b p0
    expect(((2 / 3) * Math.PI * c.a * c.b * c.peakPressure) / F).toBeCloseTo(1, 12);
    // a groove spreads the load: far lower pressure than on a flat
    expect(c.peakPressure).toBeLessThan(0.5 * sphereOnFlat(F, D / 2, Es).peakPressure);
  });

  it("against Hamrock and Brewe's closed-form fit (J. Lubrication Technology 105, 1983; from memory)", () => {
    const Es = contactModulus(steel.E, steel.nu, steel.E, steel.nu);
    const D = 0.008;
    const dp = 0.04;
    const rg = 0.53 * D;
    const F = 150;
    // inner race of a radial bearing: convex (dp - D)/2 in the rolling direction
    const c = ballInRace(F, { ballDiameter: D, grooveRadius: rg, raceRadius: (dp - D) / 2 }, Es);
    const Rx = 1 / (2 / D + 2 / (dp - D));
    const Ry = 1 / (2 / D - 1 / rg);
    const alpha = Ry / Rx;
    const R = 1 / (1 / Rx + 1 / Ry);
    // Hamrock and Brewe: k = alpha^(2/pi), E = 1 + (pi/2 - 1) / alpha; E' = 2 E*
    const k = alpha ** (2 / Math.PI);
    const Ebar = 1 + (Math.PI / 2 - 1) / alpha;
    const Ep = 2 * Es;
    const Dy = 2 * Math.cbrt((6 * k * k * Ebar * F * R) / (Math.PI * Ep));
    const Dx = 2 * Math.cbrt((6 * Ebar * F * R) / (Math.PI * k * Ep));
    const pmax = (6 * F) / (Math.PI * Dx * Dy);
    // the fit is good to a few per cent
    expect(c.a / (Dy / 2)).toBeCloseTo(1, 1);
    expect(c.b / (Dx / 2)).toBeCloseTo(1, 1);
    expect(Math.abs(c.peakPressure / pmax - 1)).toBeLessThan(0.03);
  });

  it("the curvature ratio falls to 1 as the ellipse becomes a circle", () => {
    expect(curvatureRatioOfEllipse(0.999999)).toBeCloseTo(1, 4);
    expect(curvatureRatioOfEllipse(0.2)).toBeGreaterThan(curvatureRatioOfEllipse(0.5));
  });
});

describe("ball loads", () => {
  it("Stribeck: the most loaded ball under a radial load carries 5 Fr / Z (Harris ch. 7)", () => {
    expect(radialBallLoad(1000, 12)).toBeCloseTo((5 * 1000) / 12, 12);
    // Stribeck's 5 covers clearance: with rigid rings, no clearance and Q ~ delta^1.5 the exact
    // factor is Z / sum(cos^2.5 psi) over the loaded half, 4.37 for many balls
    const Z = 24;
    let s = 0;
    for (let i = 0; i < Z; i++) s += Math.max(Math.cos((2 * Math.PI * i) / Z), 0) ** 2.5;
    expect(Z / s).toBeCloseTo(4.37, 2);
    expect(STRIBECK_FACTOR).toBeGreaterThan(Z / s);
  });

  it("centred thrust shares evenly; a moment is the linear share while every ball is pressed", () => {
    expect(thrustBallLoad(600, 12)).toBe(50);
    expect(thrustRingLoad(600, 0, 12, 0.05).largest).toBe(50);
    // small moment: to first order the rigid-ring Hertz solution is the linear share
    // Fa / Z + 4 M / (Z dp) (slewing-ring practice)
    const Fa = 600;
    const dp = 0.05;
    const M = 0.02 * Fa * (dp / 2);
    const r = thrustRingLoad(Fa, M, 12, dp);
    expect(r.largest / (Fa / 12 + (4 * M) / (12 * dp))).toBeCloseTo(1, 3);
    expect(r.loadedShare).toBe(1);
  });

  it("four balls with the far one lifted: closed form of the rigid-ring Hertz law", () => {
    // balls at 0, 90, 180, 270 deg; compressions ~ cos psi - c with c = -1/2: the 0 deg ball
    // carries (3/2)^1.5, the side balls (1/2)^1.5 each, the far one nothing. Its share of Fa equals
    // the eccentricity M / (Fa r).
    const u0 = 1.5 ** 1.5;
    const u90 = 0.5 ** 1.5;
    const share = u0 / (u0 + 2 * u90);
    const Fa = 100;
    const r = 0.03;
    const res = thrustRingLoad(Fa, share * Fa * r, 4, 2 * r);
    expect(res.largest).toBeCloseTo(share * Fa, 6);
    expect(res.loadedShare).toBe(0.75);
    expect(res.tips).toBe(false);
  });

  it("the ring tips once M / Fa reaches the pitch radius", () => {
    expect(thrustRingLoad(100, 100 * 0.025, 12, 0.05).tips).toBe(true);
    expect(thrustRingLoad(0, 1, 12, 0.05).tips).toBe(true);
  });
});

describe("ISO 76 static safety", () => {
  it("P0 = X0 Fr + Y0 Fa, at least Fr, with X0 = 0.6 and Y0 = 0.5 for radial ball bearings", () => {
    // ISO 76, single-row radial ball bearings: X0 = 0.6, Y0 = 0.5; P0 never below Fr
    expect(ISO76_RADIAL_BALL).toEqual({ X0: 0.6, Y0: 0.5 });
    expect(staticEquivalentLoad(1000, 1500)).toBeCloseTo(0.6 * 1000 + 0.5 * 1500, 9);
    expect(staticEquivalentLoad(1000, 200)).toBe(1000);
    // s0 = C0 / P0: a bearing of C0 = 2.7 kN under 1000 N radial and 1500 N axial
    expect(staticSafety(2700, staticEquivalentLoad(1000, 1500))).toBeCloseTo(2700 / 1350, 12);
    const rated = bearingSafety(
      { kind: "rated", staticRating: 2700 },
      { radial: 1000, axial: 1500, moment: 0 },
      "radial",
    );
    expect(rated.safety).toBeCloseTo(2, 12);
    expect(rated.equivalentLoad).toBeCloseTo(1350, 9);
  });
});

describe("bearing safety", () => {
  const mats = builtinMaterials();

  it("the language reference's printed ring: ABS balls on PLA races, Stribeck then Hertz", () => {
    // bearing printed_ring { balls 12 x 6 mm abs; pitch 50 mm; races pla } under 100 N radial
    const ring = {
      kind: "balls" as const,
      count: 12,
      ballDiameter: 0.006,
      ball: mats.abs!,
      pitchDiameter: 0.05,
      race: mats.pla!,
    };
    const res = bearingSafety(ring, { radial: 100, axial: 0, moment: 0 }, "radial");
    const Q = (5 * 100) / 12;
    expect(res.ballLoad).toBeCloseTo(Q, 12);
    // Hertz, ball on the inner race's cylinder (no groove): curvatures 2/D + 2/(dp - D) and 2/D
    const Es = contactModulus(mats.abs!.modulus, mats.abs!.poisson, mats.pla!.modulus, mats.pla!.poisson);
    const c = ballInRace(Q, { ballDiameter: 0.006, grooveRadius: Infinity, raceRadius: 0.022 }, Es);
    expect(res.contactPressure).toBeCloseTo(c.peakPressure, 0);
    // softer part: printed ABS, first yield at 1.6 x its layer strength (Johnson section 6.2)
    expect(res.softer).toBe("abs");
    expect(res.allowablePressure).toBeCloseTo(1.6 * mats.abs!.layerStrength!, 0);
    // safety on load: the pressure grows as the cube root of the load
    expect(res.safety).toBeCloseTo((res.allowablePressure! / c.peakPressure) ** 3, 9);
    const atLimit = bearingSafety(ring, { radial: 100 * res.safety, axial: 0, moment: 0 }, "radial");
    expect(atLimit.contactPressure! / atLimit.allowablePressure!).toBeCloseTo(1, 9);
  });

  it("bearing steel takes the ISO 76 contact stress as its allowable", () => {
    expect(contactAllowable(mats.chrome_steel!)).toBe(4200e6);
    expect(contactAllowable(mats.steel_1018!)).toBeCloseTo(1.6 * 370e6, 0);
  });

  it("a thrust ring tipped by its moment has no safety", () => {
    const ring = {
      kind: "balls" as const,
      count: 12,
      ballDiameter: 0.006,
      ball: mats.chrome_steel!,
      pitchDiameter: 0.05,
      race: mats.petg!,
    };
    const tipped = bearingSafety(ring, { radial: 0, axial: 20, moment: 1 }, "thrust");
    expect(tipped.safety).toBe(0);
    expect(tipped.governing).toBe("tipping");
    const held = bearingSafety(ring, { radial: 0, axial: 200, moment: 1 }, "thrust");
    expect(held.safety).toBeGreaterThan(0);
    expect(held.ballLoad).toBeCloseTo(thrustRingLoad(200, 1, 12, 0.05).largest, 9);
  });

  it("plain bearing: p = F / (d L) against the material (a print's layer strength)", () => {
    const res = bearingSafety(
      { kind: "plain", bore: 0.008, length: 0.01, material: mats.petg! },
      { radial: 400, axial: 0, moment: 0 },
      "radial",
    );
    expect(plainBearingPressure(400, 0.008, 0.01)).toBeCloseTo(400 / (0.008 * 0.01), 6);
    expect(res.borePressure).toBeCloseTo(5e6, 0);
    expect(res.safety).toBeCloseTo(mats.petg!.layerStrength! / 5e6, 9);
  });
});
