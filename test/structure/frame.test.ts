// The plane-frame solver and eigen solver against closed-form results: Roark's cantilever,
// a two-bar pinned truss and an L-frame derived by the unit-load method, a free-body beam,
// and Rayleigh's cantilever-with-tip-mass frequency.
import { describe, expect, it } from "vitest";
import { PlaneFrame } from "../../server/src/mechanics/structure/frame";
import { symmetricEigen } from "../../server/src/mechanics/structure/dense";
import { beamStress } from "../../server/src/mechanics/structure/beam";
import { sectionProperties } from "../../server/src/model/section";

const E = 68.9e9; // 6061-T6 (references.md, ASM Handbook vol. 2, from memory)
const tube = sectionProperties({ shape: "tube", outerDiameter: 0.02, wall: 0.002 });
const L = 0.4;
const P = 10;

/** A cantilever along +x from a fixed node, meshed into `count` elements; returns node ids. */
function cantilever(frame: PlaneFrame, count: number, length = L): number[] {
  const nodes: number[] = [];
  for (let k = 0; k <= count; k++) nodes.push(frame.addNode((length * k) / count, 0));
  frame.fix(nodes[0]!);
  for (let k = 0; k < count; k++)
    frame.addElement(nodes[k]!, nodes[k + 1]!, E * tube.area, E * tube.secondMoment);
  return nodes;
}

describe("frame statics", () => {
  it("cantilever with an end load", () => {
    const frame = new PlaneFrame();
    const nodes = cantilever(frame, 4);
    frame.addLoad(nodes[4]!, 0, -P);
    const sol = frame.solveStatic()!;
    const tip = sol.displacement(nodes[4]!);
    const I = tube.secondMoment;
    // Roark 8th ed., table 8.1 case 1a: tip deflection W l^3 / (3 E I); worked 0.6677 mm
    expect(-tip.uy).toBeCloseTo((P * L ** 3) / (3 * E * I), 9);
    expect(-tip.uy * 1000).toBeCloseTo(0.6677, 3);
    // Roark 8th ed., table 8.1 case 1a: end slope W l^2 / (2 E I); worked 2.504e-3 rad
    expect(-tip.rotation).toBeCloseTo((P * L ** 2) / (2 * E * I), 9);
    expect(-tip.rotation).toBeCloseTo(2.504e-3, 6);
    // root moment W l, stress M c / I (Roark 8th ed., eq. 8.1-13); worked 8.626 MPa
    const root = sol.endForces(0);
    expect(Math.abs(root.m1)).toBeCloseTo(P * L, 9);
    expect((Math.abs(root.m1) * tube.extremeFibre) / I / 1e6).toBeCloseTo(8.626, 3);
  });

  it("same cantilever at 30 deg: results follow the member", () => {
    const frame = new PlaneFrame();
    const a = Math.PI / 6;
    const n0 = frame.addNode(0, 0);
    const n1 = frame.addNode(L * Math.cos(a), L * Math.sin(a));
    frame.fix(n0);
    frame.addElement(n0, n1, E * tube.area, E * tube.secondMoment);
    // load normal to the member
    frame.addLoad(n1, P * Math.sin(a), -P * Math.cos(a));
    const u = frame.solveStatic()!.displacement(n1);
    // Roark table 8.1 case 1a, rotated frame: deflection normal to the member
    expect(Math.hypot(u.ux, u.uy)).toBeCloseTo((P * L ** 3) / (3 * E * tube.secondMoment), 8);
  });

  it("two-bar pinned truss (pins as tied translations, released rotations)", () => {
    // Derivation (method of joints, then Castigliano): two equal bars of length l from pinned
    // supports at (-l cos a, 0) and (l cos a, 0) meet at a pin at (0, l sin a). A load P down at
    // the pin gives each bar compression N = P / (2 sin a); the strain energy
    // U = 2 N^2 l / (2 E A) gives the pin's drop dU/dP = P l / (2 E A sin^2 a).
    const a = Math.PI / 4;
    const l = 0.3;
    const EA = E * tube.area;
    const frame = new PlaneFrame();
    const g1 = frame.addNode(-l * Math.cos(a), 0);
    const g2 = frame.addNode(l * Math.cos(a), 0);
    const s1 = frame.addNode(-l * Math.cos(a), 0);
    const s2 = frame.addNode(l * Math.cos(a), 0);
    const t1 = frame.addNode(0, l * Math.sin(a));
    const t2 = frame.addNode(0, l * Math.sin(a));
    frame.fix(g1);
    frame.fix(g2);
    frame.tieTranslations(g1, s1);
    frame.tieTranslations(g2, s2);
    frame.tieTranslations(t1, t2);
    const e1 = frame.addElement(s1, t1, EA, E * tube.secondMoment);
    frame.addElement(s2, t2, EA, E * tube.secondMoment);
    frame.addLoad(t1, 0, -P);
    const sol = frame.solveStatic()!;
    // Castigliano (derived above): drop P l / (2 E A sin^2 a)
    expect(-sol.displacement(t1).uy).toBeCloseTo((P * l) / (2 * EA * Math.sin(a) ** 2), 12);
    // method of joints: compression P / (2 sin a), no end moments at pins
    const f = sol.endForces(e1);
    expect(f.fx2).toBeCloseTo(-P / (2 * Math.sin(a)), 8);
    expect(Math.abs(f.m1) + Math.abs(f.m2)).toBeLessThan(1e-9);
  });

  it("L-frame: column fixed at the foot, rigid corner, beam with an end load", () => {
    // Derivation (unit-load method, Castigliano): column of height H (EI_c, EA_c) fixed at the
    // foot, beam of length b (EI_b) rigidly joined at the top, load P down at the beam's end.
    // Beam moment P x (x from the tip), column moment P b (constant), column axial force P.
    // Vertical tip deflection = int M m / EI + N n l / EA with m = x on the beam and b on the
    // column: P b^3 / (3 E I_b) + P b^2 H / (E I_c) + P H / (E A_c).
    // Horizontal tip deflection: unit horizontal load at the tip gives m = (H - y) on the
    // column only: int_0^H P b (H - y) / (E I_c) dy = P b H^2 / (2 E I_c), toward the load side.
    const H = 0.3;
    const b = 0.25;
    const rod = sectionProperties({ shape: "rod", diameter: 0.01 });
    const frame = new PlaneFrame();
    const foot = frame.addNode(0, 0);
    const top = frame.addNode(0, H);
    const tip = frame.addNode(b, H);
    frame.fix(foot);
    frame.addElement(foot, top, E * rod.area, E * rod.secondMoment);
    frame.addElement(top, tip, E * tube.area, E * tube.secondMoment);
    frame.addLoad(tip, 0, -P);
    const u = frame.solveStatic()!.displacement(tip);
    const vertical =
      (P * b ** 3) / (3 * E * tube.secondMoment) +
      (P * b * b * H) / (E * rod.secondMoment) +
      (P * H) / (E * rod.area);
    // unit-load method (derived above)
    expect(-u.uy).toBeCloseTo(vertical, 10);
    // unit-load method (derived above): the column top sways toward +x (the load's side)
    expect(u.ux).toBeCloseTo((P * b * H * H) / (2 * E * rod.secondMoment), 10);
  });

  it("reports a mechanism instead of a number", () => {
    const frame = new PlaneFrame();
    const g = frame.addNode(0, 0);
    const s = frame.addNode(0, 0);
    const t = frame.addNode(L, 0);
    frame.fix(g);
    frame.tieTranslations(g, s); // a bar on one pin swings freely
    frame.addElement(s, t, E * tube.area, E * tube.secondMoment);
    frame.addLoad(t, 0, -P);
    expect(frame.solveStatic()).toBeUndefined();
  });
});

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

describe("vibration", () => {
  it("Jacobi eigenvalues of a small symmetric matrix", () => {
    // [[2, 1], [1, 2]] has eigenvalues 1 and 3 (hand calculation: det = (2 - x)^2 - 1)
    const { values } = symmetricEigen(new Float64Array([2, 1, 1, 2]), 2);
    expect(values[0]).toBeCloseTo(1, 12);
    expect(values[1]).toBeCloseTo(3, 12);
  });

  it("mass on a spring", () => {
    const frame = new PlaneFrame();
    const g = frame.addNode(0, 0);
    const m = frame.addNode(0, -0.1);
    frame.fix(g);
    frame.addAxialSpring(g, m, 1000);
    // the node's other translation and rotation would be a mechanism: hold them with a stiff bar
    // across (its axial stiffness along x only)
    const side = frame.addNode(0.1, -0.1);
    frame.fix(side);
    frame.addAxialSpring(side, m, 1e9);
    frame.addRotationalSpring(g, m, 1);
    frame.addMass(m, 0.5);
    const w2 = frame.naturalFrequencies(1)![0]!;
    // references.md: f = (1 / 2 pi) sqrt(k / m); worked 7.118 Hz for 1000 N/m and 0.5 kg
    expect(Math.sqrt(w2) / (2 * Math.PI)).toBeCloseTo(Math.sqrt(1000 / 0.5) / (2 * Math.PI), 9);
    expect(Math.sqrt(w2) / (2 * Math.PI)).toBeCloseTo(7.118, 3);
  });

  it("cantilever tube with a tip mass (Rayleigh), refined mesh", () => {
    const density = 2700; // 6061-T6, ASM Handbook vol. 2 (from memory)
    const count = 24;
    const frame = new PlaneFrame();
    const nodes = cantilever(frame, count);
    const beamMass = density * tube.area * L;
    for (let k = 0; k < count; k++) {
      frame.addMass(nodes[k]!, beamMass / count / 2);
      frame.addMass(nodes[k + 1]!, beamMass / count / 2);
    }
    const M = 0.5;
    frame.addMass(nodes[count]!, M);
    const f = Math.sqrt(frame.naturalFrequencies(1)![0]!) / (2 * Math.PI);
    const k = (3 * E * tube.secondMoment) / L ** 3;
    const rayleigh = Math.sqrt(k / (M + (33 / 140) * beamMass)) / (2 * Math.PI);
    // references.md worked values: m_beam = 0.1221 kg, k = 14 976 N/m, f = 26.78 Hz
    expect(beamMass).toBeCloseTo(0.1221, 4);
    expect(rayleigh).toBeCloseTo(26.78, 2);
    // Rayleigh's method (Thomson and Dahleh, 5th ed., ch. 2, effective mass M + 33/140 m_beam).
    // Tolerance 0.3 %: Rayleigh's static-deflection shape overestimates the exact frequency
    // by far less than that when the tip mass is four times the beam's, and 24 lumped-mass
    // elements converge as 1/n^2 to well under 0.1 %.
    expect(Math.abs(f - rayleigh) / rayleigh).toBeLessThan(0.003);
  });
});

describe("lowest eigenvalue by inverse iteration", () => {
  it("agrees with Jacobi on a cantilever's condensed matrix, and on a hand case", async () => {
    const { lowestEigenvalue } = await import("../../server/src/mechanics/structure/dense");
    // [[2, 1], [1, 2]]: eigenvalues 1 and 3 (hand calculation)
    expect(lowestEigenvalue(new Float64Array([2, 1, 1, 2]), 2)).toBeCloseTo(1, 10);
    // tridiagonal (2, -1): eigenvalues 2 - 2 cos(k pi / (n + 1)) (a standard closed form)
    const n = 30;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      a[i * n + i] = 2;
      if (i > 0) a[i * n + i - 1] = a[(i - 1) * n + i] = -1;
    }
    expect(lowestEigenvalue(a, n)).toBeCloseTo(2 - 2 * Math.cos(Math.PI / (n + 1)), 10);
    expect(symmetricEigen(Float64Array.from(a), n).values[0]).toBeCloseTo(
      2 - 2 * Math.cos(Math.PI / (n + 1)),
      10,
    );
  });
});
