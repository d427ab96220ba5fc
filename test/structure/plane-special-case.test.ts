// The plane frame is the space frame's special case: for an arm that does not turn, loaded in its
// own plane, the space frame's results equal those of the same frame with every node held out of
// the plane (the planar model), on every sample at its representative poses. Mechanics behind it:
// a plane frame whose sections are symmetric about the plane and whose pins are normal to it
// splits into in-plane and out-of-plane problems (McGuire, Gallagher and Ziemian, 2nd ed., 4.4,
// the grid as the out-of-plane half of a plane frame), so in-plane loads move nothing out of the
// plane, and the in-plane modes are among the space frame's modes.
import { readFileSync, readdirSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { buildArmFrame } from "../../server/src/mechanics/structure/arm-frame";
import { representativePoses } from "../../server/src/checks/stiffness";
import { payloadMasses } from "../../server/src/checks/part-words";

const SAMPLES = new URL("../../samples/", import.meta.url);
const samples = readdirSync(SAMPLES).filter((f) => f.endsWith(".poise"));
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), 1e-300);

describe("the planar model is the space frame with every heading zero", () => {
  it.each(samples)("%s", (name) => {
    const a = analyse(readFileSync(new URL(name, SAMPLES), "utf8"));
    if (!a.model || !a.sweep || a.sweep.poses.length === 0) {
      // only the sample of commented mistakes has nothing to solve
      expect(name).toBe("mistakes.poise");
      return;
    }
    const { model, sweep } = a;
    let compared = 0;
    for (const pose of representativePoses(sweep)) {
      const masses = payloadMasses(model, sweep, 0);
      const space = buildArmFrame(model, pose, pose.cases[0], masses);
      const plane = buildArmFrame(model, pose, pose.cases[0], masses, { planar: true });
      const s = space.frame.solveStatic();
      const p = plane.frame.solveStatic();
      expect(!!s).toBe(!!p);
      if (!s || !p) continue;
      let scale = 0;
      for (let n = 0; n < space.frame.nodeCount; n++) {
        const u = p.displacement(n).translation;
        scale = Math.max(scale, Math.hypot(u.x, u.y));
      }
      for (let n = 0; n < space.frame.nodeCount; n++) {
        const us = s.displacement(n);
        const up = p.displacement(n);
        // in-plane movement equal, nothing out of the plane (decoupling, above)
        expect(Math.abs(us.translation.x - up.translation.x)).toBeLessThan(1e-9 * scale);
        expect(Math.abs(us.translation.y - up.translation.y)).toBeLessThan(1e-9 * scale);
        expect(Math.abs(us.translation.z)).toBeLessThan(1e-9 * scale);
        expect(rel(us.rotation.z, up.rotation.z)).toBeLessThan(1e-6);
      }
      // the planar lowest mode is one of the space frame's modes, and none of them is higher
      const planar = plane.frame.naturalFrequencies(1)![0]!;
      const modes = space.frame.naturalFrequencies(8)!;
      expect(modes[0]!).toBeLessThanOrEqual(planar * (1 + 1e-9));
      expect(modes.some((w2) => rel(w2, planar) < 1e-7)).toBe(true);
      compared++;
    }
    expect(compared).toBeGreaterThan(0);
  });
});
