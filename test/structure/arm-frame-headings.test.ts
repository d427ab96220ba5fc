// The arm's space frame with its swivels turned: a boom with a swivel at its end carrying a second
// link is, at heading 90 deg, the L-frame of docs/formulas.md (bending of both legs plus twist of the
// first); at heading 0 it is a straight cantilever (Roark). The turned placement moves only what
// the swivel carries.
import { describe, expect, it } from "vitest";
import { armStructure, buildArmFrame, loadArmFrame } from "../../server/src/mechanics/structure/arm-frame";
import { Placement } from "../../server/src/mechanics/headings";
import { sectionProperties } from "../../server/src/model/section";
import { G, treeSweep } from "./arm-fixture";
import { al, knuckleArm, L1, L2, P, rectBar, tube } from "./knuckle-fixture";

describe("the space frame with a swivel turned", () => {
  const model = knuckleArm();
  const sweep = treeSweep(model, [{}]);
  const pose = sweep.poses[0]!;
  const s1 = sectionProperties(rectBar);
  const s2 = sectionProperties(tube);

  it("at 90 deg: the L-frame of docs/formulas.md", () => {
    const af = buildArmFrame(
      model,
      pose,
      pose.cases[0],
      { tool: P / G },
      { headings: { knuckle: Math.PI / 2 } },
    );
    const u = af.frame.solveStatic()!.displacement(af.payloadNode["tool"]!).translation;
    // docs/formulas.md, L-frame: P L1^3 / (3 E I1) + P L2^2 L1 / (G J1) + P L2^3 / (3 E I2)
    const expected =
      (P * L1 ** 3) / (3 * al.modulus * s1.secondMoment) +
      (P * L2 ** 2 * L1) / (al.shearModulus * s1.torsionConstant) +
      (P * L2 ** 3) / (3 * al.modulus * s2.secondMoment);
    expect(Math.abs(-u.y - expected) / expected).toBeLessThan(1e-9);
  });

  it("at 0 deg: one straight cantilever (Roark table 8.1 cases 1a and 3a superposed)", () => {
    const af = buildArmFrame(model, pose, pose.cases[0], { tool: P / G });
    const u = af.frame.solveStatic()!.displacement(af.payloadNode["tool"]!).translation;
    // Roark 8th ed., table 8.1: the outer link a cantilever from the knuckle (case 1a), the boom
    // under an end load and an end moment P L2 (cases 1a and 3a): its end deflects
    // P L1^3 / (3 E I1) + P L2 L1^2 / (2 E I1) and turns by P L1^2 / (2 E I1) + P L2 L1 / (E I1)
    const EI1 = al.modulus * s1.secondMoment;
    const EI2 = al.modulus * s2.secondMoment;
    const endDrop = (P * L1 ** 3) / (3 * EI1) + (P * L2 * L1 ** 2) / (2 * EI1);
    const endTurn = (P * L1 ** 2) / (2 * EI1) + (P * L2 * L1) / EI1;
    const expected = endDrop + endTurn * L2 + (P * L2 ** 3) / (3 * EI2);
    expect(Math.abs(-u.y - expected) / expected).toBeLessThan(1e-9);
    expect(Math.abs(u.z)).toBeLessThan(1e-12);
  });

  it("turns only what the swivel carries, about the parent's y axis", () => {
    const turned = new Placement(model, pose, { knuckle: Math.PI / 2 });
    // the boom stays where the drawing puts it
    expect(turned.point("boom", { x: L1, y: 0 })).toEqual({ x: L1, y: 0.3, z: 0 });
    // arm2's end swings from +x to -z about the vertical through the knuckle
    const tip = turned.point("arm2", { x: L2, y: 0 });
    expect(tip.x).toBeCloseTo(L1, 12);
    expect(tip.y).toBeCloseTo(0.3, 12);
    expect(tip.z).toBeCloseTo(-L2, 12);
  });

  it("one structure loaded case by case gives each case's own frame to the last bit", () => {
    const headings = { knuckle: Math.PI / 3 };
    const structure = armStructure(model, pose, { headings });
    for (const mass of [P / G, (2 * P) / G]) {
      const own = buildArmFrame(model, pose, pose.cases[0], { tool: mass }, { headings });
      const shared = loadArmFrame(model, structure, pose.cases[0], { tool: mass });
      expect(Array.from(shared.frame.solveStatic()!.raw)).toEqual(Array.from(own.frame.solveStatic()!.raw));
      expect(shared.frame.naturalFrequencies(1)).toEqual(own.frame.naturalFrequencies(1));
      // twice the payload, twice the tip deflection (the frame is linear; Hooke)
      const u = shared.frame.solveStatic()!.displacement(shared.payloadNode["tool"]!).translation;
      const u1 = loadArmFrame(model, structure, pose.cases[0], { tool: P / G }).frame.solveStatic()!;
      const ratio = u.y / u1.displacement(shared.payloadNode["tool"]!).translation.y;
      expect(ratio).toBeCloseTo(mass / (P / G), 9);
    }
  });
});
