// Frames that differ only in loads and masses share one factorisation (SpaceFrame
// shareFactorisationOf, used across the load cases of one pose): the shared solve is the frame's
// own to the last bit and deflects as Roark says; a frame whose stiffness differs in anything does
// not take another's factor.
import { describe, expect, it } from "vitest";
import { SpaceFrame, type MemberProperties } from "../../server/src/mechanics/structure/space-frame";
import { sectionProperties } from "../../server/src/model/section";
import type { Section } from "../../server/src/model/types";

// 6061-T6 (docs/materials.md: ASM Handbook vol. 2, from memory); G = E / (2 (1 + nu)), nu = 0.33
const E = 68.9e9;
const G = E / (2 * 1.33);
const bar: Section = { shape: "rect", depth: 0.02, width: 0.006 };
const s = sectionProperties(bar);
const L = 0.5;
const count = 6;

function props(modulus = E): MemberProperties {
  return {
    axialRigidity: modulus * s.area,
    torsionalRigidity: G * s.torsionConstant,
    bendingRigidityY: modulus * s.secondMomentAcross,
    bendingRigidityZ: modulus * s.secondMoment,
    massPerLength: 0,
    rotaryInertiaPerLength: 0,
  };
}

/** A cantilever along x carrying `load` N downwards and `mass` kg at its tip. */
function cantilever(load: number, mass: number, modulus = E) {
  const frame = new SpaceFrame();
  const nodes: number[] = [];
  for (let k = 0; k <= count; k++) nodes.push(frame.addNode({ x: (L * k) / count, y: 0, z: 0 }));
  frame.fix(nodes[0]!);
  for (let k = 0; k < count; k++)
    frame.addMember(nodes[k]!, nodes[k + 1]!, props(modulus), { x: 0, y: 0, z: 1 });
  frame.addLoad(nodes[count]!, { x: 0, y: -load, z: 0 });
  frame.addMass(nodes[count]!, mass);
  return { frame, tip: nodes[count]! };
}

describe("a factorisation shared between load cases", () => {
  it("gives the frame's own solution to the last bit, and Roark's deflection", () => {
    const light = cantilever(5, 0.5);
    const heavy = cantilever(20, 2);
    const alone = cantilever(20, 2);
    expect(heavy.frame.shareFactorisationOf(light.frame)).toBe(true);
    const shared = heavy.frame.solveStatic()!;
    const own = alone.frame.solveStatic()!;
    expect(Array.from(shared.raw)).toEqual(Array.from(own.raw));
    // Roark 8th ed., table 8.1 case 1a: W l^3 / (3 E I)
    const expected = (20 * L ** 3) / (3 * E * s.secondMoment);
    const u = -shared.displacement(heavy.tip).translation.y;
    expect(Math.abs(u - expected) / expected).toBeLessThan(1e-9);
    // the natural frequency uses the frame's own masses with the shared factor
    expect(heavy.frame.naturalFrequencies(1)).toEqual(alone.frame.naturalFrequencies(1));
  });

  it("is refused by a frame whose stiffness differs", () => {
    const a = cantilever(5, 0.5);
    const stiffer = cantilever(5, 0.5, 2 * E);
    expect(stiffer.frame.shareFactorisationOf(a.frame)).toBe(false);
    const held = cantilever(5, 0.5);
    held.frame.hold(1, 2);
    expect(held.frame.shareFactorisationOf(a.frame)).toBe(false);
    // and solves with its own: half the deflection at twice the modulus (Roark table 8.1 case 1a)
    const u = -stiffer.frame.solveStatic()!.displacement(stiffer.tip).translation.y;
    expect(u / ((5 * L ** 3) / (3 * 2 * E * s.secondMoment))).toBeCloseTo(1, 9);
  });
});
