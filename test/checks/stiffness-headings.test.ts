// The stiffness check over a swivel's headings (docs/checks.md, Swivels): the knuckle arm's payload
// deflects most with the outer link turned across the boom (the L-frame of docs/formulas.md), and
// leans sideways by the boom's own bending slope, which at heading 0 is the in-plane tilt.
import { describe, expect, it } from "vitest";
import { checkStiffness } from "../../server/src/checks/stiffness";
import { sectionProperties } from "../../server/src/model/section";
import { treeSweep } from "../structure/arm-fixture";
import { al, knuckleArm, L1, L2, P, rectBar, tube } from "../structure/knuckle-fixture";
import { figure, runFamily } from "./check-context";
import { candidateHeadings, headingCombinations, headingSets } from "../../server/src/mechanics/headings";

const deg = Math.PI / 180;
const EI1 = al.modulus * sectionProperties(rectBar).secondMoment;
const GJ1 = al.shearModulus * sectionProperties(rectBar).torsionConstant;
const EI2 = al.modulus * sectionProperties(tube).secondMoment;

describe("stiffness over a swivel's headings", () => {
  it("deflection: the worse of the straight arm and the L-frame, with the heading named", () => {
    const model = knuckleArm([-90 * deg, 90 * deg]);
    model.require.deflection.default = 1e-5;
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    // docs/formulas.md, L-frame: P L1^3 / (3 E I1) + P L2^2 L1 / (G J1) + P L2^3 / (3 E I2)
    const lFrame = (P * L1 ** 3) / (3 * EI1) + (P * L2 ** 2 * L1) / GJ1 + (P * L2 ** 3) / (3 * EI2);
    // Roark 8th ed., table 8.1 cases 1a and 3a: the straight arm's tip drop
    const straight =
      (P * L1 ** 3) / (3 * EI1) +
      (P * L2 * L1 ** 2) / (2 * EI1) +
      ((P * L1 ** 2) / (2 * EI1) + (P * L2 * L1) / EI1) * L2 +
      (P * L2 ** 3) / (3 * EI2);
    const d = figure(ctx, "tool", "deflection under load")!;
    expect(Math.abs(d - Math.max(lFrame, straight)) / d).toBeLessThan(1e-9);
    const f = ctx.findings.find((x) => x.code === "stiffness.deflection")!;
    expect(f.message).toContain(lFrame > straight ? "knuckle turned" : "at the reference pose");
  });

  it("lean: the boom's end turn, seen about the turned outer link's axis, at the worst heading searched", () => {
    const model = knuckleArm([-90 * deg, 90 * deg]);
    // At heading h the tip load P at L2 puts on the boom's end a moment P L2 cos h in its plane and
    // a torque P L2 sin h about it. The boom's end turns (Roark 8th ed., table 8.1 cases 1a and
    // 3a, and table 10.1's twist T L / (G K)) by
    //   in its plane: P L1^2 / (2 E I1) + P L2 cos h L1 / (E I1), about its axis: P L2 sin h L1 / (G K1),
    // and the outer link, along (cos h, 0, -sin h), leans by that turn about its own axis; its own
    // bending turns it about the perpendicular only.
    const leanAt = (h: number) =>
      Math.abs(Math.sin(h)) *
      Math.abs((P * L1 ** 2) / (2 * EI1) + P * L1 * L2 * Math.cos(h) * (1 / EI1 - 1 / GJ1));
    const searched = [0, ...candidateHeadings(model.swivels![0]!)];
    const worst = Math.max(...searched.map(leanAt));
    // at 90 deg it is the boom's bending slope alone (Roark case 1a, W l^2 / (2 E I))
    expect(leanAt(Math.PI / 2)).toBeCloseTo((P * L1 ** 2) / (2 * EI1), 15);
    model.require.tilt.default = worst / 2;
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const lean = figure(ctx, "tool", "elastic lean (sideways, out of its stage's plane)")!;
    expect(Math.abs(lean - worst) / worst).toBeLessThan(1e-9);
    const f = ctx.findings.find((x) => x.code === "stiffness.lean")!;
    expect(f.message).toMatch(/knuckle turned (-)?\d+ deg/);
    expect(f.data.lean).toBeCloseTo(lean, 15);
  });

  it("an arm without swivels has no lean figure (the plane frame's result)", () => {
    const model = knuckleArm();
    model.swivels = [];
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    expect(figure(ctx, "tool", "elastic lean (sideways, out of its stage's plane)")).toBeUndefined();
    expect(figure(ctx, "tool", "deflection under load")).toBeGreaterThan(0);
  });
});

describe("the headings searched", () => {
  it("range ends and every 30 deg inside the range; all the way round, twelve", () => {
    const model = knuckleArm([-100 * deg, 45 * deg]);
    expect(candidateHeadings(model.swivels![0]!).map((h) => Math.round(h / deg))).toEqual([
      -100, 45, -90, -60, -30, 30,
    ]);
    const round = candidateHeadings(knuckleArm().swivels![0]!).map((h) => Math.round(h / deg));
    // -180 and 180 deg are one heading; 0 is the drawing plane, visited apart
    expect(round).toHaveLength(11);
    expect(new Set(round.map((h) => (h + 360) % 360)).size).toBe(11);
  });

  it("one swivel at a time grows as the sum, together as the product", () => {
    const model = knuckleArm([-90 * deg, 90 * deg]);
    const second = { ...model.swivels![0]!, id: "second" };
    model.swivels = [model.swivels![0]!, second];
    // -90 .. 90 deg: the ends and -60, -30, 30, 60 deg
    expect(headingSets(model)).toHaveLength(1 + 6 + 6);
    // together: 0 and the quarter turns and range ends, here -90 and 90 deg, for each
    expect(headingCombinations(model)).toHaveLength(3 * 3);
    // while typing, one at a time and quarter turns only
    expect(headingCombinations(model, true)).toHaveLength(1 + 2 + 2);
  });
});
