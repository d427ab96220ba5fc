// The view model from a hand-built analysis: parts marked, slices and the envelope (the torque
// parts against the published closed form: torque-parts.test.ts).
import { describe, expect, it } from "vitest";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { nearestPose, thinPoses } from "../../server/src/view/pose-lines";
import type { Pose } from "../../server/src/mechanics/types";
import { readFileSync } from "node:fs";
import { analyse } from "../../server/src/analysis";
import { renderArmSvg } from "../../server/src/view/draw-arm";
import { A, B, L_ARM, PIVOT_Y, pendulumAnalysis } from "./pendulum-fixture";

const RATE = 550;
const vm = buildViewModel(pendulumAnalysis(RATE));
const rad = (deg: number) => (deg * Math.PI) / 180;

describe("view model", () => {
  it("marks the part a failing finding points at", () => {
    const shoulder = vm.parts.find((p) => p.id === "shoulder")!;
    expect(shoulder.status).toBe("error");
    expect(shoulder.codes).toContain("strength.overstress");
    const lift = vm.parts.find((p) => p.id === "lift")!;
    expect(lift.codes).toContain("balance.unbalanced");
    expect(vm.parts.find((p) => p.id === "lamp")!.status).toBe("ok");
  });

  it("gives each part the editor range of its name", () => {
    const lift = vm.parts.find((p) => p.id === "lift")!;
    const lines = pendulumAnalysis().text.split("\n");
    expect(lines[lift.range.start.line]!.slice(lift.range.start.character, lift.range.end.character)).toBe(
      "lift",
    );
  });

  it("places the payload path on a circle of radius l about the pivot", () => {
    const path = vm.envelope.lamp!.flat();
    expect(path.length).toBe(vm.poses.length);
    // Geometry of a rigid link: the end stays at distance l from the pivot.
    for (const [x, y] of path) expect(Math.hypot(x, y - PIVOT_Y)).toBeCloseTo(L_ARM, 5);
  });

  it("finds the nearest pose for a slider value", () => {
    const angles = vm.poses.map((p) => p.angles);
    const p = nearestPose(angles, [rad(31)], [rad(105)]);
    // 22 poses over -45..60 deg are 5 deg apart: 31 deg is nearest 30 deg.
    expect(vm.poses[p]!.angles[0]).toBeCloseTo(rad(30), 6);
    expect(vm.poses[vm.referencePose]!.angles[0]).toBeCloseTo(0, 6);
  });

  it("draws the reference pose at the written angles even when the sweep's steps miss them", () => {
    // The camera arm's shoulder is written at 10 deg; its sweep steps fall on 9.58 and 11.1 deg.
    const text = readFileSync("samples/camera-arm.poise", "utf8");
    const camera = buildViewModel(analyse(text));
    const written = Number(/angle\s+(-?[\d.]+)\s*deg/.exec(text)![1]);
    expect(camera.dofs[0]!.reference).toBeCloseTo(rad(written), 12);
    expect(camera.poses.some((p) => Math.abs(p.angles[0]! - rad(written)) < 1e-9)).toBe(false);
    expect(camera.reference!.angles[0]).toBeCloseTo(rad(written), 9);
    const caption = /class="pose-caption"[^>]*>([^<]*)</.exec(renderArmSvg(camera, "reference"))![1];
    expect(caption).toBe(`${camera.dofs[0]!.id} ${written.toFixed(1)}°`);
  });

  it("lists safety factors lowest first with the requirement", () => {
    expect(vm.safety.map((r) => r.id)).toEqual(["shoulder", "boom"]);
    expect(vm.safety[0]!.required).toBe(2);
  });

  it("draws the section depth and brackets to off-line hooks", () => {
    const boom = vm.bodies.find((b) => b.id === "boom")!;
    expect(boom.depth).toBe(0.02);
    expect(boom.line).toEqual([
      [0, 0],
      [L_ARM, 0],
    ]);
    const post = vm.bodies.find((b) => b.id === "post")!;
    // The post stands from the bench to the anchor, 350 mm.
    expect(post.line).toEqual([
      [0, 0],
      [0, PIVOT_Y + A],
    ]);
    expect(B).toBeGreaterThan(0);
  });

  it("says why nothing is drawn when there is no model", () => {
    const empty = buildViewModel({ text: "arm {", findings: [], readouts: {} });
    expect(empty.emptyReason).toBeDefined();
    expect(empty.poses).toHaveLength(0);
  });
});

describe("thinning a dense grid for the panel", () => {
  const grid: Pose[] = [];
  for (let i = 0; i < 141; i++)
    for (let j = 0; j < 141; j++) {
      grid.push({
        index: grid.length,
        angles: { a: -1 + (2 * i) / 140, b: (0.5 * j) / 140 },
        jointAngles: {},
        bodies: {},
        springs: {},
        cases: [],
      });
    }
  const thin = thinPoses(grid, ["a", "b"], 2500);

  it("keeps a whole sub-grid under the limit with both ends of every range", () => {
    expect(thin.length).toBeLessThanOrEqual(2500);
    const as = new Set(thin.map((p) => p.angles.a));
    const bs = new Set(thin.map((p) => p.angles.b));
    expect(as.size * bs.size).toBe(thin.length);
    for (const v of [-1, 1]) expect(as.has(v)).toBe(true);
    for (const v of [0, 0.5]) expect(bs.has(v)).toBe(true);
  });

  it("leaves a small sweep alone", () => {
    expect(thinPoses(grid.slice(0, 100), ["a", "b"], 2500)).toHaveLength(100);
  });
});
