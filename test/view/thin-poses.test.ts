// Thinning the poses of a grid of many degrees of freedom for the panel and the report (issue 16,
// 5 and 8): a grid of two values per degree of freedom cannot be thinned by taking every k-th
// value (both ends are always kept), so the last degrees of freedom are held at their reference.
import { describe, expect, it } from "vitest";
import type { Pose } from "../../server/src/mechanics/types";
import { thinPoses } from "../../server/src/view/pose-lines";
import { MAX_ENVELOPE_PATHS } from "../../server/src/view/envelope";
import { place } from "../../server/src/view/geometry";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { analyse } from "../../server/src/analysis";
import { linkChainSpec } from "../fuzz/shapes";

function grid(dofs: number, values: number[]): { poses: Pose[]; ids: string[] } {
  const ids = Array.from({ length: dofs }, (_, d) => `d${d}`);
  const poses: Pose[] = [];
  const count = values.length ** dofs;
  for (let i = 0; i < count; i++) {
    const angles: Record<string, number> = {};
    let rest = i;
    for (let d = dofs - 1; d >= 0; d--) {
      angles[ids[d]!] = values[rest % values.length]!;
      rest = Math.floor(rest / values.length);
    }
    poses.push({ index: i, angles, jointAngles: {}, bodies: {}, springs: {}, cases: [] });
  }
  return { poses, ids };
}

describe("thinning a grid of two values per degree of freedom", () => {
  const { poses, ids } = grid(12, [-0.1, 0.1]);
  const reference = ids.map(() => 0.1);
  const thin = thinPoses(poses, ids, 2500, reference);

  it("keeps under the limit a whole sub-grid: the first dofs at both ends, the last at their reference", () => {
    expect(thin.length).toBeLessThanOrEqual(2500);
    // 2^11 = 2048 fits, 2^12 = 4096 does not: one degree of freedom is held.
    expect(thin).toHaveLength(2048);
    expect(new Set(thin.map((p) => p.angles.d11))).toEqual(new Set([0.1]));
    for (const id of ids.slice(0, 11))
      expect(new Set(thin.map((p) => p.angles[id]))).toEqual(new Set([-0.1, 0.1]));
  });

  it("still thins a dense grid by every k-th value first", () => {
    const dense = grid(
      3,
      Array.from({ length: 21 }, (_, i) => i / 20),
    );
    const t = thinPoses(dense.poses, dense.ids, 1000, [0, 0, 0]);
    expect(t.length).toBeLessThanOrEqual(1000);
    const values = new Set(t.map((p) => p.angles.d0));
    expect(values.has(0) && values.has(1)).toBe(true);
    expect(values.size).toBeGreaterThan(2);
  });
});

describe("the payload's paths", () => {
  it("are at most MAX_ENVELOPE_PATHS per payload on a 12-dof grid, and reach as far as all of them", () => {
    const analysis = analyse(linkChainSpec(12, 12), { budgetMs: 60_000 });
    const vm = buildViewModel(analysis);
    const paths = vm.envelope["tool"]!;
    expect(paths.length).toBeLessThanOrEqual(MAX_ENVELOPE_PATHS);
    // the payload's farthest point to the right over every pose shown lies on a path kept
    const payload = vm.payloads[0]!;
    const everywhere = vm.poses.map((p) => place(p, payload.body, payload.local)![0]);
    expect(Math.max(...paths.flat().map(([x]) => x))).toBe(Math.max(...everywhere));
  }, 120_000);
});
