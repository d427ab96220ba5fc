// The drawing's hand-force plot, signed and with the force friction does not hold (issue 14): on
// the pivoting link of test/checks/hand-force-friction.test.ts, the solid curve is the hand force
// beyond friction with its sign (+ the arm sinks) and the dashed one the force without friction,
// both against the closed form of docs/formulas.md (gravity balancing, Herder 2001) with Coulomb
// friction (common statics); the allowed band lies either side of zero.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { handForcePlot } from "../../server/src/view/plots";
import { friction, signedHandForce as beyondFriction, spec } from "../checks/pivot-with-friction";

describe("the hand-force plot", () => {
  const vm = buildViewModel(analyse(spec));
  const plot = handForcePlot(vm, 0, vm.referencePose);
  const rad = (deg: number) => (deg * Math.PI) / 180;

  it("plots the signed hand force beyond friction and, dashed, the force without it", () => {
    const solid = plot.series.find((s) => s.name === "lamp")!;
    const free = plot.series.find((s) => s.name === "lamp without friction")!;
    expect(free.dashed).toBe(true);
    expect(solid.points.length).toBeGreaterThan(10);
    for (const [deg, force] of solid.points) expect(force).toBeCloseTo(beyondFriction(rad(deg), friction), 3);
    for (const [deg, force] of free.points) expect(force).toBeCloseTo(beyondFriction(rad(deg), 0), 3);
    // Both signs occur: it sinks low in the range and rises high.
    expect(solid.points.some(([, f]) => f > 0.01) && solid.points.some(([, f]) => f < -0.01)).toBe(true);
  });

  it("draws the allowed hand force either side of zero", () => {
    expect(plot.band).toMatchObject({ from: -5, to: 5 });
  });
});
