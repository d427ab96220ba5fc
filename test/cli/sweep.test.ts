// `poise sweep` as cli.md fixes it: the pose table in JSON (default) or CSV, in fixed units
// (angles deg, lengths mm, forces N, torques N*m), parallelogram bodies as `reach.lower` etc.
import { beforeAll, describe, expect, it } from "vitest";
import { ensureBuilt, poise } from "./run-cli";

beforeAll(() => ensureBuilt());

interface SweepJson {
  dofs: string[];
  poses: {
    angles: Record<string, number>;
    bodies: Record<string, { x: number; y: number; angle: number }>;
    holding_torque: Record<string, number>;
    hand_force: Record<string, number>;
    reactions: Record<string, [number, number]>;
    springs: Record<string, { length: number; force: number }>;
  }[];
}

describe("poise sweep", () => {
  it("gives the camera arm's poses in cli.md's JSON shape and units", () => {
    const r = poise("sweep", "samples/camera-arm.poise");
    const table = JSON.parse(r.stdout) as SweepJson;
    expect(table.dofs).toEqual(["reach"]);
    // The sample asks for `steps 37` over its one degree of freedom.
    expect(table.poses).toHaveLength(37);
    const first = table.poses[0]!;
    const last = table.poses[table.poses.length - 1]!;
    // `range -30 deg .. 45 deg`, both ends included, in degrees.
    expect(first.angles.reach).toBeCloseTo(-30, 6);
    expect(last.angles.reach).toBeCloseTo(45, 6);
    expect(Object.keys(first.bodies)).toEqual(expect.arrayContaining(["bench_clamp", "reach.lower", "reach.upper", "reach.head"]));
    // The lower bar starts at the pivot `(0 mm, 300 mm)` of the base, in mm; its angle is the
    // stage's angle, in degrees.
    expect(first.bodies["reach.lower"]!.x).toBeCloseTo(0, 3);
    expect(first.bodies["reach.lower"]!.y).toBeCloseTo(300, 3);
    expect(first.bodies["reach.lower"]!.angle).toBeCloseTo(-30, 3);
    // The head of a parallelogram keeps the root's orientation (language.md).
    for (const p of table.poses) expect(p.bodies["reach.head"]!.angle).toBeCloseTo(0, 3);
    expect(Object.keys(first.holding_torque)).toEqual(["reach"]);
    expect(Object.keys(first.hand_force)).toEqual(["camera"]);
    expect(first.reactions.reach).toHaveLength(2);
    expect(Object.keys(first.springs)).toEqual(["lift"]);
    expect(first.springs.lift!.length).toBeGreaterThan(0);
    expect([0, 1]).toContain(r.status);
  });

  it("spring lengths are hook-to-hook distances in mm", () => {
    const table = JSON.parse(poise("sweep", "samples/camera-arm.poise", "--json").stdout) as SweepJson;
    for (const p of table.poses) {
      // Hooks: bench_clamp.anchor (0, 390) mm in world, and 100 mm along the lower bar from the
      // pivot (0, 300) mm: the distance by the law of cosines at the pivot.
      const a = (p.angles.reach! * Math.PI) / 180;
      const hook = { x: 100 * Math.cos(a), y: 300 + 100 * Math.sin(a) };
      expect(p.springs.lift!.length).toBeCloseTo(Math.hypot(hook.x - 0, hook.y - 390), 2);
    }
  });

  it("gives the same table as CSV, one column per JSON path", () => {
    const json = JSON.parse(poise("sweep", "samples/camera-arm.poise").stdout) as SweepJson;
    const csv = poise("sweep", "samples/camera-arm.poise", "--csv").stdout.trimEnd().split("\n");
    const header = csv[0]!.split(",");
    expect(header).toEqual(expect.arrayContaining(["angles/reach", "bodies/reach.lower/x", "bodies/reach.head/angle", "holding_torque/reach", "hand_force/camera", "reactions/reach/x", "reactions/reach/y", "springs/lift/length", "springs/lift/force"]));
    expect(csv).toHaveLength(json.poses.length + 1);
    const row = csv[1]!.split(",");
    expect(Number(row[header.indexOf("angles/reach")])).toBe(json.poses[0]!.angles.reach);
    expect(Number(row[header.indexOf("springs/lift/length")])).toBe(json.poses[0]!.springs.lift!.length);
  });

  it("names a two-stage arm's dofs after its parallelograms", () => {
    const table = JSON.parse(poise("sweep", "samples/engraver-arm.poise").stdout) as SweepJson;
    expect(table.dofs).toEqual(expect.arrayContaining(["inner", "outer"]));
    expect(Object.keys(table.poses[0]!.bodies)).toEqual(expect.arrayContaining(["inner.lower", "outer.head"]));
  });

  it("exits 2 on bad arguments and unreadable files", () => {
    expect(poise("sweep").status).toBe(2);
    expect(poise("sweep", "samples/camera-arm.poise", "--xml").status).toBe(2);
    expect(poise("sweep", "samples/nothing.poise").status).toBe(2);
    expect(poise("sweep", "samples/camera-arm.poise", "samples/engraver-arm.poise").status).toBe(2);
  });
});
