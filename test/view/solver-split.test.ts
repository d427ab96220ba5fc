// The view's torque split by virtual work against the solver's own holding torque (Lagrange
// multipliers): two independent methods on the same hand-built model must agree.
import { describe, expect, it } from "vitest";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { A, B, G, L_ARM, M, PENDULUM_TEXT, pendulumModel } from "./pendulum-fixture";

describe("torque split on a solved sweep", () => {
  const rate = 550;
  const model = pendulumModel(rate);
  const sweep = solveSweep(model);
  const vm = buildViewModel({ text: PENDULUM_TEXT, model, sweep, findings: sweep.findings, readouts: {} });

  it("solves the range", () => {
    expect(vm.poses.length).toBeGreaterThan(10);
  });

  it("gravity + spring parts equal the solver's net holding torque", () => {
    for (const pose of vm.poses) {
      const theta = (pose.anglesDeg[0]! * Math.PI) / 180;
      // Streit and Gilmore 1989 (references.md): tau = (m g l - k a b) cos(theta).
      expect(pose.netTorque[0]!).toBeCloseTo((M * G * L_ARM - rate * A * B) * Math.cos(theta), 2);
      // mechanics.md section 3: the holding torque equals dV/dtheta of the total potential.
      expect(pose.gravityTorque[0]! + pose.springTorque[0]! + pose.loadTorque[0]!).toBeCloseTo(
        pose.netTorque[0]!,
        1,
      );
    }
  });
});
