// Every sample spec analyses end to end through analyse(), and the solved poses keep the
// properties their linkages must have.
import { describe, expect, it } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";

const dir = join(__dirname, "..", "..", "samples");
const samples = readdirSync(dir).filter((f) => f.endsWith(".poise"));

describe("samples through the mechanics", () => {
  for (const file of samples) {
    it(`${file} analyses without an internal fault`, () => {
      const a = analyse(readFileSync(join(dir, file), "utf8"), { stepsOverride: 9 });
      expect(a.findings.filter((f) => f.code === "analysis.internal")).toEqual([]);
      if (file === "mistakes.poise") return;
      expect(a.sweep, file).toBeDefined();
      expect(a.sweep!.poses.length).toBeGreaterThan(0);
      expect(
        a.findings.filter((f) => f.code === "geometry.loop-open" || f.code === "geometry.cannot-reach"),
      ).toEqual([]);
      for (const pose of a.sweep!.poses)
        for (const c of pose.cases)
          for (const v of Object.values(c.holdingTorque)) expect(Number.isFinite(v)).toBe(true);
    });
  }

  it("keeps the camera arm's head level over its range (equal bars)", () => {
    const a = analyse(readFileSync(join(dir, "camera-arm.poise"), "utf8"));
    // Agrawal and Fattah 2004: a parallelogram's head translates without rotating
    for (const pose of a.sweep!.poses) expect(Math.abs(pose.bodies["reach.head"]!.phi)).toBeLessThan(1e-9);
  });
});
