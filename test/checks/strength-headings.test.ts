// Strength with a stage turned across: the knuckle arm's boom carries, at heading h, a bending
// moment P (L1 + L2 cos h) in its plane and a torque P L2 sin h at its root (statics), combined by
// von Mises. Expected values from the published formulas, not from the code's section table.
import { describe, expect, it } from "vitest";
import { checkStrength } from "../../server/src/checks/strength";
import { candidateHeadings } from "../../server/src/mechanics/headings";
import { combinedStress } from "../../server/src/mechanics/structure/combined-stress";
import { sectionProperties } from "../../server/src/model/section";
import { treeSweep } from "../structure/arm-fixture";
import { al, knuckleArm, L1, L2, P, rectBar, tube } from "../structure/knuckle-fixture";
import { figure, runFamily } from "./check-context";

const deg = Math.PI / 180;
const d = rectBar.depth;
const w = rectBar.width;

/** Roark 7th ed., table 10.7 case 4: tau_max = 3 T / (a b^2) [1 + 0.6095 r + 0.8865 r^2 -
 * 1.8023 r^3 + 0.9100 r^4], a >= b the sides, r = b / a. */
function rectTorsionStress(T: number, a: number, b: number): number {
  const r = b / a;
  return ((3 * T) / (a * b * b)) * (1 + 0.6095 * r + 0.8865 * r ** 2 - 1.8023 * r ** 3 + 0.91 * r ** 4);
}

describe("strength over a swivel's headings", () => {
  it("the boom's root: bending in its plane and torsion, by von Mises, at the worst heading searched", () => {
    const model = knuckleArm([-90 * deg, 90 * deg]);
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    // Shigley 10th ed., eq. 3-24 (sigma = M c / I, for a rectangle 6 M / (w d^2)) and eq. 5-15
    // (von Mises sqrt(sigma^2 + 3 tau^2))
    const vonMisesAt = (h: number) => {
      const sigma = (6 * P * (L1 + L2 * Math.cos(h))) / (w * d * d);
      const tau = rectTorsionStress(P * L2 * Math.abs(Math.sin(h)), d, w);
      return Math.sqrt(sigma ** 2 + 3 * tau ** 2);
    };
    const searched = [0, ...candidateHeadings(model.swivels![0]!)];
    const worst = Math.max(...searched.map(vonMisesAt));
    expect(worst).toBeGreaterThan(vonMisesAt(0));
    expect(Math.abs(figure(ctx, "boom", "largest stress")! - worst) / worst).toBeLessThan(1e-6);
    // Shigley 10th ed., section 5-5: safety against yield, Sy / sigma'
    expect(figure(ctx, "boom", "stress safety factor")).toBeCloseTo(al.strength / worst, 6);
  });

  it("a round tube: the two bending moments add as a vector (Roark, table of section properties)", () => {
    const sec = sectionProperties(tube);
    const D = tube.outerDiameter;
    const bore = D - 2 * tube.wall;
    const I = (Math.PI * (D ** 4 - bore ** 4)) / 64;
    const c = combinedStress(sec, true, { axial: 0, torque: 0, momentInPlane: 3, momentAcross: 4 });
    // sigma = M c / I with M = hypot(3, 4) = 5 N*m, c = D / 2
    expect(c.normal).toBeCloseTo((5 * (D / 2)) / I, 3);
    // tau = T r / J of a tube (Roark table 10.7 case 10), and the largest principal stress of a
    // pure shear is tau itself (Mohr's circle)
    const t = combinedStress(sec, true, { axial: 0, torque: 2, momentInPlane: 0, momentAcross: 0 });
    const J = (Math.PI * (D ** 4 - bore ** 4)) / 32;
    expect(t.shear).toBeCloseTo((2 * (D / 2)) / J, 3);
    expect(t.principal).toBeCloseTo(t.shear, 6);
  });

  it("an arm without swivels keeps the planar stress", () => {
    const model = knuckleArm();
    model.swivels = [];
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const sigma = (6 * P * (L1 + L2)) / (w * d * d);
    expect(Math.abs(figure(ctx, "boom", "largest stress")! - sigma) / sigma).toBeLessThan(1e-9);
  });
});

describe("a working force across the drawing plane", () => {
  // the knuckle arm without its swivel: a straight cantilever of the flat boom and the tube,
  // loaded at the tip by the payload's weight P down and F towards the reader
  const F = 4;
  function pushedSideways() {
    const model = knuckleArm();
    model.swivels = [];
    model.payloads[0]!.forceAcross = F;
    return model;
  }

  it("bends the boom sideways as well: the stresses of both bending axes add at a corner", () => {
    const model = pushedSideways();
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    // Shigley 10th ed., eq. 3-24: 6 M / (w d^2) in the plane and 6 M / (d w^2) across, both
    // moments the tip load times the reach L1 + L2 at the root
    const reach = L1 + L2;
    const sigma = (6 * P * reach) / (w * d * d) + (6 * F * reach) / (d * w * w);
    expect(Math.abs(figure(ctx, "boom", "largest stress")! - sigma) / sigma).toBeLessThan(1e-6);
  });

  it("moves the payload sideways: Roark's cantilever with the sideways second moments", async () => {
    const { checkStiffness } = await import("../../server/src/checks/stiffness");
    const model = pushedSideways();
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const E = al.modulus;
    const straight = (load: number, I1: number, I2: number) =>
      // Roark 8th ed., table 8.1 cases 1a and 3a superposed (as for the in-plane drop)
      (load * L1 ** 3) / (3 * E * I1) +
      (load * L2 * L1 ** 2) / (2 * E * I1) +
      ((load * L1 ** 2) / (2 * E * I1) + (load * L2 * L1) / (E * I1)) * L2 +
      (load * L2 ** 3) / (3 * E * I2);
    const s1 = sectionProperties(rectBar);
    const s2 = sectionProperties(tube);
    // rectangle: w d^3 / 12 in the plane, d w^3 / 12 across (Roark, table of section properties)
    const I1 = (w * d ** 3) / 12;
    const I1across = (d * w ** 3) / 12;
    expect(s1.secondMomentAcross).toBeCloseTo(I1across, 15);
    const down = straight(P, I1, s2.secondMoment);
    const sideways = straight(F, I1across, s2.secondMomentAcross);
    const total = Math.hypot(down, sideways);
    expect(Math.abs(figure(ctx, "tool", "deflection under load")! - total) / total).toBeLessThan(1e-9);
  });
});
