// The view's torque plot parts, read from the solver's statics on the hand-built pendulum model,
// against the published closed form of its statics.
import { describe, expect, it } from "vitest";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { A, B, G, L_ARM, M, PENDULUM_TEXT, pendulumModel } from "./pendulum-fixture";

describe("torque parts on a solved sweep", () => {
  const rate = 550;
  const model = pendulumModel(rate);
  const sweep = solveSweep(model);
  const vm = buildViewModel({ text: PENDULUM_TEXT, model, sweep, findings: sweep.findings, readouts: {} });

  it("solves the range", () => {
    expect(vm.poses.length).toBeGreaterThan(10);
  });

  it("gravity part is m g l cos(theta), spring part -k a b cos(theta), and they make the net torque", () => {
    for (const pose of vm.poses) {
      const theta = pose.angles[0]!;
      // Streit and Gilmore 1989, "Perfect spring equilibrators for rotatable bodies": the payload's share of the
      // holding torque of a pivoting link is m g l cos(theta) ...
      expect(pose.gravityTorque[0]!).toBeCloseTo(M * G * L_ARM * Math.cos(theta), 3);
      // ... a zero-free-length spring from a point a above the pivot to b along the link adds
      // -k a b cos(theta) ...
      expect(pose.springTorque[0]!).toBeCloseTo(-rate * A * B * Math.cos(theta), 3);
      expect(pose.loadTorque[0]!).toBe(0);
      // ... and tau = (m g l - k a b) cos(theta) is their sum.
      expect(pose.netTorque[0]!).toBeCloseTo((M * G * L_ARM - rate * A * B) * Math.cos(theta), 3);
      expect(pose.gravityTorque[0]! + pose.springTorque[0]! + pose.loadTorque[0]!).toBeCloseTo(
        pose.netTorque[0]!,
        3,
      );
    }
  });
});
