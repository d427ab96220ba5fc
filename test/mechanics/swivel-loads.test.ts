// The loads through a swivel: the wrench of what it carries about its point (statics, the moment
// of a force r x F: Meriam and Kraige, Engineering Mechanics: Statics, 7th ed., section 2/5),
// split along and across its axis, and the two radial bearings' couple M / D (docs/checks.md, Bearings).
import { describe, expect, it } from "vitest";
import { swivelLoads, swivelLoadsOverHeadings } from "../../server/src/mechanics/swivel-loads";
import { treeSweep, origin } from "../structure/arm-fixture";
import { knuckleArm, L1, L2, P } from "../structure/knuckle-fixture";
import { buildResults } from "../../server/src/checks/results";
import { checkSwivels } from "../../server/src/checks/swivels";
import { figure, runFamily } from "../checks/check-context";

const deg = Math.PI / 180;
const D = 0.05;

function turningKnuckleArm() {
  const model = knuckleArm([-180 * deg, 180 * deg]);
  model.swivels![0]!.bearings = { spacing: D };
  // the post turns on the bench too: the base's yaw, a swivel at the base's origin
  model.swivels!.unshift({ id: "post", parent: "post", point: { x: 0, y: 0 }, origin: origin("yaw") });
  return model;
}

describe("loads through a swivel", () => {
  const model = turningKnuckleArm();
  const pose = treeSweep(model, [{}]).poses[0]!;
  const mass = { tool: P / 9.80665 };

  it("the knuckle carries the tool's weight and its moment P L2 at every heading", () => {
    for (const h of [0, 90, 180, -45]) {
      const l = swivelLoads(model, pose, mass, { knuckle: h * deg })["knuckle"]!;
      // r x F of the tip load about the knuckle: lever L2, whichever way the outer link points
      expect(l.axial).toBeCloseTo(P, 10);
      expect(l.radial).toBeCloseTo(0, 10);
      expect(l.moment).toBeCloseTo(P * L2, 10);
      expect(l.twist).toBeCloseTo(0, 10);
      // the couple of two bearings D apart carries M: M / D each, plus half the radial force
      expect(l.bearingRadial).toBeCloseTo((P * L2) / D, 8);
    }
  });

  it("the base's yaw carries a moment that follows the knuckle's heading", () => {
    const at = (h: number) => swivelLoads(model, pose, mass, { knuckle: h * deg })["post"]!;
    // the tip's horizontal lever about the base's axis: L1 + L2 straight out, L1 - L2 folded
    // back, hypot(L1, L2) across
    expect(at(0).moment).toBeCloseTo(P * (L1 + L2), 10);
    expect(at(180).moment).toBeCloseTo(P * (L1 - L2), 10);
    expect(at(90).moment).toBeCloseTo(P * Math.hypot(L1, L2), 10);
    expect(at(90).axial).toBeCloseTo(P, 10);
    // the envelope over the headings searched is the straight-out arm's
    expect(swivelLoadsOverHeadings(model, pose, mass)["post"]!.moment).toBeCloseTo(P * (L1 + L2), 10);
  });

  it("the check shows them on the swivel and in the results record", () => {
    const ctx = runFamily(checkSwivels, model, treeSweep(model, [{}]));
    expect(figure(ctx, "knuckle", "tilting moment (carried as a couple by its bearings)")).toBeCloseTo(
      P * L2,
      10,
    );
    expect(figure(ctx, "knuckle", "load along its axis (thrust)")).toBeCloseTo(P, 10);
    const record = buildResults({ model, readouts: ctx.readouts });
    const knuckle = record.sections["swivels"]!["knuckle"]!;
    expect(knuckle["bearing_loads"]!.value).toBeCloseTo((P * L2) / D, 8);
    expect(knuckle["tilting_moment"]!.value).toBeCloseTo(P * L2, 10);
    expect(knuckle["thrust"]!.value).toBeCloseTo(P, 10);
  });

  it("a working force across the plane loads the knuckle across its axis and twists it", () => {
    const pushed = turningKnuckleArm();
    const F = 3;
    pushed.payloads[0]!.forceAcross = F;
    const l = swivelLoads(pushed, pose, mass, {})["knuckle"]!;
    // F towards the reader at the tip, L2 out along x from the axis: a radial load F and, r x F,
    // a moment F L2 about the vertical axis (what the swivel's friction must hold)
    expect(l.radial).toBeCloseTo(F, 10);
    expect(l.twist).toBeCloseTo(F * L2, 10);
    expect(l.moment).toBeCloseTo(P * L2, 10);
  });

  it("says whether the swivel's friction holds the moment about its axis", () => {
    const pushed = turningKnuckleArm();
    pushed.payloads[0]!.forceAcross = 3;
    const knuckle = pushed.swivels!.find((s) => s.id === "knuckle")!;
    // the moment about the axis is F L2 = 0.6 N*m (r x F above): a friction of 0.5 N*m does not hold it
    knuckle.friction = 0.5;
    let ctx = runFamily(checkSwivels, pushed, treeSweep(pushed, [{}]));
    expect(ctx.readouts["knuckle"]!.notes.join(" ")).toContain("turns by itself");
    knuckle.friction = 0.7;
    ctx = runFamily(checkSwivels, pushed, treeSweep(pushed, [{}]));
    expect(ctx.readouts["knuckle"]!.notes.join(" ")).toContain("holds the largest moment");
  });
});
