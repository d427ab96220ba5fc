// Tipping with a swivel above the base: the knuckle arm's outer link turned across the footprint
// tips the base over its depth edge. Statics (Meriam and Kraige, Engineering Mechanics: Statics,
// 7th ed., ch. 3): overturning moment of the tip load about the edge against the base's W e.
import { describe, expect, it } from "vitest";
import { checkTipping } from "../../server/src/checks/tipping";
import { treeSweep } from "../structure/arm-fixture";
import { knuckleArm, L1, L2, P } from "../structure/knuckle-fixture";
import { figure, runFamily } from "./check-context";

const deg = Math.PI / 180;
const baseMass = 2;
const width = 0.3;
const depth = 0.1;

function armOnFootprint(yaw: boolean) {
  const model = knuckleArm([-90 * deg, 90 * deg]);
  model.base = { bodyId: "post", mass: baseMass, yaw, surface: 0, footprint: { width, depth } };
  return model;
}

describe("tipping over every heading", () => {
  it("a base that does not turn tips over its depth edge once the outer link swings across", () => {
    const model = armOnFootprint(false);
    const ctx = runFamily(checkTipping, model, treeSweep(model, [{}]));
    const g = model.gravity;
    // straight out: the tip's lever beyond the width edge is L1 + L2 - width / 2
    const along = (baseMass * g * (width / 2)) / (P * (L1 + L2 - width / 2));
    // turned 90 deg: beyond the depth edge by L2 - depth / 2 (the x lever L1 is within the width)
    const across = (baseMass * g * (depth / 2)) / (P * (L2 - depth / 2));
    expect(across).toBeLessThan(along);
    expect(figure(ctx, "post", "tipping safety factor")).toBeCloseTo(across, 10);
    const f = ctx.findings.find((x) => x.code === "geometry.tipping")!;
    expect(f.message).toMatch(/over the footprint's depth, knuckle turned (-)?90 deg/);
  });

  it("a base that turns: the arm straight out is the worst, as in the drawing plane", () => {
    const model = armOnFootprint(true);
    const ctx = runFamily(checkTipping, model, treeSweep(model, [{}]));
    const g = model.gravity;
    // the nearest edge (depth / 2) with the arm's full reach L1 + L2 facing it
    const expected = (baseMass * g * (depth / 2)) / (P * (L1 + L2 - depth / 2));
    expect(figure(ctx, "post", "tipping safety factor")).toBeCloseTo(expected, 10);
    // the overturning moment at the base's origin: the tip load at full reach
    expect(figure(ctx, "post", "overturning moment at the base")).toBeCloseTo(P * (L1 + L2), 10);
  });
});
