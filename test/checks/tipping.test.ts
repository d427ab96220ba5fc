// Tipping by the moment balance about the footprint's edge (docs/formulas.md worked example:
// Meriam and Kraige, Statics, ch. 3), and the base's bearing loads.
import { describe, expect, it } from "vitest";
import { checkTipping } from "../../server/src/checks/tipping";
import { armModel, baseBody, G, joint, linkBody, payload, treeSweep } from "../structure/arm-fixture";
import { figure, runFamily } from "./check-context";

/** Base 6 kg, footprint 0.2 m wide (edge 0.10 m from its centre of gravity); an arm of 1.5 kg
 * with its centre at x = 0.30 m; a payload at x = 0.60 m. */
function worked(payloadKg: number, yaw = false, depth = 0.3) {
  const base = baseBody("stand", { top: { x: 0, y: 0.2 } });
  const arm = {
    ...linkBody("arm", 0.6, { shape: "rod", diameter: 0.01 }, "aluminium_6061_t6"),
    mass: 1.5,
    massGiven: true,
  };
  const model = armModel({
    bodies: [base, arm],
    joints: [joint("shoulder", "stand", { x: 0, y: 0.2 }, "arm", 0, "fixed")],
    payloads: [payload("lamp", "arm", { x: 0.6, y: 0 }, payloadKg)],
    base: { bodyId: "stand", mass: 6, footprint: { width: 0.2, depth }, yaw, surface: 0 },
  });
  return model;
}

describe("tipping", () => {
  it("worked example: it tips", () => {
    const model = worked(1);
    const ctx = runFamily(checkTipping, model, treeSweep(model, [{}]));
    // moment balance about the edge at x = 0.10 m: restoring W e = 6 g 0.10 = 5.884 N m;
    // overturning 1.5 g (0.30 - 0.10) + 1.0 g (0.60 - 0.10) = 7.845 N m
    const restoring = 6 * G * 0.1;
    const overturning = 1.5 * G * 0.2 + 1 * G * 0.5;
    expect(restoring).toBeCloseTo(5.884, 3);
    expect(overturning).toBeCloseTo(7.845, 3);
    expect(figure(ctx, "stand", "tipping safety factor")).toBeCloseTo(restoring / overturning, 12);
    const f = ctx.findings.find((x) => x.code === "geometry.tipping")!;
    expect(f.message).toContain("7.845 N*m");
    expect(f.message).toContain("5.884 N*m");
  });

  it("worked example: the largest payload, 0.600 kg, is just at the edge of tipping", () => {
    // (W e - m_arm g 0.20) / (g 0.50) = 0.600 kg
    const largest = (6 * 0.1 - 1.5 * 0.2) / 0.5;
    expect(largest).toBeCloseTo(0.6, 12);
    const ctx = runFamily(checkTipping, worked(largest), treeSweep(worked(largest), [{}]));
    expect(figure(ctx, "stand", "tipping safety factor")).toBeCloseTo(1, 9);
  });

  it("with yaw the nearer edge of the footprint governs", () => {
    // footprint 0.30 wide x 0.20 deep: turned across the depth the edge is 0.10 m away
    const model = worked(1, true, 0.2);
    model.base!.footprint = { width: 0.3, depth: 0.2 };
    const ctx = runFamily(checkTipping, model, treeSweep(model, [{}]));
    expect(figure(ctx, "stand", "tipping safety factor")).toBeCloseTo(
      (6 * G * 0.1) / (1.5 * G * 0.2 + 1 * G * 0.5),
      12,
    );
  });

  it("bearing loads: vertical thrust and overturning moment at the base", () => {
    const model = worked(1);
    const ctx = runFamily(checkTipping, model, treeSweep(model, [{}]));
    // statics: thrust = total weight of arm and payload; moment about the base's centre
    expect(figure(ctx, "stand", "vertical thrust on the base")).toBeCloseTo(2.5 * G, 9);
    expect(figure(ctx, "stand", "overturning moment at the base")).toBeCloseTo(
      1.5 * G * 0.3 + 1 * G * 0.6,
      9,
    );
  });
});
