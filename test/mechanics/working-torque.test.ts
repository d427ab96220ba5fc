// A payload's working torque `torque (Tx, Ty, Tz)`: Tz is a couple in the drawing plane that the
// plane's statics take (moment equilibrium about the held pivot: a couple adds itself to the
// holding torque whatever its lever; Meriam and Kraige, Engineering Mechanics: Statics, 7th ed.,
// section 2/5); Tx twists the arm about its length, which the space frame turns into lean
// (Roark 8th ed., table 10.1: theta = T L / (G K)), and the swivels' loads carry it.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { checkStiffness } from "../../server/src/checks/stiffness";
import { checkStrength } from "../../server/src/checks/strength";
import { swivelLoads } from "../../server/src/mechanics/swivel-loads";
import { sectionProperties } from "../../server/src/model/section";
import { treeSweep } from "../structure/arm-fixture";
import { al, knuckleArm, L1, L2, P, rectBar, tube } from "../structure/knuckle-fixture";
import { figure, runFamily } from "../checks/check-context";

const spec = (torque: string) => `arm "Working torque" {
  base bench {
    point top (0 mm, 300 mm)
  }
  link boom {
    length 300 mm
    section rect 20 mm x 8 mm
    material aluminium_6061_t6
  }
  joint shoulder {
    connects bench.top to boom.start
    range -20 deg .. 40 deg
  }
  payload tool {
    mass 200 g
    at boom.end
    ${torque}
  }
}`;

describe("a working torque", () => {
  it("Tz: the holding torque at the shoulder changes by -Tz at every pose, as its load part", () => {
    const Tz = 0.7;
    const plain = analyse(spec(""));
    const turned = analyse(spec(`torque (0 N*m, 0 N*m, ${Tz} N*m)`));
    expect(turned.findings.filter((f) => f.severity === "error")).toEqual([]);
    const a = plain.sweep!.poses;
    const b = turned.sweep!.poses;
    expect(b.length).toBe(a.length);
    for (let i = 0; i < a.length; i++) {
      const h0 = a[i]!.cases[0]!.holdingTorque["shoulder"]!;
      const h1 = b[i]!.cases[0]!.holdingTorque["shoulder"]!;
      // the hand holds the couple back: -Tz more, all of it in the steady loads' part
      expect(h1 - h0).toBeCloseTo(-Tz, 9);
      expect(b[i]!.cases[0]!.loadTorque!["shoulder"]).toBeCloseTo(-Tz, 9);
    }
  });

  it("a torque in force units is reported at each component, with the dimension expected", () => {
    const bad = analyse(spec("torque (1 N, 2 N, 3 N)"));
    const wrong = bad.findings.filter((f) => f.code === "unit.wrong-dimension");
    expect(wrong).toHaveLength(3);
    expect(wrong[0]!.message).toBe("torque expects a torque, got a force: 1 N");
  });

  it("Tx on the knuckle arm twists the boom and the outer link: the tool leans by Tx (L1/GK1 + L2/GK2)", () => {
    const Tx = 0.5;
    const model = knuckleArm();
    model.swivels = [];
    model.payloads[0]!.torque = { x: Tx, y: 0, z: 0 };
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const G = al.shearModulus;
    const lean =
      Tx *
      (L1 / (G * sectionProperties(rectBar).torsionConstant) +
        L2 / (G * sectionProperties(tube).torsionConstant));
    const shown = figure(ctx, "tool", "elastic lean (sideways, out of its stage's plane)")!;
    expect(Math.abs(shown - lean) / lean).toBeLessThan(1e-9);
    // and the boom carries it as torsion: von Mises of its bending and Roark's rectangle torsion
    const strength = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const d = rectBar.depth;
    const w = rectBar.width;
    const r = w / d;
    const tau =
      ((3 * Tx) / (d * w * w)) * (1 + 0.6095 * r + 0.8865 * r ** 2 - 1.8023 * r ** 3 + 0.91 * r ** 4);
    const sigma = (6 * P * (L1 + L2)) / (w * d * d);
    const vm = Math.sqrt(sigma ** 2 + 3 * tau ** 2);
    expect(Math.abs(figure(strength, "boom", "largest stress")! - vm) / vm).toBeLessThan(1e-6);
  });

  it("Ty, about the vertical, is what the knuckle's friction must hold", () => {
    const model = knuckleArm([-Math.PI, Math.PI]);
    model.payloads[0]!.torque = { x: 0, y: 0.3, z: 0 };
    const pose = treeSweep(model, [{}]).poses[0]!;
    const l = swivelLoads(model, pose, { tool: P / 9.80665 }, { knuckle: 1 })["knuckle"]!;
    expect(l.twist).toBeCloseTo(0.3, 12);
    expect(l.moment).toBeCloseTo(P * L2, 10);
  });
});
