// The space frame solver against closed forms computed here: torsion of a bar (Roark), an L-frame
// in a horizontal plane (bending of both legs plus twist of the first), a cantilever under its own
// weight (Roark) and its natural frequencies (Blevins: bending both ways and twisting), the
// cantilever with a tip mass (Rayleigh), pins about turned axes, rigid offsets of any length.
import { describe, expect, it } from "vitest";
import {
  SpaceFrame,
  type MemberProperties,
  type Vec3,
} from "../../server/src/mechanics/structure/space-frame";
import { sectionProperties } from "../../server/src/model/section";
import type { Section } from "../../server/src/model/types";

// 6061-T6 (docs/materials.md: ASM Handbook vol. 2, from memory); G = E / (2 (1 + nu)) with nu = 0.33
const E = 68.9e9;
const NU = 0.33;
const G_SHEAR = E / (2 * (1 + NU));
const RHO = 2700;
/** Standard gravity (3rd CGPM 1901; SI Brochure, 9th ed.). */
const g = 9.80665;
const tube: Section = { shape: "tube", outerDiameter: 0.02, wall: 0.002 };
const L = 0.4;
const P = 10;
const Z: Vec3 = { x: 0, y: 0, z: 1 };

function props(section: Section, density = RHO): MemberProperties {
  const s = sectionProperties(section);
  return {
    axialRigidity: E * s.area,
    torsionalRigidity: G_SHEAR * s.torsionConstant,
    bendingRigidityY: E * s.secondMomentAcross,
    bendingRigidityZ: E * s.secondMoment,
    massPerLength: density * s.area,
    rotaryInertiaPerLength: density * s.polarMoment,
  };
}

/** A cantilever along +x from a fixed node, in `count` members; node ids. */
function cantilever(frame: SpaceFrame, count: number, p: MemberProperties, length = L): number[] {
  const nodes: number[] = [];
  for (let k = 0; k <= count; k++) nodes.push(frame.addNode({ x: (length * k) / count, y: 0, z: 0 }));
  frame.fix(nodes[0]!);
  for (let k = 0; k < count; k++) frame.addMember(nodes[k]!, nodes[k + 1]!, p, Z);
  return nodes;
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("space frame statics", () => {
  it("cantilever with an end load, up and sideways (Roark table 8.1 case 1a)", () => {
    const bar: Section = { shape: "rect", depth: 0.02, width: 0.006 };
    const s = sectionProperties(bar);
    const frame = new SpaceFrame();
    const nodes = cantilever(frame, 4, props(bar, 0));
    const tip = nodes[4]!;
    frame.addLoad(tip, { x: 0, y: -P, z: P });
    const u = frame.solveStatic()!.displacement(tip);
    // Roark 8th ed., table 8.1 case 1a: W l^3 / (3 E I), end slope W l^2 / (2 E I), about each
    // principal axis for its own load component (depth in the x-y plane, width along z)
    expect(rel(-u.translation.y, (P * L ** 3) / (3 * E * s.secondMoment))).toBeLessThan(1e-9);
    expect(rel(u.translation.z, (P * L ** 3) / (3 * E * s.secondMomentAcross))).toBeLessThan(1e-9);
    expect(rel(-u.rotation.z, (P * L ** 2) / (2 * E * s.secondMoment))).toBeLessThan(1e-9);
    expect(rel(-u.rotation.y, (P * L ** 2) / (2 * E * s.secondMomentAcross))).toBeLessThan(1e-9);
  });

  it("a cantilever at 30 deg in the plane: the results follow the member", () => {
    const frame = new SpaceFrame();
    const a = Math.PI / 6;
    const n0 = frame.addNode({ x: 0, y: 0, z: 0 });
    const n1 = frame.addNode({ x: L * Math.cos(a), y: L * Math.sin(a), z: 0 });
    frame.fix(n0);
    frame.addMember(n0, n1, props(tube, 0), Z);
    // a load normal to the member in the plane, and one across the plane
    frame.addLoad(n1, { x: P * Math.sin(a), y: -P * Math.cos(a), z: P });
    const u = frame.solveStatic()!.displacement(n1).translation;
    const I = sectionProperties(tube).secondMoment;
    // Roark 8th ed., table 8.1 case 1a, in the member's own axes: W l^3 / (3 E I) each way
    expect(rel(Math.hypot(u.x, u.y), (P * L ** 3) / (3 * E * I))).toBeLessThan(1e-9);
    expect(rel(u.z, (P * L ** 3) / (3 * E * I))).toBeLessThan(1e-9);
  });

  it("portal corner: a column fixed at its foot, a beam welded at the top, an end load", () => {
    // Unit-load method (Castigliano): column of height H (E I_c, E A_c), beam of length b (E I_b),
    // load P down at the beam's end. Beam moment P x, column moment P b (constant), column axial
    // force P: vertical tip deflection P b^3 / (3 E I_b) + P b^2 H / (E I_c) + P H / (E A_c);
    // a unit horizontal load at the tip gives m = (H - y) on the column only, so the tip sways
    // by P b H^2 / (2 E I_c) toward the load's side.
    const H = 0.3;
    const b = 0.25;
    const rod: Section = { shape: "rod", diameter: 0.01 };
    const frame = new SpaceFrame();
    const foot = frame.addNode({ x: 0, y: 0, z: 0 });
    const top = frame.addNode({ x: 0, y: H, z: 0 });
    const tip = frame.addNode({ x: b, y: H, z: 0 });
    frame.fix(foot);
    frame.addMember(foot, top, props(rod, 0), Z);
    frame.addMember(top, tip, props(tube, 0), Z);
    frame.addLoad(tip, { x: 0, y: -P, z: 0 });
    const u = frame.solveStatic()!.displacement(tip).translation;
    const r = sectionProperties(rod);
    const t = sectionProperties(tube);
    const vertical =
      (P * b ** 3) / (3 * E * t.secondMoment) +
      (P * b * b * H) / (E * r.secondMoment) +
      (P * H) / (E * r.area);
    // unit-load method (derived above)
    expect(rel(-u.y, vertical)).toBeLessThan(1e-9);
    expect(rel(u.x, (P * b * H * H) / (2 * E * r.secondMoment))).toBeLessThan(1e-9);
  });

  it("twist of a bar under an end torque, theta = T L / (K G) (Roark)", () => {
    for (const section of [
      tube,
      { shape: "rod" as const, diameter: 0.01 },
      { shape: "rect" as const, depth: 0.02, width: 0.006 },
    ]) {
      const frame = new SpaceFrame();
      const nodes = cantilever(frame, 3, props(section, 0));
      const T = 2;
      frame.addLoad(nodes[3]!, { x: 0, y: 0, z: 0 }, { x: T, y: 0, z: 0 });
      const sol = frame.solveStatic()!;
      const K = sectionProperties(section).torsionConstant;
      // Roark 7th ed., table 10.7 (theta = T L / (K G), K of each case: 1, 10 and 4)
      expect(rel(sol.displacement(nodes[3]!).rotation.x, (T * L) / (K * G_SHEAR))).toBeLessThan(1e-9);
      // the torque passes whole through every member
      expect(rel(-sol.endForces(0).i.mx, T)).toBeLessThan(1e-9);
    }
  });

  it("L-frame in a horizontal plane: bending of both legs plus twist of the first", () => {
    // docs/formulas.md (superposition, e.g. Gere): P L1^3 / (3 E I1) + P L2^2 L1 / (G J1) + P L2^3 / (3 E I2)
    const leg1: Section = { shape: "rect", depth: 0.025, width: 0.01 };
    const leg2: Section = tube;
    const L1 = 0.3;
    const L2 = 0.2;
    const frame = new SpaceFrame();
    const root = frame.addNode({ x: 0, y: 0, z: 0 });
    const corner = frame.addNode({ x: L1, y: 0, z: 0 });
    const tip = frame.addNode({ x: L1, y: 0, z: L2 });
    frame.fix(root);
    // leg 1 along x with its depth vertical; leg 2 along z, its section's "across" axis horizontal
    frame.addMember(root, corner, props(leg1, 0), Z);
    frame.addMember(corner, tip, props(leg2, 0), { x: 1, y: 0, z: 0 });
    frame.addLoad(tip, { x: 0, y: -P, z: 0 });
    const u = frame.solveStatic()!.displacement(tip);
    const s1 = sectionProperties(leg1);
    const s2 = sectionProperties(leg2);
    const expected =
      (P * L1 ** 3) / (3 * E * s1.secondMoment) +
      (P * L2 ** 2 * L1) / (G_SHEAR * s1.torsionConstant) +
      (P * L2 ** 3) / (3 * E * s2.secondMoment);
    // docs/formulas.md, L-frame (formula above)
    expect(rel(-u.translation.y, expected)).toBeLessThan(1e-9);
  });

  it("cantilever under its own weight: Roark table 8.1 case 2a within 0.5 % (work-equivalent loads)", () => {
    for (const count of [1, 4]) {
      const frame = new SpaceFrame();
      const p = props(tube);
      const nodes = cantilever(frame, count, p);
      const q = p.massPerLength * g;
      frame.members.forEach((_, k) => frame.addMemberLoad(k, { x: 0, y: -q, z: 0 }));
      const sol = frame.solveStatic()!;
      const tip = sol.displacement(nodes[count]!);
      const I = sectionProperties(tube).secondMoment;
      // Roark 8th ed., table 8.1 case 2a (uniform load w over the whole span, left end fixed):
      // y_B = -w l^4 / (8 E I), theta_B = -w l^3 / (6 E I)
      expect(rel(-tip.translation.y, (q * L ** 4) / (8 * E * I))).toBeLessThan(0.005);
      expect(rel(-tip.rotation.z, (q * L ** 3) / (6 * E * I))).toBeLessThan(0.005);
      // same case: M_A = -w l^2 / 2 at the wall, R_A = w l
      const root = sol.endForces(0).i;
      expect(rel(root.mz, (q * L * L) / 2)).toBeLessThan(1e-9);
      expect(rel(root.fy, q * L)).toBeLessThan(1e-9);
    }
  });

  it("a turned plane gives the same answer: pins and members about any horizontal axis", () => {
    // Two-bar pinned truss (method of joints and Castigliano): bars of length l from pins at
    // (+-l cos a, 0) meet at a pin at (0, l sin a); a load P down there drops it by
    // P l / (2 E A sin^2 a). Built in the x-y plane, then turned 37 deg about the vertical.
    const a = Math.PI / 4;
    const l = 0.3;
    const p = props(tube, 0);
    for (const heading of [0, (37 * Math.PI) / 180]) {
      const c = Math.cos(heading);
      const s = Math.sin(heading);
      const at = (x: number, y: number): Vec3 => ({ x: x * c, y, z: -x * s });
      const normal: Vec3 = { x: s, y: 0, z: c }; // the plane's normal turned with it
      const frame = new SpaceFrame();
      const g1 = frame.addNode(at(-l * Math.cos(a), 0));
      const g2 = frame.addNode(at(l * Math.cos(a), 0));
      const s1 = frame.addNode(at(-l * Math.cos(a), 0));
      const s2 = frame.addNode(at(l * Math.cos(a), 0));
      const t1 = frame.addNode(at(0, l * Math.sin(a)));
      const t2 = frame.addNode(at(0, l * Math.sin(a)));
      frame.fix(g1);
      frame.fix(g2);
      frame.pin(g1, s1, normal);
      frame.pin(g2, s2, normal);
      frame.pin(t1, t2, normal);
      const e1 = frame.addMember(s1, t1, p, normal);
      frame.addMember(s2, t2, p, normal);
      frame.addLoad(t1, { x: 0, y: -P, z: 0 });
      const sol = frame.solveStatic()!;
      const u = sol.displacement(t1).translation;
      // Castigliano (derived above)
      expect(rel(-u.y, (P * l) / (2 * p.axialRigidity * Math.sin(a) ** 2))).toBeLessThan(1e-9);
      expect(Math.hypot(u.x, u.z)).toBeLessThan(1e-12);
      // method of joints: compression P / (2 sin a), no end moments at the pins
      const f = sol.endForces(e1);
      expect(rel(f.j.fx, -P / (2 * Math.sin(a)))).toBeLessThan(1e-9);
      expect(Math.abs(f.i.mz) + Math.abs(f.j.mz)).toBeLessThan(1e-9);
    }
  });

  it("a bar on one pin swings: a mechanism, not a number", () => {
    const frame = new SpaceFrame();
    const g0 = frame.addNode({ x: 0, y: 0, z: 0 });
    const s = frame.addNode({ x: 0, y: 0, z: 0 });
    const t = frame.addNode({ x: L, y: 0, z: 0 });
    frame.fix(g0);
    frame.pin(g0, s, Z);
    frame.addMember(s, t, props(tube, 0), Z);
    frame.addLoad(t, { x: 0, y: -P, z: 0 });
    expect(frame.solveStatic()).toBeUndefined();
  });

  it("closed loops: a rigid plate pinned twice to the ground does not move, a loaded bar beside it does", () => {
    // The plate's second pin repeats constraints the first pin and its rigidity already impose:
    // those reduce to nothing and are dropped instead of making the system singular.
    const frame = new SpaceFrame();
    const a = frame.addNode({ x: 0, y: 0, z: 0 });
    const b = frame.addNode({ x: 0.2, y: 0, z: 0 });
    frame.fix(a);
    frame.fix(b);
    const plateA = frame.addNode({ x: 0, y: 0, z: 0 });
    const plateB = frame.addNode({ x: 0.2, y: 0, z: 0 });
    const plateC = frame.addNode({ x: 0.1, y: 0.1, z: 0 });
    frame.rigidOffset(plateA, plateB);
    frame.rigidOffset(plateA, plateC);
    frame.pin(a, plateA, Z);
    frame.pin(b, plateB, Z);
    const tip = frame.addNode({ x: 0.1 + L, y: 0.1, z: 0 });
    frame.addMember(plateC, tip, props(tube, 0), Z);
    frame.addLoad(tip, { x: 0, y: -P, z: 0 });
    frame.addLoad(plateC, { x: 3, y: -5, z: 1 }, { x: 0.2, y: 0.1, z: 0.3 });
    const sol = frame.solveStatic()!;
    const c = sol.displacement(plateC);
    expect(Math.hypot(c.translation.x, c.translation.y, c.translation.z)).toBe(0);
    // Roark 8th ed., table 8.1 case 1a: the bar is a cantilever off the held plate
    expect(
      rel(
        -sol.displacement(tip).translation.y,
        (P * L ** 3) / (3 * E * sectionProperties(tube).secondMoment),
      ),
    ).toBeLessThan(1e-9);
  });

  it("rigid offsets of 0.01 mm to 100 mm: stable, and the offset load twists the bar", () => {
    // A load P down at a hook e across the tip of a cantilever: the tip deflects P L^3 / (3 E I)
    // (Roark table 8.1 case 1a) and the bar twists by P e L / (K G) (Roark table 10.7), so the
    // hook drops by both: P L^3 / (3 E I) + P e^2 L / (K G).
    const s = sectionProperties(tube);
    for (const e of [1e-5, 1e-3, 6e-3, 0.1]) {
      const frame = new SpaceFrame();
      const nodes = cantilever(frame, 4, props(tube, 0));
      const hook = frame.addNode({ x: L, y: 0, z: e });
      frame.rigidOffset(nodes[4]!, hook);
      frame.addLoad(hook, { x: 0, y: -P, z: 0 });
      const sol = frame.solveStatic();
      expect(sol).toBeDefined();
      const drop = -sol!.displacement(hook).translation.y;
      // superposition of Roark's two cases (above)
      const expected =
        (P * L ** 3) / (3 * E * s.secondMoment) + (P * e * e * L) / (s.torsionConstant * G_SHEAR);
      expect(rel(drop, expected)).toBeLessThan(1e-9);
    }
  });
});

describe("space frame vibration", () => {
  it("cantilever: first bending frequency both ways within 0.5 % of Blevins (consistent mass, 4 members)", () => {
    const bar: Section = { shape: "rect", depth: 0.02, width: 0.006 };
    const s = sectionProperties(bar);
    const p = props(bar);
    const frame = new SpaceFrame();
    cantilever(frame, 4, p);
    const omega2 = frame.naturalFrequencies(2)!;
    const f = omega2.map((w2) => Math.sqrt(w2) / (2 * Math.PI));
    // Blevins, Formulas for Natural Frequency and Mode Shape (1979), table 8-1, clamped-free
    // beam: f_1 = lambda_1^2 / (2 pi L^2) sqrt(E I / m), lambda_1 = 1.87510
    const blevins = (I: number) =>
      (1.8751 ** 2 / (2 * Math.PI * L * L)) * Math.sqrt((E * I) / p.massPerLength);
    // the lowest mode bends the bar across its thin side (sideways), the next one in the plane
    expect(rel(f[0]!, blevins(s.secondMomentAcross))).toBeLessThan(0.005);
    expect(rel(f[1]!, blevins(s.secondMoment))).toBeLessThan(0.005);
  });

  it("a tube's two equal bending modes settle together", () => {
    const p = props(tube);
    const frame = new SpaceFrame();
    cantilever(frame, 4, p);
    const f = frame.naturalFrequencies(2)!.map((w2) => Math.sqrt(w2) / (2 * Math.PI));
    const I = sectionProperties(tube).secondMoment;
    // Blevins 1979, table 8-1 (as above), the same I about every axis
    const blevins = (1.8751 ** 2 / (2 * Math.PI * L * L)) * Math.sqrt((E * I) / p.massPerLength);
    expect(rel(f[0]!, blevins)).toBeLessThan(0.005);
    expect(rel(f[1]!, blevins)).toBeLessThan(0.005);
  });

  it("twisting mode of a bar carrying a disc: f = sqrt(K G / (L J_disc)) / (2 pi)", () => {
    // A light shaft (torsional rate K G / L) with a heavy rigid disc at its end: one degree of
    // freedom, f = (1 / 2 pi) sqrt(k / J) (docs/formulas.md, mass on a spring, in rotation). The
    // disc is four point masses on rigid arms of radius r across the shaft: J = 4 m r^2.
    const rod: Section = { shape: "rod", diameter: 0.006 };
    const s = sectionProperties(rod);
    const frame = new SpaceFrame();
    const nodes = cantilever(frame, 2, props(rod, 0));
    const r = 0.05;
    const m = 0.05;
    for (const [y, z] of [
      [r, 0],
      [-r, 0],
      [0, r],
      [0, -r],
    ] as const) {
      const n = frame.addNode({ x: L, y, z });
      frame.rigidOffset(nodes[2]!, n);
      frame.addMass(n, m);
    }
    const modes = frame.naturalModes(3)!;
    const k = (s.torsionConstant * G_SHEAR) / L;
    const expected = Math.sqrt(k / (4 * m * r * r)) / (2 * Math.PI);
    const f = modes.omega2.map((w2) => Math.sqrt(w2) / (2 * Math.PI));
    // docs/formulas.md (mass on a spring, in rotation): the twisting mode is among the lowest three
    const twisting = f.findIndex((x) => rel(x, expected) < 1e-6);
    expect(twisting).toBeGreaterThanOrEqual(0);
    // ... and its shape turns the tip about the bar's axis only (to the accuracy of a mode shape
    // whose frequency has settled to 1e-10: the shape's error is about the square root of that)
    const rot = modes.shapes[twisting]!.displacement(nodes[2]!).rotation;
    expect(Math.abs(rot.y) + Math.abs(rot.z)).toBeLessThan(1e-4 * Math.abs(rot.x));
  });

  it("cantilever tube with a tip mass (Rayleigh; docs/formulas.md worked 26.78 Hz)", () => {
    const p = props(tube);
    const frame = new SpaceFrame();
    const nodes = cantilever(frame, 4, p);
    const M = 0.5;
    frame.addMass(nodes[4]!, M);
    const f = Math.sqrt(frame.naturalFrequencies(1)![0]!) / (2 * Math.PI);
    const beamMass = p.massPerLength * L;
    const k = (3 * E * sectionProperties(tube).secondMoment) / L ** 3;
    const rayleigh = Math.sqrt(k / (M + (33 / 140) * beamMass)) / (2 * Math.PI);
    // docs/formulas.md worked values: m_beam = 0.1221 kg, k = 14 976 N/m, f = 26.78 Hz
    expect(beamMass).toBeCloseTo(0.1221, 4);
    expect(rayleigh).toBeCloseTo(26.78, 2);
    // Rayleigh's method (Thomson and Dahleh, 5th ed., ch. 2): the static-deflection shape is
    // within far less than 0.3 % of the exact first mode when the tip mass is four times the beam's
    expect(rel(f, rayleigh)).toBeLessThan(0.003);
  });

  it("mass on a spring (docs/formulas.md: f = sqrt(k / m) / (2 pi), worked 7.118 Hz)", () => {
    const frame = new SpaceFrame();
    const ground = frame.addNode({ x: 0, y: 0, z: 0 });
    const mass = frame.addNode({ x: 0, y: -0.1, z: 0 });
    frame.fix(ground);
    frame.addAxialSpring(ground, mass, 1000);
    // only the vertical translation is free
    for (const k of [0, 2, 3, 4, 5]) frame.hold(mass, k);
    frame.addMass(mass, 0.5);
    const f = Math.sqrt(frame.naturalFrequencies(1)![0]!) / (2 * Math.PI);
    // docs/formulas.md, vibration: mass on a spring
    expect(rel(f, Math.sqrt(1000 / 0.5) / (2 * Math.PI))).toBeLessThan(1e-9);
    expect(f).toBeCloseTo(7.118, 3);
  });
});
