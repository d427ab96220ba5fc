// The top view of an arm that turns: a swivel's heading turns what it carries about the vertical
// through its axis (a rotation keeps each point's distance from the axis and turns its bearing by
// the heading), and the mechanics' placement of the space frame puts the payload at the same spot.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { renderTopViewSvg, topPoint } from "../../server/src/view/draw-top";
import { renderReportHtml } from "../../server/src/view/report-page";
import { Placement } from "../../server/src/mechanics/headings";
import { place } from "../../server/src/view/geometry";

const read = (name: string) => readFileSync(new URL(`../../samples/${name}`, import.meta.url), "utf8");

describe("top view", () => {
  const text = read("two-stage-arm.poise");
  const a = analyse(text);
  const vm = buildViewModel({ ...a, text });
  const pose = vm.poses[vm.referencePose]!;
  const tool = vm.payloads.find((p) => p.id === "tool")!;
  const barrel = vm.swivels!.find((s) => s.id === "barrel")!;

  it("lists the swivels deepest first, the base's yaw last", () => {
    expect(vm.swivels!.map((s) => s.id)).toEqual(["barrel", "clamp"]);
  });

  it("turns the payload about the barrel's axis by the heading", () => {
    const axis = place(pose, barrel.parent, barrel.local)!;
    const straight = topPoint(vm, pose, {}, tool.body, tool.local)!;
    expect(straight[1]).toBe(0);
    for (const deg of [30, 90, -120]) {
      const h = (deg * Math.PI) / 180;
      const turned = topPoint(vm, pose, { barrel: h }, tool.body, tool.local)!;
      const r0 = straight[0] - axis[0];
      // a turn about the vertical: same distance from the axis, bearing turned by h (counter-
      // clockwise from above, +x towards -z)
      expect(Math.hypot(turned[0] - axis[0], turned[1])).toBeCloseTo(Math.abs(r0), 12);
      expect(Math.atan2(-turned[1], turned[0] - axis[0])).toBeCloseTo(
        Math.atan2(Math.sin(h), Math.cos(h)),
        12,
      );
    }
  });

  it("agrees with the space frame's placement", () => {
    const sweepPose = a.sweep!.poses.find((p) => p === a.sweep!.reference) ?? a.sweep!.reference!;
    const nearest = a.sweep!.poses.reduce(
      (best, p) =>
        Math.abs((p.angles["first"] ?? 0) - pose.angles[0]!) +
          Math.abs((p.angles["second"] ?? 0) - pose.angles[1]!) <
        Math.abs((best.angles["first"] ?? 0) - pose.angles[0]!) +
          Math.abs((best.angles["second"] ?? 0) - pose.angles[1]!)
          ? p
          : best,
      sweepPose,
    );
    const h = Math.PI / 2;
    const m = new Placement(a.model!, nearest, { barrel: h }).point(tool.body, {
      x: tool.local[0],
      y: tool.local[1],
    });
    const v = topPoint(vm, pose, { barrel: h }, tool.body, tool.local)!;
    // the view model keeps positions to 0.1 mm
    expect(v[0]).toBeCloseTo(m.x, 4);
    expect(v[1]).toBeCloseTo(m.z, 4);
  });

  it("is in the report of an arm that turns between stages, not of one that only turns on its base", () => {
    expect(renderReportHtml(vm, { file: "two-stage-arm.poise" })).toContain("Seen from above");
    expect(renderTopViewSvg(vm, vm.referencePose, { barrel: 1 })).toContain("seen from above: barrel 57.3");
    const camera = read("camera-arm.poise");
    const cvm = buildViewModel({ ...analyse(camera), text: camera });
    expect(cvm.swivels).toBeUndefined();
    expect(renderReportHtml(cvm, { file: "camera-arm.poise" })).not.toContain("Seen from above");
  });
});
